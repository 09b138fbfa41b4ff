import { z } from 'zod';
import { INVISIBLE_CHARACTERS_MESSAGE, isVisibleName } from '@/lib/text/visible-name';
import { channelSlugSchema } from '@/lib/channels/schemas';
import { dateSchema } from '@/lib/episodes/schemas';
import { cameras, framings, MAX_DESCRIPTION, shotStates, type Camera, type Framing, type ShotState } from './catalog';
import type { Tool } from '@/lib/safety/tools';

const fields = {
  description: z
    .string({ error: 'Say what the shot shows.' })
    .trim()
    .min(1, 'Say what the shot shows.')
    .max(MAX_DESCRIPTION, `Keep the description under ${MAX_DESCRIPTION} characters.`)
    .refine(isVisibleName, INVISIBLE_CHARACTERS_MESSAGE),
  framing: z.enum(framings, { error: 'Choose a framing.' }),
  camera: z.enum(cameras, { error: 'Choose a camera.' }),
  assigneeId: z.uuid({ error: 'Choose someone from the crew.' }).nullable(),
  dueDate: dateSchema.nullable(),
  notes: z.string({ error: 'Notes are text.' }).trim().max(1000, 'Keep notes under 1000 characters.'),
};

export const createShotSchema = z.strictObject({
  description: fields.description,
  framing: fields.framing.default('medium'),
  camera: fields.camera.default('a_cam'),
  assigneeId: fields.assigneeId.default(null),
  dueDate: fields.dueDate.default(null),
  notes: fields.notes.default(''),
});
export type CreateShotInput = z.infer<typeof createShotSchema>;

export const bulkShotsSchema = z.strictObject({
  text: z.string({ error: 'Paste one shot per line.' }).max(20_000, 'Paste at most 100 shots at a time.'),
  assigneeId: fields.assigneeId.default(null),
  dueDate: fields.dueDate.default(null),
});
export type BulkShotsInput = z.infer<typeof bulkShotsSchema>;

export const updateShotSchema = z
  .strictObject({
    description: fields.description.optional(),
    framing: fields.framing.optional(),
    camera: fields.camera.optional(),
    assigneeId: fields.assigneeId.optional(),
    dueDate: fields.dueDate.optional(),
    notes: fields.notes.optional(),
  })
  .refine((v) => Object.values(v).some((x) => x !== undefined), 'Change at least one field.');
export type UpdateShotInput = z.infer<typeof updateShotSchema>;

export const moveShotSchema = z.strictObject({
  afterId: z.uuid({ error: 'Name the shot to follow, or null for first.' }).nullable(),
});

export const shotStateSchema = z
  .strictObject({
    state: z.enum(shotStates, { error: 'Choose Planned, Captured or Retake.' }),
    reason: z.string({ error: 'The reason is text.' }).trim().max(300, 'Keep the reason under 300 characters.').optional(),
    // Where the card lands in its board column; omitted keeps its place.
    afterId: z.uuid({ error: 'Name the card to follow, or null for top.' }).nullable().optional(),
  })
  .superRefine((v, ctx) => {
    if (v.state === 'retake' && !v.reason) ctx.addIssue({ code: 'custom', path: ['reason'], message: 'Say why it needs a retake.' });
  });
export type ShotStateInput = z.infer<typeof shotStateSchema>;

export const boardQuerySchema = z.object({
  episodeId: z.uuid({ error: 'Not an episode.' }).optional(),
  segmentId: z.uuid({ error: 'Not a segment.' }).optional(),
  assigneeId: z.union([z.uuid(), z.literal('none')], { error: 'Not a crew member.' }).optional(),
  camera: z.enum(cameras, { error: 'Not a camera.' }).optional(),
});
export type BoardQuery = z.infer<typeof boardQuerySchema>;

export const segmentShotsParamsSchema = z.object({ channel: channelSlugSchema, segmentId: z.uuid() });
export const shotParamsSchema = z.object({ channel: channelSlugSchema, shotId: z.uuid() });

export type ShotDto = {
  id: string;
  segmentId: string;
  number: number;
  position: string;
  boardPosition: string;
  framing: Framing;
  camera: Camera;
  description: string;
  assigneeId: string | null;
  assigneeName: string | null;
  dueDate: string | null;
  notes: string;
  state: ShotState;
  retakeReason: string | null;
  stateChangedBy: string | null;
  stateChangedAt: string | null;
  /** Clips uploaded to this shot: more than 0 means it has footage. */
  clipCount: number;
};

/** A shot with where it lives, for the board, "My shots" and e-mail. */
export type BoardShotDto = ShotDto & {
  episodeId: string;
  episodeTitle: string;
  shootDate: string | null;
  segmentTitle: string;
  segmentPosition: string;
  /** The segment's number in its episode's running order, 1 for the first. */
  segmentNumber: number;
  tools: Tool[];
  safetyPending: boolean;
};

/** "3.2": segment 3, shot 2. Unique in an episode, where shot numbers alone repeat in every segment. */
export const shotLabel = (shot: { segmentNumber: number; number: number }) => `${shot.segmentNumber}.${shot.number}`;

export type ShotProgress = { total: number; captured: number; retake: number };
