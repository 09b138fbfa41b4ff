// The frame rates an episode may be edited at. Fractional rates are exactly N*1000/1001.
// Source: SMPTE ST 12-1:2014 §4 (time address), and ITU-R BT.1700 / SMPTE ST 12-1 for 30000/1001.
export const frameRateIds = ['23.976', '24', '25', '29.97df', '29.97ndf', '30', '50', '59.94df', '59.94ndf', '60'] as const;
export type FrameRateId = (typeof frameRateIds)[number];

export type FrameRate = {
  id: FrameRateId;
  label: string;
  /** Frames per second as a fraction: rate = num / den. */
  num: number;
  den: number;
  /** Frame labels per second of timecode (the nominal rate): 24, 25, 30, 50 or 60. */
  timebase: number;
  dropFrame: boolean;
};

const fr = (id: FrameRateId, label: string, timebase: number, fractional: boolean, dropFrame = false): FrameRate => ({
  id,
  label,
  num: fractional ? timebase * 1000 : timebase,
  den: fractional ? 1001 : 1,
  timebase,
  dropFrame,
});

export const frameRates: Record<FrameRateId, FrameRate> = {
  '23.976': fr('23.976', '23.976', 24, true),
  '24': fr('24', '24', 24, false),
  '25': fr('25', '25', 25, false),
  '29.97df': fr('29.97df', '29.97 drop-frame', 30, true, true),
  '29.97ndf': fr('29.97ndf', '29.97 non-drop', 30, true),
  '30': fr('30', '30', 30, false),
  '50': fr('50', '50', 50, false),
  '59.94df': fr('59.94df', '59.94 drop-frame', 60, true, true),
  '59.94ndf': fr('59.94ndf', '59.94 non-drop', 60, true),
  '60': fr('60', '60', 60, false),
};

export const isFrameRateId = (value: unknown): value is FrameRateId =>
  typeof value === 'string' && (frameRateIds as readonly string[]).includes(value);

/** Frames per second as a number (for display and for seconds <-> frames). */
export const framesPerSecond = (rate: FrameRate): number => rate.num / rate.den;

/** The frame rate nearest to a probed rate, for clips whose rate ffprobe reported as a float. */
export function nearestFrameRate(fps: number, preferDropFrame = true): FrameRate {
  let best: FrameRate = frameRates['25'];
  let bestGap = Infinity;
  for (const id of frameRateIds) {
    const rate = frameRates[id];
    if (rate.den === 1001 && rate.timebase !== 24 && rate.dropFrame !== preferDropFrame) continue;
    const gap = Math.abs(framesPerSecond(rate) - fps);
    if (gap < bestGap) {
      best = rate;
      bestGap = gap;
    }
  }
  return best;
}
