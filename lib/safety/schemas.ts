import { z } from 'zod';
import { INVISIBLE_CHARACTERS_MESSAGE, isVisibleName } from '@/lib/text/visible-name';
import { tools, type Tool } from './tools';

export const segmentToolsSchema = z
  .strictObject({
    tools: z.array(z.enum(tools, { error: 'Choose tools from the list.' }), { error: 'Choose tools from the list.' }).max(tools.length),
    otherTool: z.string({ error: 'Name the other tool.' }).trim().max(80, 'Keep the tool name under 80 characters.').refine(isVisibleName, INVISIBLE_CHARACTERS_MESSAGE).default(''),
  })
  .superRefine((v, ctx) => {
    if (v.tools.includes('other') && !v.otherTool) ctx.addIssue({ code: 'custom', path: ['otherTool'], message: 'Name the other tool.' });
  });
export type SegmentToolsInput = z.infer<typeof segmentToolsSchema>;

export const safetyReviewSchema = z.strictObject({ reviewed: z.boolean({ error: 'Say whether the safety review is done.' }) });

export type SegmentSafetyDto = {
  segmentId: string;
  tools: Tool[];
  otherTool: string;
  needsReview: boolean;
  reviewedBy: string | null;
  reviewedAt: string | null;
};

export type PendingSafetyDto = { segmentId: string; segmentTitle: string; episodeId: string; episodeTitle: string; shootDate: string | null; tools: Tool[] };
