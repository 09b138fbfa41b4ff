import { Readable } from 'node:stream';
import contentDisposition from 'content-disposition';
import { route } from '@/lib/api/handler';
import { isAcceptedMediaType } from '@/lib/clips/media-types';
import { findClip } from '@/lib/clips/queries';
import { answerRange } from '@/lib/clips/range';
import { clipFileQuerySchema, clipParamsSchema } from '@/lib/clips/schemas';
import { notFound } from '@/lib/errors';
import { clipStore } from '@/storage/tus-server';

/** The clip's bytes, seekable by Range, inline for the preview player or as a download with its own name. */
export const GET = route({ params: clipParamsSchema, query: clipFileQuerySchema, channel: 'clips.read' }, async ({ req, member, params, query }) => {
  const clip = await findClip(member.channel.id, params.clipId);
  const size = clip.sizeBytes;
  const headers = new Headers({
    'Accept-Ranges': 'bytes',
    // A type stored before the allow-list existed is served as opaque bytes, never as a document.
    'Content-Type': isAcceptedMediaType(clip.mimeType) ? clip.mimeType : 'application/octet-stream',
    'Content-Disposition': contentDisposition(clip.originalName, { type: query.download ? 'attachment' : 'inline' }),
    ETag: `"${clip.sha256}"`,
    'Cache-Control': 'private, no-cache',
    'X-Content-Type-Options': 'nosniff',
    // Kept as is by next.config.mjs, whose page CSP skips this path.
    'Content-Security-Policy': "sandbox; default-src 'none'",
  });
  const range = answerRange(req.headers.get('range'), size);
  if (range.status === 416) {
    headers.set('Content-Range', `bytes */${size}`);
    return new Response(null, { status: 416, headers });
  }
  const stream = await clipStore()
    .read(clip.uploadId, range.status === 206 ? range : undefined)
    .catch(() => {
      throw notFound('That clip’s file');
    });
  if (range.status === 206) {
    headers.set('Content-Range', `bytes ${range.start}-${range.end}/${size}`);
    headers.set('Content-Length', String(range.end - range.start + 1));
  } else headers.set('Content-Length', String(size));
  return new Response(Readable.toWeb(stream) as ReadableStream, { status: range.status, headers });
});
