import { z } from 'zod';
import { INVISIBLE_CHARACTERS_MESSAGE, isVisibleName } from '@/lib/text/visible-name';
import { channelSlugSchema } from '@/lib/channels/schemas';
import type { EditStage } from '@/lib/edit/stages';
import { parseDuration } from '@/lib/runtime';
import { frameRateIds, type FrameRateId } from '@/lib/timecode';

export const episodeStages = ['idea', 'outline', 'shoot', 'edit', 'published'] as const;
export type EpisodeStage = (typeof episodeStages)[number];
export const stageLabels: Record<EpisodeStage, string> = {
  idea: 'Idea',
  outline: 'Outline',
  shoot: 'Shoot',
  edit: 'Edit',
  published: 'Published',
};

export const DEFAULT_LEVEL_LABELS = ['Starter', 'Intermediate', 'Advanced'] as const;
export const MAX_RUNTIME_SECONDS = 10 * 3600;

export const dateSchema = z
  .string()
  .regex(/^\d{4}-\d{2}-\d{2}$/, 'Use a date like 2027-03-14.')
  .refine((v) => !Number.isNaN(Date.parse(`${v}T00:00:00Z`)) && new Date(`${v}T00:00:00Z`).toISOString().startsWith(v), 'That date does not exist.');

/** Seconds, or "mm:ss" text from a form. */
export const durationSchema = z.union([z.number(), z.string()], { error: 'Enter a time like 12:30.' }).transform((v, ctx) => {
  const seconds = typeof v === 'number' ? v : parseDuration(v);
  if (seconds === null || !Number.isInteger(seconds) || seconds < 0 || seconds > MAX_RUNTIME_SECONDS) {
    ctx.addIssue({ code: 'custom', message: 'Enter a time like 12:30 (minutes:seconds), up to 10 hours.' });
    return z.NEVER;
  }
  return seconds;
});

export const levelLabelSchema = z.string().trim().min(1, 'Give the level a name.').max(40, 'Keep level names under 40 characters.').refine(isVisibleName, INVISIBLE_CHARACTERS_MESSAGE);

const episodeFields = {
  title: z.string({ error: 'Give the episode a title.' }).trim().min(1, 'Give the episode a title.').max(160, 'Keep the title under 160 characters.').refine(isVisibleName, INVISIBLE_CHARACTERS_MESSAGE),
  premise: z.string().trim().max(280, 'Keep the premise to one line (280 characters).').refine(isVisibleName, INVISIBLE_CHARACTERS_MESSAGE),
  stage: z.enum(episodeStages, { error: 'Choose a stage.' }),
  targetSeconds: durationSchema.nullable(),
  shootDate: dateSchema.nullable(),
  publishDate: dateSchema.nullable(),
  levelLabels: z.tuple([levelLabelSchema, levelLabelSchema, levelLabelSchema]),
  archived: z.boolean(),
  frameRate: z.enum(frameRateIds, { error: 'Choose a frame rate.' }),
};

const datesInOrder = (v: { shootDate?: string | null; publishDate?: string | null }) =>
  !v.shootDate || !v.publishDate || v.shootDate <= v.publishDate;
const datesMessage = { message: 'The publish date comes after the shoot date.', path: ['publishDate'] };

export const createEpisodeSchema = z
  .strictObject({
    title: episodeFields.title,
    premise: episodeFields.premise.default(''),
    stage: episodeFields.stage.default('idea'),
    targetSeconds: episodeFields.targetSeconds.default(null),
    shootDate: episodeFields.shootDate.default(null),
    publishDate: episodeFields.publishDate.default(null),
  })
  .refine(datesInOrder, datesMessage);
export type CreateEpisodeInput = z.infer<typeof createEpisodeSchema>;

export const updateEpisodeSchema = z
  .strictObject({
    title: episodeFields.title.optional(),
    premise: episodeFields.premise.optional(),
    stage: episodeFields.stage.optional(),
    targetSeconds: episodeFields.targetSeconds.optional(),
    shootDate: episodeFields.shootDate.optional(),
    publishDate: episodeFields.publishDate.optional(),
    levelLabels: episodeFields.levelLabels.optional(),
    archived: episodeFields.archived.optional(),
    frameRate: episodeFields.frameRate.optional(),
  })
  .refine(datesInOrder, datesMessage);
export type UpdateEpisodeInput = z.infer<typeof updateEpisodeSchema>;

export const episodeParamsSchema = z.object({ channel: channelSlugSchema, episodeId: z.uuid() });

export const episodeListQuerySchema = z.strictObject({
  stage: z.enum(episodeStages).optional(),
  archived: z.enum(['true', 'false']).optional(),
});

export type EpisodeDto = {
  id: string;
  title: string;
  premise: string;
  stage: EpisodeStage;
  targetSeconds: number | null;
  shootDate: string | null;
  publishDate: string | null;
  levelLabels: [string, string, string];
  archived: boolean;
  updatedAt: string;
  /** The rate the edit runs at: timecodes of notes and exports count frames at it. */
  frameRate: FrameRateId;
  editStage: EditStage | null;
};

export type EpisodeSummaryDto = EpisodeDto & { segmentCount: number; forecastSeconds: number };
