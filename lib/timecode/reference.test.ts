import fc from 'fast-check';
import Timecode from 'smpte-timecode';
import { describe, expect, it } from 'vitest';
import { frameRateIds, frameRates, framesToTimecode, timecodeToFrames, type FrameRate } from '.';

// smpte-timecode 1.3.6 as an independent reference. Its traps (STACK-NOTES): without a rate it assumes
// 29.97 drop-frame, drop-frame at 25 throws, and at 23.976 drop-frame must be passed as false. So the
// rate and the drop-frame flag are always passed explicitly. It wraps a day at round(fps * 86400)
// frames, which differs from the labels of a non-drop fractional day, so frames stay under 20 hours.
const reference = (frames: number, rate: FrameRate) => Timecode(frames, [rate.num, rate.den], rate.dropFrame);
const MAX_FRAMES = 20 * 3600 * 24;

describe('lib/timecode against smpte-timecode', () => {
  it('gives the same timecode text for any frame at every rate', () => {
    fc.assert(
      fc.property(fc.constantFrom(...frameRateIds), fc.nat(MAX_FRAMES), (id, frames) => {
        const rate = frameRates[id];
        expect(framesToTimecode(frames, rate)).toBe(reference(frames, rate).toString());
      }),
      { numRuns: 5000 },
    );
  });

  it('reads timecode text to the same frame count', () => {
    fc.assert(
      fc.property(fc.constantFrom(...frameRateIds), fc.nat(MAX_FRAMES), (id, frames) => {
        const rate = frameRates[id];
        const text = reference(frames, rate).toString();
        expect(timecodeToFrames(text, rate)).toBe(Timecode(text, [rate.num, rate.den], rate.dropFrame).frameCount);
      }),
      { numRuns: 5000 },
    );
  });

  it('agrees around every drop-frame minute boundary of the first hour', () => {
    for (const id of ['29.97df', '59.94df'] as const) {
      const rate = frameRates[id];
      for (let minute = 1; minute < 60; minute++) {
        const start = timecodeToFrames(`00:${String(minute).padStart(2, '0')}:00;${rate.timebase === 30 ? '02' : '04'}`, rate);
        for (const frames of [start - 1, start, start + 1]) expect(framesToTimecode(frames, rate)).toBe(reference(frames, rate).toString());
      }
    }
  });
});
