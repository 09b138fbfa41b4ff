/** Whole seconds of speech for a word count at a speaking rate (words per minute). */
export function spokenSeconds(words: number, wordsPerMinute: number): number {
  if (!Number.isFinite(words) || words <= 0) return 0;
  if (!Number.isFinite(wordsPerMinute) || wordsPerMinute <= 0) throw new RangeError('wordsPerMinute must be positive');
  return Math.round((words * 60) / wordsPerMinute);
}

export type ForecastInput = { id: string; wordCount: number; actionSeconds: number };
export type SegmentForecast = { id: string; startSeconds: number; spokenSeconds: number; actionSeconds: number; totalSeconds: number };
export type EpisodeForecast = { segments: SegmentForecast[]; totalSeconds: number };

/** Per segment in running order: where it starts, how long it speaks, how long it runs; plus the episode total. */
export function forecastEpisode(segments: readonly ForecastInput[], wordsPerMinute: number): EpisodeForecast {
  let start = 0;
  const out: SegmentForecast[] = [];
  for (const s of segments) {
    const spoken = spokenSeconds(s.wordCount, wordsPerMinute);
    const action = Math.max(0, Math.round(s.actionSeconds));
    const total = spoken + action;
    out.push({ id: s.id, startSeconds: start, spokenSeconds: spoken, actionSeconds: action, totalSeconds: total });
    start += total;
  }
  return { segments: out, totalSeconds: start };
}
