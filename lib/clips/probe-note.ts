/**
 * What a person reads when ffprobe or ffmpeg fails on a clip: plain words, never the tools' own
 * output (format names, "[mov,mp4,… @ 0x5581…]" prefixes, the server's file paths). The full
 * output goes to the server log for whoever runs the server.
 */
export const PROBE_UNREADABLE =
  'The server could not read this file as video, sound or a picture. It may be damaged or in a format the server does not know.';
export const PROBE_CUT_OFF =
  'This recording looks cut off (its index is missing), as happens when a camera stops mid-write. Try copying the file from the card again.';
export const PROBE_NOT_OPENED = 'The server could not open the stored file. Try uploading it again.';
export const POSTER_FAILED = 'No poster frame could be made from this file; it still plays and downloads as uploaded.';

// From memory: messages ffmpeg 5–7 print for these cases (libavformat's "moov atom not found" for
// MP4/MOV without an index, "Invalid data found when processing input" for AVERROR_INVALIDDATA).
export function probeFailureNote(output: string): string {
  if (/moov atom not found/i.test(output)) return PROBE_CUT_OFF;
  if (/no such file|permission denied/i.test(output)) return PROBE_NOT_OPENED;
  return PROBE_UNREADABLE;
}
