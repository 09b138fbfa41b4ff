import { getSchema } from '@tiptap/core';
import { Node as PmNode, type Schema } from '@tiptap/pm/model';
import { z } from 'zod';
import { scriptExtensions } from './extensions';

// The Tiptap JSON that the editor built from `scriptExtensions` can produce, and nothing else.
// Names and attributes were read from StarterKit 3.35 (getSchema(scriptExtensions)); ProseMirror's
// toJSON writes `attrs` only for nodes that declare attributes: heading { level } and
// orderedList { start, type } always carry them, every other node and every mark carries none.

export const scriptLimits = {
  /** Every node counts, the doc and text nodes included. */
  maxNodes: 20_000,
  /** The doc's children are at depth 1; each list level adds two (list, item). */
  maxDepth: 20,
  maxTextNodeLength: 50_000,
  /** About 30,000 spoken words, hours of talking: far more than one segment needs. */
  maxTotalText: 200_000,
} as const;

export const markTypes = ['bold', 'italic', 'underline', 'strike'] as const;
export type ScriptMarkType = (typeof markTypes)[number];
export type ScriptMark = { type: ScriptMarkType };

/** The values of HTML's <ol type>; Tiptap's default is null (decimal). */
export const orderedListTypes = ['1', 'a', 'A', 'i', 'I'] as const;
export type OrderedListType = (typeof orderedListTypes)[number];

export type TextNode = { type: 'text'; text: string; marks?: ScriptMark[] };
// Inserting a break inside bold text gives the break the bold mark too (replaceSelectionWith keeps
// the marks at the cursor), so hardBreak may carry marks.
export type HardBreakNode = { type: 'hardBreak'; marks?: ScriptMark[] };
export type InlineNode = TextNode | HardBreakNode;
export type ParagraphNode = { type: 'paragraph'; content?: InlineNode[] };
export type HeadingNode = { type: 'heading'; attrs: { level: 2 | 3 }; content?: InlineNode[] };
export type BlockquoteNode = { type: 'blockquote'; content: BlockNode[] };
export type HorizontalRuleNode = { type: 'horizontalRule' };
/** ProseMirror requires a paragraph first ("paragraph block*"); parseScriptDoc checks that. */
export type ListItemNode = { type: 'listItem'; content: BlockNode[] };
export type BulletListNode = { type: 'bulletList'; content: ListItemNode[] };
export type OrderedListNode = {
  type: 'orderedList';
  // start is null when a pasted <ol start="x"> was not a number (NaN becomes null in JSON).
  attrs?: { start?: number | null; type?: OrderedListType | null };
  content: ListItemNode[];
};
export type BlockNode = ParagraphNode | HeadingNode | BlockquoteNode | HorizontalRuleNode | BulletListNode | OrderedListNode;
export type ScriptNode = BlockNode | ListItemNode | InlineNode;
export type ScriptDoc = { type: 'doc'; content: BlockNode[] };

export const emptyScriptDoc: ScriptDoc = { type: 'doc', content: [{ type: 'paragraph' }] };

const marks = z.array(z.strictObject({ type: z.enum(markTypes) })).max(markTypes.length).optional();
const textNode = z.strictObject({
  type: z.literal('text'),
  // ProseMirror refuses empty text nodes.
  text: z.string().min(1).max(scriptLimits.maxTextNodeLength),
  marks,
});
const hardBreakNode = z.strictObject({ type: z.literal('hardBreak'), marks });
const inlineNode: z.ZodType<InlineNode> = z.discriminatedUnion('type', [textNode, hardBreakNode]);
const inlineContent = z.array(inlineNode).optional();

const blocks = z.array(z.lazy(() => blockNode)).min(1);
const listItemNode: z.ZodType<ListItemNode> = z.strictObject({ type: z.literal('listItem'), content: blocks });
const listItems = z.array(listItemNode).min(1);

const blockNode: z.ZodType<BlockNode> = z.discriminatedUnion('type', [
  z.strictObject({ type: z.literal('paragraph'), content: inlineContent }),
  z.strictObject({
    type: z.literal('heading'),
    attrs: z.strictObject({ level: z.union([z.literal(2), z.literal(3)]) }),
    content: inlineContent,
  }),
  z.strictObject({ type: z.literal('blockquote'), content: blocks }),
  z.strictObject({ type: z.literal('horizontalRule') }),
  z.strictObject({ type: z.literal('bulletList'), content: listItems }),
  z.strictObject({
    type: z.literal('orderedList'),
    attrs: z
      .strictObject({ start: z.number().int().nullable().optional(), type: z.enum(orderedListTypes).nullable().optional() })
      .optional(),
    content: listItems,
  }),
]);

const docShape = z.strictObject({ type: z.literal('doc'), content: blocks });

const tooManyNodes = `The script has too many parts (more than ${scriptLimits.maxNodes.toLocaleString('en')}).`;
const tooDeep = 'The script nests lists or quotes too deeply.';
const tooLong = `The script is too long: keep it under ${scriptLimits.maxTotalText.toLocaleString('en')} characters.`;

/**
 * Counts nodes, depth and text before zod descends, without recursion, so a hostile body cannot
 * make the recursive schema overflow the stack or walk millions of nodes.
 */
function checkSize(value: unknown): string | null {
  // Nodes are counted when pushed, so no array can make the walk do more than maxNodes steps.
  let nodes = 1;
  let text = 0;
  const stack: Array<{ value: unknown; depth: number }> = [{ value, depth: 0 }];
  for (let item = stack.pop(); item; item = stack.pop()) {
    if (typeof item.value !== 'object' || item.value === null) continue;
    if (item.depth > scriptLimits.maxDepth) return tooDeep;
    const node = item.value as { text?: unknown; content?: unknown };
    if (typeof node.text === 'string' && (text += node.text.length) > scriptLimits.maxTotalText) return tooLong;
    if (!Array.isArray(node.content)) continue;
    nodes += node.content.length;
    if (nodes > scriptLimits.maxNodes) return tooManyNodes;
    for (const child of node.content) stack.push({ value: child, depth: item.depth + 1 });
  }
  return null;
}

let pmSchema: Schema | undefined;
function proseMirrorSchema(): Schema {
  pmSchema ??= getSchema(scriptExtensions);
  return pmSchema;
}

/** What ProseMirror says about nesting the grammar above cannot express (e.g. listItem under doc). */
function checkStructure(doc: ScriptDoc): string | null {
  try {
    PmNode.fromJSON(proseMirrorSchema(), doc).check();
    return null;
  } catch (e) {
    if (!(e instanceof RangeError)) throw e;
    // ProseMirror's message quotes the user's text; name only the node type.
    const inside = /for node (\w+)/.exec(e.message)?.[1];
    return `The script's structure is not valid${inside ? ` (something is not allowed inside ${inside})` : ''}.`;
  }
}

/** A script document as the editor writes it: shape, caps and ProseMirror's nesting rules. */
export const scriptDocSchema: z.ZodType<ScriptDoc> = z
  .unknown()
  .superRefine((value, ctx) => {
    const problem = checkSize(value);
    if (problem) ctx.addIssue({ code: 'custom', message: problem });
  })
  .pipe(docShape)
  .superRefine((doc, ctx) => {
    const problem = checkStructure(doc);
    if (problem) ctx.addIssue({ code: 'custom', message: problem });
  });

export const saveScriptSchema = z.strictObject({ doc: scriptDocSchema, baseVersion: z.number().int().min(0) });
export type SaveScriptInput = z.infer<typeof saveScriptSchema>;

export type ParseScriptDocResult = { ok: true; doc: ScriptDoc } | { ok: false; message: string };

/** Validates an untrusted script document; the message is safe to show to the writer. */
export function parseScriptDoc(value: unknown): ParseScriptDocResult {
  const result = scriptDocSchema.safeParse(value);
  if (result.success) return { ok: true, doc: result.data };
  const issue = result.error.issues[0];
  if (issue?.code === 'custom') return { ok: false, message: issue.message };
  const at = issue && issue.path.length > 0 ? ` (at ${issue.path.map(String).join('.')})` : '';
  return { ok: false, message: `The script contains something the editor cannot produce${at}.` };
}

/** The response bodies of GET and PUT /api/channels/[channel]/segments/[segmentId]/script. */
export type ScriptDto = { doc: ScriptDoc | null; version: number; wordCount: number; updatedAt: string };
export type SavedScriptDto = Omit<ScriptDto, 'doc'>;
