import { noContent, route } from '@/lib/api/handler';
import { deleteClipRow, fileClip, findClip } from '@/lib/clips/queries';
import { clipParamsSchema, fileClipSchema } from '@/lib/clips/schemas';
import { clipStore } from '@/storage/tus-server';

export const GET = route({ params: clipParamsSchema, channel: 'clips.read' }, async ({ member, params }) => {
  const { uploadId: _uploadId, ...clip } = await findClip(member.channel.id, params.clipId);
  return { clip };
});

// The route lets a Shop hand in; deleteClipRow then holds them to their own uploads (lib/clips/policy.ts).
export const DELETE = route({ params: clipParamsSchema, channel: 'clips.deleteOwn' }, async ({ member, params }) => {
  const { uploadId } = await deleteClipRow(member, params.clipId);
  const store = clipStore();
  // The row is gone first, so a failed file removal leaves bytes, never a clip without bytes.
  await Promise.all([store.remove(uploadId), store.removePoster(params.clipId)]).catch((err: unknown) => console.error('clip file removal', err));
  return noContent();
});

// Tie the clip to a shot or move it to another segment. The route lets anyone who uploads in; fileClip
// then holds a Shop hand to their own uploads (lib/clips/policy.ts, mayFileClip).
export const PATCH = route({ params: clipParamsSchema, body: fileClipSchema, channel: 'clips.upload' }, async ({ member, params, body }) => ({
  clip: await fileClip(member, params.clipId, body),
}));
