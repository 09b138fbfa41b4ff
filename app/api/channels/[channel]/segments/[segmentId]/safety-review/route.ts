import { route } from '@/lib/api/handler';
import { setSafetyReview } from '@/lib/safety/queries';
import { safetyReviewSchema } from '@/lib/safety/schemas';
import { segmentShotsParamsSchema } from '@/lib/shots/schemas';

export const PUT = route({ params: segmentShotsParamsSchema, body: safetyReviewSchema, channel: 'safety.review' }, async ({ member, params, body }) => ({
  safety: await setSafetyReview(member, params.segmentId, body.reviewed),
}));
