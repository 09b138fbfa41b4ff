/** 95 -> "01:35"; an hour or more -> "1:02:05". */
export function formatDuration(totalSeconds: number): string {
  const s = Math.max(0, Math.round(totalSeconds));
  const h = Math.floor(s / 3600);
  const m = Math.floor((s % 3600) / 60);
  const sec = s % 60;
  const pad = (n: number) => String(n).padStart(2, '0');
  return h > 0 ? `${h}:${pad(m)}:${pad(sec)}` : `${pad(m)}:${pad(sec)}`;
}

/** Reads "mm:ss", "m:ss", "h:mm:ss" or plain seconds; null when it is not a duration. */
export function parseDuration(text: string): number | null {
  const t = text.trim();
  if (/^\d+$/.test(t)) return Number(t);
  const m = /^(?:(\d+):)?(\d{1,3}):([0-5]\d)$/.exec(t);
  if (!m) return null;
  const [, h, min, sec] = m;
  if (h !== undefined && Number(min) > 59) return null;
  return Number(h ?? 0) * 3600 + Number(min) * 60 + Number(sec);
}
