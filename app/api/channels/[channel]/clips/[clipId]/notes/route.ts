import { route } from '@/lib/api/handler';
import { clipParamsSchema } from '@/lib/clips/schemas';
import { listClipNotes } from '@/lib/edit/queries';

/** Edit notes on a clip: Host and Editor read all, a Shop hand those on clips they uploaded. */
export const GET = route({ params: clipParamsSchema, channel: 'clips.read' }, async ({ member, params }) => ({
  notes: await listClipNotes(member, params.clipId),
}));
