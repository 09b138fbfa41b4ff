import { route } from '@/lib/api/handler';
import { cutRecordParamsSchema } from '@/lib/cut-plans/schemas';
import { takeBackCutRecord } from '@/lib/cut-plans/take-back-queries';

// "Take back" a cut record: the undo of "Mark these cuts done", so the same capability. Only the newest
// record of its stock item, and only while the offcuts it kept are on hand as kept (409 otherwise);
// a record already taken back is 404. Answers what went back, for the confirmation's numbers.
export const DELETE = route({ params: cutRecordParamsSchema, channel: 'cutlist.edit' }, async ({ member, params }) =>
  takeBackCutRecord(member.channel.id, params.episodeId, params.recordId),
);
