import { route } from '@/lib/api/handler';
import { notFound } from '@/lib/errors';
import { exportResponse } from '@/lib/handoffs/export-response';
import { findHandoffContent } from '@/lib/handoffs/queries';
import { segmentPackageParamsSchema } from '@/lib/handoffs/schemas';
import { parseSnapshot } from '@/lib/handoffs/snapshot';

/** One segment's clips of a version as a ZIP, with its own manifest and SHA256SUMS. */
export const GET = route({ params: segmentPackageParamsSchema, channel: 'handoff.read' }, async ({ member, params }) => {
  const stored = await findHandoffContent(member.channel.id, params.episodeId, params.version);
  if (!parseSnapshot(stored.content).segments.some((s) => s.id === params.segmentId)) throw notFound('That segment');
  return exportResponse(member.channel.id, stored, 'zip', params.segmentId);
});
