import { z } from 'zod';
import { channelSlugSchema } from '@/lib/channels/schemas';
import { isAcceptedMediaType } from './media-types';

/** Upload-Metadata as tus-js-client sends it: every value a string. */
export const uploadMetadataSchema = z.object({
  segmentId: z.uuid({ error: 'Name the segment the clip belongs to (segmentId).' }),
  shotId: z.uuid({ error: 'shotId is not a shot.' }).optional(),
  filename: z.string({ error: 'Send the file name (filename).' }).min(1, 'Send the file name (filename).').max(1000, 'The file name is too long.'),
  filetype: z.string({ error: 'Send the file type (filetype).' }).min(1, 'Send the file type (filetype).').max(127),
});
export type UploadMetadata = z.infer<typeof uploadMetadataSchema>;
// An allow-list (lib/clips/media-types.ts): SVG and other +xml types are documents that can carry script.
export const isAcceptedType = (t: string) => isAcceptedMediaType(t);

export const segmentClipsParamsSchema = z.object({ channel: channelSlugSchema, segmentId: z.uuid() });
export const clipParamsSchema = z.object({ channel: channelSlugSchema, clipId: z.uuid() });
export const clipFileQuerySchema = z.object({ download: z.enum(['1'], { error: 'download is 1 or absent.' }).optional() });

/** Tie a clip to a shot (or to none), or move it to another segment of the channel; a move without shotId unties it. */
export const fileClipSchema = z
  .strictObject({
    segmentId: z.uuid({ error: 'segmentId is not a segment.' }).optional(),
    shotId: z.uuid({ error: 'shotId is a shot id or null.' }).nullable().optional(),
  })
  .refine((b) => b.segmentId !== undefined || b.shotId !== undefined, { error: 'Send a segmentId, a shotId, or both.', path: ['shotId'] });
export type FileClipInput = z.infer<typeof fileClipSchema>;

/** The earlier clip of the channel with the same bytes (same SHA-256), if any. */
export type DuplicateOfDto = { clipId: string; segmentId: string; episodeId: string; segmentTitle: string; originalName: string };

export type ProbeState = 'pending' | 'done' | 'failed' | 'unavailable';

export type ClipDto = {
  id: string;
  segmentId: string;
  shotId: string | null;
  uploadedBy: string | null;
  uploaderName: string | null;
  originalName: string;
  mimeType: string;
  sizeBytes: number;
  sha256: string;
  probeState: ProbeState;
  probeNote: string | null;
  durationSeconds: number | null;
  width: number | null;
  height: number | null;
  frameRate: number | null;
  codec: string | null;
  hasPoster: boolean;
  createdAt: string;
  duplicateOf: DuplicateOfDto | null;
};
