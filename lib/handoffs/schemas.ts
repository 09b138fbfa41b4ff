import { z } from 'zod';
import { channelSlugSchema } from '@/lib/channels/schemas';

export const MAX_HANDOFF_NOTE = 2000;

export const lockHandoffSchema = z.strictObject({
  note: z.string({ error: 'Write a note, or leave it empty.' }).trim().max(MAX_HANDOFF_NOTE, `Keep the note under ${MAX_HANDOFF_NOTE} characters.`).default(''),
});
export type LockHandoffInput = z.infer<typeof lockHandoffSchema>;

const versionNumber = z.coerce.number().int().min(1).max(1_000_000);

export const handoffParamsSchema = z.object({ channel: channelSlugSchema, episodeId: z.uuid(), version: versionNumber });

export const diffQuerySchema = z.strictObject({
  from: z.coerce.number({ error: 'Give the older version number.' }).int('Give a version number.').min(1, 'Versions start at 1.'),
  to: z.coerce.number({ error: 'Give the newer version number.' }).int('Give a version number.').min(1, 'Versions start at 1.'),
});

export type HandoffSummaryDto = {
  id: string;
  episodeId: string;
  version: number;
  contentHash: string;
  note: string;
  lockedBy: string | null;
  lockedAt: string;
  segmentCount: number;
};

export const exportFormats = ['csv', 'otio', 'edl', 'zip', 'json'] as const;
export type ExportFormat = (typeof exportFormats)[number];
export const exportParamsSchema = handoffParamsSchema.extend({ format: z.enum(exportFormats) });
export const segmentPackageParamsSchema = handoffParamsSchema.extend({ segmentId: z.uuid() });
