import { route } from '@/lib/api/handler';
import { exportResponse } from '@/lib/handoffs/export-response';
import { findHandoffContent } from '@/lib/handoffs/queries';
import { exportParamsSchema } from '@/lib/handoffs/schemas';

/** A version as CSV, OTIO, CMX 3600 EDL, the stored snapshot (json) or the whole clip package (zip). */
export const GET = route({ params: exportParamsSchema, channel: 'handoff.read' }, async ({ member, params }) =>
  exportResponse(member.channel.id, await findHandoffContent(member.channel.id, params.episodeId, params.version), params.format),
);
