import { buildAssembly, packageClips, safeName, type AssemblyClip } from './assembly';
import { buildEdl } from './edl';
import { otioText } from './otio';
import { hashContent, type HandoffSnapshot } from './snapshot';
import { createZipArchive, type ZipEntrySource } from './zip-writer';

// The clip package: one stored (uncompressed) ZIP streamed straight from the clip store, with the
// OTIO, the EDL, manifest.json and SHA256SUMS. The writer (zip-writer.ts) uses ZIP64 records for
// entries over 4 GiB and, as every entry's size is known up front, knows the archive's size before
// the first byte.

export type OpenClip = (clipId: string) => Promise<AsyncIterable<Uint8Array>>;

export type ClipPackage = { stream: ReadableStream<Uint8Array>; size: number; fileName: string; missing: string[] };

/** Base name of the package and its timeline files: "Walnut step stool v3". */
export const packageBaseName = (snapshot: HandoffSnapshot) => safeName(`${snapshot.episode.title} v${snapshot.version}`, 80);

/** GNU coreutils `sha256sum` text format: hash, two spaces, path. */
const sumsLine = (hash: string, path: string) => `${hash}  ${path}\n`;

/**
 * @param available clip ids whose bytes still exist (a clip deleted after the lock is listed as missing).
 * @param segmentId only this segment's folder (a per-segment download), without the timeline files.
 * @param crcOf a clip's CRC-32 as ingest recorded it; null makes the writer compute it while streaming.
 */
export async function buildClipPackage(
  snapshot: HandoffSnapshot,
  options: { openClip: OpenClip; available: Set<string>; segmentId?: string; crcOf?: (clipId: string) => number | null },
): Promise<ClipPackage> {
  const assembly = buildAssembly(snapshot);
  const mtime = new Date(snapshot.lockedAt);
  const entries: ZipEntrySource[] = [];
  const segment = options.segmentId ? snapshot.segments.find((s) => s.id === options.segmentId) : undefined;
  const clips = packageClips(assembly).filter((c) => !options.segmentId || c.segment.id === options.segmentId);
  const present: AssemblyClip[] = clips.filter((c) => options.available.has(c.clip.id));
  const missing = clips.filter((c) => !options.available.has(c.clip.id)).map((c) => c.path);
  const base = packageBaseName(snapshot);
  let sums = '';

  for (const item of present) {
    entries.push({ path: item.path, mtime, size: item.clip.sizeBytes, crc32: options.crcOf?.(item.clip.id) ?? null, open: () => options.openClip(item.clip.id) });
    sums += sumsLine(item.clip.sha256, item.path);
  }

  const addText = (path: string, text: string) => {
    entries.push({ path, mtime, data: Buffer.from(text, 'utf8') });
    sums += sumsLine(hashContent(text), path);
  };
  if (!segment) {
    addText(`${base}.otio`, otioText(snapshot, assembly));
    addText(`${base}.edl`, buildEdl(snapshot, assembly));
  }
  const manifest = {
    episode: snapshot.episode.title,
    version: snapshot.version,
    lockedAt: snapshot.lockedAt,
    frameRate: snapshot.episode.frameRate,
    segment: segment ? { number: segment.number, title: segment.title } : null,
    clips: clips.map((c) => ({
      path: c.path,
      clipId: c.clip.id,
      name: c.clip.name,
      segment: c.segment.number,
      shot: c.shot?.number ?? null,
      sizeBytes: c.clip.sizeBytes,
      durationSeconds: c.clip.durationSeconds,
      sha256: c.clip.sha256,
      included: options.available.has(c.clip.id),
    })),
    missing,
  };
  addText('manifest.json', `${JSON.stringify(manifest, null, 2)}\n`);
  entries.push({ path: 'SHA256SUMS', mtime, data: Buffer.from(sums, 'utf8') });

  // A clip that cannot be read ends the download with an error rather than a short, valid-looking file.
  const { stream, size } = createZipArchive(entries);
  const fileName = segment ? `${base} - ${safeName(`${String(segment.number).padStart(2, '0')} ${segment.title}`, 60)}.zip` : `${base}.zip`;
  return { stream, size, fileName, missing };
}
