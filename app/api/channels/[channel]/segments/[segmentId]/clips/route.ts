import { route } from '@/lib/api/handler';
import { listSegmentClips } from '@/lib/clips/queries';
import { segmentClipsParamsSchema } from '@/lib/clips/schemas';

export const GET = route({ params: segmentClipsParamsSchema, channel: 'clips.read' }, async ({ member, params }) => ({
  clips: await listSegmentClips(member.channel.id, params.segmentId),
}));
