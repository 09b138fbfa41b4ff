import { z } from 'zod';
import { channelSlugSchema } from '@/lib/channels/schemas';
import { editStages, type EditStage } from './stages';

export const setEditStageSchema = z.strictObject({ stage: z.enum(editStages, { error: 'Choose an edit stage.' }) });

export type EditStageEventDto = { id: string; fromStage: EditStage | null; toStage: EditStage; by: string | null; at: string };

export const MAX_NOTE = 4000;
const noteBody = z.string({ error: 'Write the note.' }).trim().min(1, 'Write the note.').max(MAX_NOTE, `Keep a note under ${MAX_NOTE} characters.`);

export const createNoteSchema = z
  .strictObject({
    segmentId: z.uuid({ error: 'Choose a segment of this version.' }).optional(),
    clipId: z.uuid({ error: 'Choose a clip of this version.' }).optional(),
    timecode: z.string({ error: 'Give a timecode like 00:01:00;02.' }).trim().min(1, 'Give a timecode like 00:01:00;02.').max(20, 'Give a timecode like 00:01:00;02.'),
    body: noteBody,
  })
  .refine((v) => (v.segmentId === undefined) !== (v.clipId === undefined), { message: 'Pin the note to a segment or to a clip.', path: ['segmentId'] });
export type CreateNoteInput = z.infer<typeof createNoteSchema>;

export const replySchema = z.strictObject({ body: noteBody });
export const resolveNoteSchema = z.strictObject({ resolved: z.boolean({ error: 'Say whether the thread is resolved.' }) });

export const noteParamsSchema = z.object({ channel: channelSlugSchema, noteId: z.uuid() });

export type EditNoteDto = {
  id: string;
  version: number;
  parentId: string | null;
  segmentId: string | null;
  clipId: string | null;
  frame: number | null;
  timecode: string | null;
  body: string;
  author: string | null;
  createdAt: string;
  resolvedAt: string | null;
  resolvedBy: string | null;
  replies: EditNoteDto[];
};
