import { countWords } from '@/lib/runtime';
import type { ScriptDoc } from './schemas';

// Structural, so the editor's getJSON() (Tiptap's JSONContent) can be counted as it is typed, without
// a cast; a ScriptDoc fits it too.
type TextTree = { type?: string; text?: string; content?: readonly TextTree[] };

const textblocks = new Set(['paragraph', 'heading']);

function inlineText(nodes: readonly TextTree[] | undefined): string {
  let out = '';
  for (const node of nodes ?? []) {
    if (node.type === 'text') out += node.text ?? '';
    else if (node.type === 'hardBreak') out += '\n';
  }
  return out;
}

function collectLines(node: TextTree, lines: string[]): void {
  if (node.type && textblocks.has(node.type)) {
    lines.push(inlineText(node.content));
    return;
  }
  // doc, lists, list items and quotes only hold blocks; a horizontal rule holds nothing.
  for (const child of node.content ?? []) collectLines(child, lines);
}

/** The words of a script, one line per paragraph, heading or list item line; breaks become "\n". */
export function plainTextOf(doc: ScriptDoc | TextTree): string {
  const lines: string[] = [];
  collectLines(doc, lines);
  return lines.join('\n');
}

export function scriptStats(doc: ScriptDoc | TextTree): { text: string; wordCount: number } {
  const text = plainTextOf(doc);
  return { text, wordCount: countWords(text) };
}
