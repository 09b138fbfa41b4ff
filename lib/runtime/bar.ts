/** One segment's slice of the runtime bar; offset and width are fractions (0..1) of the bar's scale. */
export type BarSlice = { id: string; seconds: number; offset: number; width: number };
export type RuntimeBarLayout = {
  totalSeconds: number;
  /** The bar's full length: the longer of the forecast and the target, so both fit. */
  scaleSeconds: number;
  slices: BarSlice[];
  /** Where the target falls on the bar (0..1), or null without a target or anything to scale. */
  targetAt: number | null;
};

export function layoutRuntimeBar(
  segments: readonly { id: string; totalSeconds: number }[],
  targetSeconds: number | null,
): RuntimeBarLayout {
  const seconds = segments.map((s) => ({ id: s.id, seconds: Math.max(0, s.totalSeconds) }));
  const totalSeconds = seconds.reduce((sum, s) => sum + s.seconds, 0);
  const target = targetSeconds !== null && targetSeconds > 0 ? targetSeconds : null;
  const scaleSeconds = Math.max(totalSeconds, target ?? 0);
  const slices: BarSlice[] = [];
  let start = 0;
  for (const s of seconds) {
    // A segment with no time has no width; leaving it out keeps the separators from stacking up.
    if (s.seconds > 0) slices.push({ id: s.id, seconds: s.seconds, offset: start / scaleSeconds, width: s.seconds / scaleSeconds });
    start += s.seconds;
  }
  return { totalSeconds, scaleSeconds, slices, targetAt: target !== null ? target / scaleSeconds : null };
}

export type TargetStatus =
  | { kind: 'no_target' }
  | { kind: 'on_target' }
  /** A target but nothing forecast yet: no verdict, since "under target" would read as good news. */
  | { kind: 'empty' }
  | { kind: 'over'; bySeconds: number }
  | { kind: 'under'; bySeconds: number };

export function compareToTarget(totalSeconds: number, targetSeconds: number | null): TargetStatus {
  if (targetSeconds === null || targetSeconds <= 0) return { kind: 'no_target' };
  if (Math.round(totalSeconds) <= 0) return { kind: 'empty' };
  const diff = Math.round(totalSeconds) - Math.round(targetSeconds);
  if (diff > 0) return { kind: 'over', bySeconds: diff };
  if (diff < 0) return { kind: 'under', bySeconds: -diff };
  return { kind: 'on_target' };
}
