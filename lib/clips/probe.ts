// Reads the JSON of `ffprobe -print_format json -show_format -show_streams` into what the clip list shows.
export type MediaInfo = {
  durationSeconds: number | null;
  width: number | null;
  height: number | null;
  frameRate: number | null;
  codec: string | null;
};

type Stream = { codec_type?: unknown; codec_name?: unknown; width?: unknown; height?: unknown; r_frame_rate?: unknown; avg_frame_rate?: unknown; duration?: unknown };

const num = (v: unknown): number | null => {
  const n = typeof v === 'number' ? v : typeof v === 'string' && v.trim() !== '' ? Number(v) : NaN;
  return Number.isFinite(n) && n > 0 ? n : null;
};

/** "30000/1001" -> 29.97…; "0/0" (no rate) -> null. */
export function parseRate(v: unknown): number | null {
  if (typeof v !== 'string') return null;
  const m = /^(\d+)(?:\/(\d+))?$/.exec(v.trim());
  if (!m) return null;
  const n = Number(m[1]);
  const d = m[2] === undefined ? 1 : Number(m[2]);
  return d > 0 && n > 0 ? n / d : null;
}

export function parseProbe(json: unknown): MediaInfo {
  const root = (json && typeof json === 'object' ? json : {}) as { streams?: unknown; format?: { duration?: unknown } };
  const streams = (Array.isArray(root.streams) ? root.streams : []) as Stream[];
  const video = streams.find((s) => s.codec_type === 'video');
  const audio = streams.find((s) => s.codec_type === 'audio');
  const main = video ?? audio;
  // A still image is a one-frame "video" stream; its rate is meaningless, its duration absent.
  return {
    durationSeconds: num(root.format?.duration) ?? num(main?.duration),
    width: num(video?.width),
    height: num(video?.height),
    frameRate: video ? (parseRate(video.avg_frame_rate) ?? parseRate(video.r_frame_rate)) : null,
    codec: typeof main?.codec_name === 'string' ? main.codec_name.slice(0, 60) : null,
  };
}
