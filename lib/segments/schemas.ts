import { z } from 'zod';
import { INVISIBLE_CHARACTERS_MESSAGE, isVisibleName } from '@/lib/text/visible-name';
import { channelSlugSchema } from '@/lib/channels/schemas';
import { durationSchema } from '@/lib/episodes/schemas';
import type { EpisodeDto } from '@/lib/episodes/schemas';
import type { EpisodeForecast } from '@/lib/runtime';
import type { ShotProgress } from '@/lib/shots/schemas';

export const segmentKinds = ['cold_open', 'build', 'sponsor_read', 'interlude', 'outro'] as const;
export type SegmentKind = (typeof segmentKinds)[number];
export const kindLabels: Record<SegmentKind, string> = {
  cold_open: 'Cold open',
  build: 'Build',
  sponsor_read: 'Sponsor read',
  interlude: 'Interlude',
  outro: 'Outro',
};

export const levels = [1, 2, 3] as const;
export type Level = (typeof levels)[number];

const title = z.string({ error: 'Give the segment a title.' }).trim().min(1, 'Give the segment a title.').max(160, 'Keep the title under 160 characters.').refine(isVisibleName, INVISIBLE_CHARACTERS_MESSAGE);
const kind = z.enum(segmentKinds, { error: 'Choose a segment kind.' });
const level = z.union([z.literal(1), z.literal(2), z.literal(3)], { error: 'Choose level 1, 2 or 3.' });

// Only a Build segment has a skill level.
const levelMatchesKind = (v: { kind?: SegmentKind; level?: Level | null }) => v.kind === undefined || v.kind === 'build' || v.level == null;
const levelMessage = { message: 'Only a Build segment has a level.', path: ['level'] };

export const createSegmentSchema = z
  .strictObject({ title, kind, level: level.nullable().default(null), afterId: z.uuid().nullable().optional() })
  .refine(levelMatchesKind, levelMessage);
export type CreateSegmentInput = z.infer<typeof createSegmentSchema>;

export const updateSegmentSchema = z
  .strictObject({ title: title.optional(), kind: kind.optional(), level: level.nullable().optional(), actionSeconds: durationSchema.optional() })
  .refine(levelMatchesKind, levelMessage)
  .refine((v) => Object.keys(v).length > 0, 'Change at least one field.');
export type UpdateSegmentInput = z.infer<typeof updateSegmentSchema>;

/** Move a segment to just after another one of the same episode; null puts it first. */
export const moveSegmentSchema = z.strictObject({ afterId: z.uuid({ error: 'Name the segment to follow, or null for first.' }).nullable() });

export const segmentParamsSchema = z.object({ channel: channelSlugSchema, segmentId: z.uuid() });

export type SegmentDto = {
  id: string;
  episodeId: string;
  position: string;
  kind: SegmentKind;
  level: Level | null;
  title: string;
  hasScript: boolean;
  wordCount: number;
  actionSeconds: number;
  scriptVersion: number;
};

export type RunningOrderDto = {
  episode: EpisodeDto;
  segments: SegmentDto[];
  forecast: EpisodeForecast;
  speakingRateWpm: number;
  canEdit: boolean;
  /** By segment id; a segment without live shots has no entry. */
  shotProgress: Record<string, ShotProgress>;
  /** Ids of sponsor-read segments whose script changed after the sponsor approved it; empty for who may not read sponsor reads. */
  changedSinceApproval: string[];
};
