/**
 * The media types a clip may have, as an allow-list rather than a pattern: a pattern such as
 * `image/<anything>` also admits `image/svg+xml` and other `+xml` documents that carry script.
 * Source: IANA Media Types registry (video/, audio/, image/ trees) for the registered names; the
 * `x-` names are the ones browsers and cameras report for these files (common practice, no
 * published source).
 */
export const ACCEPTED_MEDIA_TYPES: ReadonlySet<string> = new Set([
  // Video from cameras, phones, screen recorders and editors.
  'video/mp4',
  'video/quicktime',
  'video/x-matroska',
  'video/webm',
  'video/mpeg',
  'video/mp2t',
  'video/x-msvideo',
  'video/x-m4v',
  'video/3gpp',
  'video/3gpp2',
  'video/x-ms-wmv',
  'video/x-flv',
  'video/ogg',
  // Sound from field recorders and microphones.
  'audio/wav',
  'audio/x-wav',
  'audio/wave',
  'audio/vnd.wave',
  'audio/mpeg',
  'audio/mp4',
  'audio/x-m4a',
  'audio/aac',
  'audio/flac',
  'audio/x-flac',
  'audio/ogg',
  'audio/opus',
  'audio/webm',
  'audio/aiff',
  'audio/x-aiff',
  // Stills: reference photos, camera stills and raw files.
  'image/jpeg',
  'image/png',
  'image/webp',
  'image/heic',
  'image/heif',
  'image/avif',
  'image/tiff',
  'image/gif',
  'image/bmp',
  'image/x-adobe-dng',
  'image/x-canon-cr2',
  'image/x-canon-cr3',
  'image/x-nikon-nef',
  'image/x-sony-arw',
  'image/x-fuji-raf',
  'image/x-panasonic-rw2',
  'image/x-olympus-orf',
]);

/** Whether `type` (as the browser reports it; parameters and case ignored) is on the list. */
export function isAcceptedMediaType(type: string): boolean {
  const bare = type.split(';')[0]?.trim().toLowerCase() ?? '';
  // Parameters are refused outright rather than trusted: a clip's type has none worth keeping.
  if (bare !== type.trim().toLowerCase()) return false;
  return ACCEPTED_MEDIA_TYPES.has(bare);
}
