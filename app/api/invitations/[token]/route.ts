import { route } from '@/lib/api/handler';
import { lookupInvitation } from '@/lib/crew/queries';
import { tokenParamsSchema } from '@/lib/crew/schemas';

export const GET = route({ auth: 'none', params: tokenParamsSchema }, async ({ params }) => ({
  invitation: await lookupInvitation(params.token),
}));
