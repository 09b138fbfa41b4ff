import type { JSONContent } from '@tiptap/core';
import { describe, expect, it } from 'vitest';
import { plainTextOf, scriptStats } from './plain-text';
import { emptyScriptDoc, type BlockNode, type InlineNode, type ScriptDoc } from './schemas';

const text = (t: string): InlineNode => ({ type: 'text', text: t });
const p = (...content: InlineNode[]): BlockNode => (content.length ? { type: 'paragraph', content } : { type: 'paragraph' });
const doc = (...content: BlockNode[]): ScriptDoc => ({ type: 'doc', content });
const br: InlineNode = { type: 'hardBreak' };

describe('plainTextOf', () => {
  it('is empty for the empty doc', () => {
    expect(plainTextOf(emptyScriptDoc)).toBe('');
    expect(scriptStats(emptyScriptDoc)).toEqual({ text: '', wordCount: 0 });
  });

  it('puts each block on its own line and keeps empty paragraphs as empty lines', () => {
    expect(plainTextOf(doc(p(text('One.')), p(), p(text('Two.'))))).toBe('One.\n\nTwo.');
  });

  it('joins marked runs and turns hard breaks into newlines', () => {
    const marked: InlineNode = { type: 'text', text: 'half', marks: [{ type: 'bold' }] };
    expect(plainTextOf(doc(p(marked, text('-lap'), br, text('joint'))))).toBe('half-lap\njoint');
  });

  it('gives each list item its own line, nested ones too, without numbers or bullets', () => {
    const value = doc(
      { type: 'heading', attrs: { level: 2 }, content: [text('Tools')] },
      {
        type: 'orderedList',
        attrs: { start: 3, type: null },
        content: [
          { type: 'listItem', content: [p(text('Saw')), { type: 'bulletList', content: [{ type: 'listItem', content: [p(text('Ryoba'))] }] }] },
          { type: 'listItem', content: [p(text('Chisel'))] },
        ],
      },
    );
    expect(plainTextOf(value)).toBe('Tools\nSaw\nRyoba\nChisel');
  });

  it('reads through blockquotes and adds nothing for a horizontal rule', () => {
    const value = doc(p(text('Before')), { type: 'horizontalRule' }, { type: 'blockquote', content: [p(text('Quoted')), p(text('twice'))] }, { type: 'horizontalRule' });
    expect(plainTextOf(value)).toBe('Before\nQuoted\ntwice');
  });

  it("counts the editor's JSONContent as well", () => {
    const json: JSONContent = { type: 'doc', content: [{ type: 'paragraph', attrs: {}, content: [{ type: 'text', text: 'hi' }] }] };
    expect(plainTextOf(json)).toBe('hi');
  });
});

describe('scriptStats', () => {
  it('counts the words of a worked example', () => {
    const value = doc(
      { type: 'heading', attrs: { level: 2 }, content: [text('Cold open')] },
      p(text("Today we don't glue: it's a half-lap on 2x4 stock."), br, text('— ready?')),
      { type: 'bulletList', content: [{ type: 'listItem', content: [p(text('Mark'))] }, { type: 'listItem', content: [p(text('Cut & pare'))] }] },
      { type: 'horizontalRule' },
      { type: 'blockquote', content: [p(text('Measure twice, cut once.'))] },
    );
    const stats = scriptStats(value);
    expect(stats.text).toBe("Cold open\nToday we don't glue: it's a half-lap on 2x4 stock.\n— ready?\nMark\nCut & pare\nMeasure twice, cut once.");
    // Cold open (2) + Today we don't glue it's a half-lap on 2x4 stock (10) + ready (1) + Mark (1)
    // + Cut pare (2) + Measure twice cut once (4)
    expect(stats.wordCount).toBe(20);
  });

  it('does not run words together across blocks or breaks', () => {
    expect(scriptStats(doc(p(text('one')), p(text('two'), br, text('three')))).wordCount).toBe(3);
  });
});
