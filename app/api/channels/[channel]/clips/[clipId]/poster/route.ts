import { Readable } from 'node:stream';
import { route } from '@/lib/api/handler';
import { findClip } from '@/lib/clips/queries';
import { clipParamsSchema } from '@/lib/clips/schemas';
import { notFound } from '@/lib/errors';
import { clipStore } from '@/storage/tus-server';

export const GET = route({ params: clipParamsSchema, channel: 'clips.read' }, async ({ member, params }) => {
  const clip = await findClip(member.channel.id, params.clipId);
  const poster = clip.hasPoster ? await clipStore().readPoster(clip.id) : null;
  if (!poster) throw notFound('That poster frame');
  return new Response(Readable.toWeb(poster) as ReadableStream, {
    headers: { 'Content-Type': 'image/jpeg', 'Cache-Control': 'private, max-age=3600', 'X-Content-Type-Options': 'nosniff' },
  });
});
