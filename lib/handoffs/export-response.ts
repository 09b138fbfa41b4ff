import 'server-only';
import contentDisposition from 'content-disposition';
import { clipStore } from '@/storage/tus-server';
import { buildAssembly, clipsOfAll } from './assembly';
import { buildShotsCsv } from './csv';
import { buildEdl } from './edl';
import { otioText } from './otio';
import { buildClipPackage, packageBaseName } from './package';
import { findClipUploads, type StoredHandoff } from './queries';
import type { ExportFormat } from './schemas';
import { parseSnapshot } from './snapshot';

const textTypes: Record<Exclude<ExportFormat, 'zip'>, string> = {
  csv: 'text/csv; charset=utf-8',
  otio: 'application/json; charset=utf-8',
  edl: 'text/plain; charset=utf-8',
  json: 'application/json; charset=utf-8',
};

const download = (name: string, type: string, extra: Record<string, string> = {}) => ({
  'Content-Type': type,
  'Content-Disposition': contentDisposition(name),
  'Cache-Control': 'private, no-cache',
  'X-Content-Type-Options': 'nosniff',
  ...extra,
});

/** One export of a stored version; `json` is the stored snapshot byte for byte. */
export async function exportResponse(channelId: string, stored: StoredHandoff, format: ExportFormat, segmentId?: string): Promise<Response> {
  const snapshot = parseSnapshot(stored.content);
  const base = packageBaseName(snapshot);
  if (format === 'zip') {
    const ids = clipsOfAll(snapshot).map((c) => c.id);
    const uploads = await findClipUploads(channelId, ids);
    const store = clipStore();
    const pkg = await buildClipPackage(snapshot, {
      available: new Set(uploads.keys()),
      openClip: (clipId) => store.read(uploads.get(clipId)!.uploadId),
      crcOf: (clipId) => uploads.get(clipId)?.crc32 ?? null,
      segmentId,
    });
    return new Response(pkg.stream, { headers: download(pkg.fileName, 'application/zip', { 'Content-Length': String(pkg.size) }) });
  }
  const body =
    format === 'json' ? stored.content : format === 'csv' ? buildShotsCsv(snapshot) : format === 'otio' ? otioText(snapshot, buildAssembly(snapshot)) : buildEdl(snapshot, buildAssembly(snapshot));
  const extra: Record<string, string> = format === 'json' ? { ETag: `"${stored.contentHash}"` } : {};
  return new Response(body, { headers: download(`${base}.${format}`, textTypes[format], extra) });
}
