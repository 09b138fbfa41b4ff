import { getSchema } from '@tiptap/core';
import { Node as PmNode } from '@tiptap/pm/model';
import { renderToReactElement } from '@tiptap/static-renderer/pm/react';
import fc from 'fast-check';
import { createElement, Fragment } from 'react';
import { renderToStaticMarkup } from 'react-dom/server';
import { describe, expect, it } from 'vitest';
import { scriptExtensions } from './extensions';
import { plainTextOf, scriptStats } from './plain-text';
import {
  emptyScriptDoc,
  markTypes,
  orderedListTypes,
  parseScriptDoc,
  saveScriptSchema,
  scriptLimits,
  type BlockNode,
  type HeadingNode,
  type InlineNode,
  type ListItemNode,
  type ScriptDoc,
  type ScriptMark,
} from './schemas';

const text = (t: string, marks?: ScriptMark[]): InlineNode => (marks ? { type: 'text', text: t, marks } : { type: 'text', text: t });
const p = (...content: InlineNode[]): BlockNode => (content.length ? { type: 'paragraph', content } : { type: 'paragraph' });
const doc = (...content: unknown[]) => ({ type: 'doc', content });
// For bodies the types rightly forbid.
const rawP = (...content: unknown[]) => ({ type: 'paragraph', content });

const everything: ScriptDoc = {
  type: 'doc',
  content: [
    { type: 'heading', attrs: { level: 2 }, content: [text('Cold open')] },
    p(text('Today we cut a '), text('half-lap', [{ type: 'bold' }, { type: 'italic' }]), { type: 'hardBreak' }, text('joint.', [{ type: 'underline' }])),
    { type: 'heading', attrs: { level: 3 }, content: [text('Tools', [{ type: 'strike' }])] },
    { type: 'bulletList', content: [{ type: 'listItem', content: [p(text('Saw')), { type: 'bulletList', content: [{ type: 'listItem', content: [p(text('Ryoba'))] }] }] }] },
    { type: 'orderedList', attrs: { start: 3, type: null }, content: [{ type: 'listItem', content: [p(text('Mark'))] }] },
    { type: 'orderedList', content: [{ type: 'listItem', content: [p(text('Cut'))] }] },
    { type: 'orderedList', attrs: { start: null, type: 'a' }, content: [{ type: 'listItem', content: [p()] }] },
    { type: 'blockquote', content: [p(text('Measure twice.'))] },
    { type: 'horizontalRule' },
    p({ type: 'hardBreak', marks: [{ type: 'bold' }] }),
    p(),
  ],
};

const pmSchema = getSchema(scriptExtensions);
const roundTrip = (value: unknown): unknown => PmNode.fromJSON(pmSchema, value).toJSON();

function renderHtml(value: ScriptDoc): string {
  return renderToStaticMarkup(createElement(Fragment, null, renderToReactElement({ content: value, extensions: scriptExtensions })));
}

function expectRefused(value: unknown, message?: RegExp) {
  const result = parseScriptDoc(value);
  expect(result.ok).toBe(false);
  if (!result.ok && message) expect(result.message).toMatch(message);
}

describe('scriptExtensions', () => {
  it('define exactly the nodes and marks the schema allows', () => {
    expect(Object.keys(pmSchema.nodes).sort()).toEqual(
      ['blockquote', 'bulletList', 'doc', 'hardBreak', 'heading', 'horizontalRule', 'listItem', 'orderedList', 'paragraph', 'text'].sort(),
    );
    expect(Object.keys(pmSchema.marks).sort()).toEqual([...markTypes].sort());
  });

  it('emit attrs only on heading and orderedList, as the schema expects', () => {
    expect(roundTrip(doc({ type: 'orderedList', content: [{ type: 'listItem', content: [{ type: 'paragraph' }] }] }))).toEqual(
      doc({ type: 'orderedList', attrs: { start: 1, type: null }, content: [{ type: 'listItem', content: [{ type: 'paragraph' }] }] }),
    );
    expect(roundTrip(doc({ type: 'heading', attrs: { level: 3 } }, { type: 'paragraph' }, { type: 'horizontalRule' }))).toEqual(
      doc({ type: 'heading', attrs: { level: 3 } }, { type: 'paragraph' }, { type: 'horizontalRule' }),
    );
  });
});

describe('parseScriptDoc accepts', () => {
  it('the empty doc', () => {
    expect(parseScriptDoc(emptyScriptDoc)).toEqual({ ok: true, doc: emptyScriptDoc });
  });

  it('every node, mark and attr the editor can write', () => {
    expect(parseScriptDoc(everything)).toEqual({ ok: true, doc: everything });
  });

  it("ProseMirror's own serialisation of that doc", () => {
    const json = roundTrip(everything);
    expect(parseScriptDoc(json).ok).toBe(true);
  });

  it('every HTML list type', () => {
    for (const type of orderedListTypes) {
      expect(parseScriptDoc(doc({ type: 'orderedList', attrs: { start: 1, type }, content: [{ type: 'listItem', content: [p()] }] })).ok).toBe(true);
    }
  });

  it('text up to the caps', () => {
    const long = 'a'.repeat(scriptLimits.maxTextNodeLength);
    expect(parseScriptDoc(doc(p(text(long)))).ok).toBe(true);
  });
});

describe('parseScriptDoc refuses', () => {
  it('what is not a doc', () => {
    for (const value of [null, undefined, 'doc', 42, [], {}, { type: 'doc' }, { type: 'doc', content: [] }, { type: 'paragraph' }]) {
      expectRefused(value);
    }
  });

  it('script-ish attributes on any node or mark', () => {
    expectRefused(doc({ type: 'paragraph', attrs: { onclick: 'alert(1)' } }));
    expectRefused(doc({ type: 'heading', attrs: { level: 2, style: 'background:url(javascript:alert(1))' } }));
    expectRefused(doc({ type: 'orderedList', attrs: { start: 1, type: null, class: 'x' }, content: [{ type: 'listItem', content: [p()] }] }));
    expectRefused(doc(rawP({ type: 'text', text: 'hi', marks: [{ type: 'bold', attrs: { onmouseover: 'x' } }] })));
    expectRefused(doc(rawP({ type: 'text', text: 'hi', attrs: { href: 'javascript:alert(1)' } })));
    expectRefused(doc(rawP({ type: 'text', text: 'hi', html: '<script>alert(1)</script>' })));
    expectRefused({ ...doc(p()), attrs: { onload: 'x' } });
  });

  it('ordered list types and starts the editor cannot write', () => {
    const list = (attrs: unknown) => doc({ type: 'orderedList', attrs, content: [{ type: 'listItem', content: [p()] }] });
    expectRefused(list({ type: 'disc' }));
    expectRefused(list({ type: '"><script>' }));
    expectRefused(list({ start: 1.5 }));
    expectRefused(list({ start: '1' }));
  });

  it('unknown nodes: images, code, links, tables, task lists', () => {
    expectRefused(doc({ type: 'image', attrs: { src: 'https://example.com/x.png' } }));
    expectRefused(doc({ type: 'codeBlock', content: [text('rm -rf /')] }));
    expectRefused(doc({ type: 'table', content: [] }));
    expectRefused(doc({ type: 'taskList', content: [{ type: 'taskItem', attrs: { checked: false }, content: [p()] }] }));
    expectRefused(doc(rawP({ type: 'mention', attrs: { id: 'x' } })));
  });

  it('unknown marks: link, code, highlight', () => {
    expectRefused(doc(p(text('click', [{ type: 'link' } as unknown as ScriptMark]))));
    expectRefused(doc(rawP({ type: 'text', text: 'click', marks: [{ type: 'link', attrs: { href: 'javascript:alert(1)' } }] })));
    expectRefused(doc(rawP({ type: 'text', text: 'x', marks: [{ type: 'code' }] })));
    expectRefused(doc(rawP({ type: 'text', text: 'x', marks: [{ type: 'highlight' }] })));
  });

  it('duplicate marks', () => {
    expectRefused(doc(p(text('x', [{ type: 'bold' }, { type: 'bold' }]))), /structure/);
  });

  it('headings other than 2 and 3, and headings without a level', () => {
    for (const level of [1, 4, 5, 6, 0, '2', null]) expectRefused(doc({ type: 'heading', attrs: { level } }));
    expectRefused(doc({ type: 'heading', content: [text('x')] }));
  });

  it('wrong nesting', () => {
    const item: ListItemNode = { type: 'listItem', content: [p(text('x'))] };
    expectRefused(doc(item));
    expectRefused(doc(text('loose text')));
    expectRefused(doc({ type: 'bulletList', content: [p(text('x'))] }));
    expectRefused(doc({ type: 'bulletList', content: [] }));
    expectRefused(doc({ type: 'blockquote', content: [] }));
    // A list item must open with a paragraph.
    const heading: HeadingNode = { type: 'heading', attrs: { level: 2 }, content: [text('x')] };
    expectRefused(doc({ type: 'bulletList', content: [{ type: 'listItem', content: [heading] }] }), /structure/);
    expectRefused(doc(rawP({ type: 'paragraph' })));
    expectRefused(doc({ type: 'horizontalRule', content: [p()] }));
    expectRefused(doc(rawP({ type: 'hardBreak', content: [text('x')] })));
  });

  it('empty and oversized text nodes', () => {
    expectRefused(doc(p(text(''))));
    expectRefused(doc(p(text('a'.repeat(scriptLimits.maxTextNodeLength + 1)))));
  });

  it('too much text in total', () => {
    const chunk = 'a'.repeat(scriptLimits.maxTextNodeLength);
    const paragraphs = Array.from({ length: scriptLimits.maxTotalText / scriptLimits.maxTextNodeLength + 1 }, () => p(text(chunk)));
    expectRefused(doc(...paragraphs), /too long/);
  });

  it('too many nodes', () => {
    const paragraphs = Array.from({ length: scriptLimits.maxNodes }, () => p());
    expectRefused(doc(...paragraphs), /too many parts/);
    // A single huge content array is refused without walking it: no element of it is read.
    let reads = 0;
    const content = new Proxy(new Array(5_000_000).fill({ type: 'paragraph' }), {
      get(target, key, receiver) {
        if (typeof key === 'string' && /^\d+$/.test(key)) reads++;
        return Reflect.get(target, key, receiver) as unknown;
      },
    });
    expectRefused({ type: 'doc', content }, /too many parts/);
    expect(reads).toBe(0);
  });

  it('deep nesting, without overflowing the stack', () => {
    const nest = (levels: number): unknown => {
      let node: unknown = p(text('deep'));
      for (let i = 0; i < levels; i++) node = { type: 'blockquote', content: [node] };
      return doc(node);
    };
    expect(parseScriptDoc(nest(scriptLimits.maxDepth - 2)).ok).toBe(true);
    expectRefused(nest(scriptLimits.maxDepth), /too deeply/);
    expectRefused(nest(100_000), /too deeply/);
  });

  it('with a message that does not echo the text', () => {
    const result = parseScriptDoc(doc({ type: 'listItem', content: [p(text('my secret line'))] }));
    expect(result.ok).toBe(false);
    if (!result.ok) expect(result.message).not.toContain('secret');
  });
});

describe('saveScriptSchema', () => {
  it('takes a doc and a base version', () => {
    expect(saveScriptSchema.safeParse({ doc: everything, baseVersion: 0 }).success).toBe(true);
  });

  it('refuses unknown fields, bad versions and bad docs', () => {
    expect(saveScriptSchema.safeParse({ doc: everything, baseVersion: 1, html: '<p>' }).success).toBe(false);
    expect(saveScriptSchema.safeParse({ doc: everything, baseVersion: -1 }).success).toBe(false);
    expect(saveScriptSchema.safeParse({ doc: everything, baseVersion: 1.5 }).success).toBe(false);
    expect(saveScriptSchema.safeParse({ doc: everything }).success).toBe(false);
    expect(saveScriptSchema.safeParse({ doc: doc({ type: 'listItem', content: [p()] }), baseVersion: 1 }).success).toBe(false);
  });
});

describe('the server renderer', () => {
  it('renders every node and escapes the text', () => {
    const html = renderHtml({
      ...everything,
      content: [...everything.content, p(text('<script>alert(1)</script>'))],
    });
    expect(html).toContain('<h2>Cold open</h2>');
    expect(html).toContain('<strong><em>half-lap</em></strong>');
    expect(html).toContain('<ol start="3">');
    expect(html).toContain('<ol type="a">');
    expect(html).toContain('<blockquote><p>Measure twice.</p></blockquote>');
    expect(html).toContain('&lt;script&gt;');
    expect(html).not.toContain('<script>');
  });
});

// A doc built from the grammar the editor writes; fc.oneof's maxDepth falls back to the first
// option (a paragraph), which keeps trees shallow.
const markArb = fc.subarray([...markTypes]).map((types) => types.map((type) => ({ type })));
const withMarks = <T extends object>(node: T, marks: ScriptMark[]): T => (marks.length ? { ...node, marks } : node);
const inlineArb: fc.Arbitrary<InlineNode> = fc.oneof(
  { weight: 4, arbitrary: fc.tuple(fc.string({ unit: 'grapheme', minLength: 1, maxLength: 12 }), markArb).map(([t, m]) => withMarks({ type: 'text' as const, text: t }, m)) },
  { weight: 1, arbitrary: markArb.map((m) => withMarks({ type: 'hardBreak' as const }, m)) },
);
const inlineContentArb = fc.option(fc.array(inlineArb, { minLength: 1, maxLength: 4 }), { nil: undefined });

const { docArb } = fc.letrec<{ docArb: ScriptDoc; block: BlockNode; paragraph: BlockNode; listItem: ListItemNode }>((tie) => ({
  docArb: fc.array(tie('block'), { minLength: 1, maxLength: 5 }).map((content) => ({ type: 'doc' as const, content })),
  paragraph: inlineContentArb.map((content) => (content ? { type: 'paragraph' as const, content } : { type: 'paragraph' as const })),
  block: fc.oneof(
    { maxDepth: 4 },
    tie('paragraph'),
    fc.tuple(fc.constantFrom(2 as const, 3 as const), inlineContentArb).map(([level, content]): BlockNode =>
      content ? { type: 'heading', attrs: { level }, content } : { type: 'heading', attrs: { level } },
    ),
    fc.constant<BlockNode>({ type: 'horizontalRule' }),
    fc.array(tie('block'), { minLength: 1, maxLength: 3 }).map((content): BlockNode => ({ type: 'blockquote', content })),
    fc.array(tie('listItem'), { minLength: 1, maxLength: 3 }).map((content): BlockNode => ({ type: 'bulletList', content })),
    fc
      .tuple(
        fc.array(tie('listItem'), { minLength: 1, maxLength: 3 }),
        fc.option(fc.record({ start: fc.option(fc.integer({ min: -5, max: 500 }), { nil: null }), type: fc.option(fc.constantFrom(...orderedListTypes), { nil: null }) }), { nil: undefined }),
      )
      .map(([content, attrs]): BlockNode => (attrs ? { type: 'orderedList', attrs, content } : { type: 'orderedList', content })),
  ),
  listItem: fc
    .tuple(tie('paragraph'), fc.array(tie('block'), { maxLength: 2 }))
    .map(([first, rest]): ListItemNode => ({ type: 'listItem', content: [first, ...rest] })),
}));

describe('any doc the editor grammar allows', () => {
  it('passes parseScriptDoc, renders, and has plain text and a word count', () => {
    fc.assert(
      fc.property(docArb, (value) => {
        const result = parseScriptDoc(value);
        expect(result).toEqual({ ok: true, doc: value });
        expect(parseScriptDoc(roundTrip(value)).ok).toBe(true);
        expect(typeof plainTextOf(value)).toBe('string');
        expect(scriptStats(value).wordCount).toBeGreaterThanOrEqual(0);
        expect(typeof renderHtml(value)).toBe('string');
      }),
      { numRuns: 300 },
    );
  });
});
