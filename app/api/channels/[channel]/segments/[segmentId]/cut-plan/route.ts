import { route } from '@/lib/api/handler';
import { planSegment } from '@/lib/cut-plans/queries';
import { segmentPlanParamsSchema } from '@/lib/cut-plans/schemas';

export const GET = route({ params: segmentPlanParamsSchema, channel: 'cutlist.read' }, async ({ member, params }) => planSegment(member.channel.id, params.segmentId));
