import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { frameRateIds, frameRates, framesPerDay, framesToSeconds, framesToTimecode, nearestFrameRate, playerTimeToTimecode, secondsToFrames, TimecodeError, timecodeToFrames } from '.';

const df2997 = frameRates['29.97df'];
const df5994 = frameRates['59.94df'];

describe('drop-frame worked values', () => {
  // Source: SMPTE ST 12-1:2014 §4.2.2 and its worked examples, as quoted in issue 14.
  it.each([
    [df2997, 1800, '00:01:00;02'],
    [df2997, 17982, '00:10:00;00'],
    [df2997, 107892, '01:00:00;00'],
    [df5994, 3600, '00:01:00;04'],
  ])('frame %#: %i is %s and back', (rate, frames, tc) => {
    expect(framesToTimecode(frames, rate)).toBe(tc);
    expect(timecodeToFrames(tc, rate)).toBe(frames);
  });

  it('skips ;00 and ;01 at the start of minute 1 but not minute 10', () => {
    expect(framesToTimecode(1799, df2997)).toBe('00:00:59;29');
    expect(framesToTimecode(1800, df2997)).toBe('00:01:00;02');
    expect(framesToTimecode(17981, df2997)).toBe('00:09:59;29');
    expect(framesToTimecode(17982, df2997)).toBe('00:10:00;00');
    expect(framesToTimecode(17983, df2997)).toBe('00:10:00;01');
  });

  it('refuses the labels drop-frame skips', () => {
    expect(() => timecodeToFrames('00:01:00;00', df2997)).toThrow(TimecodeError);
    expect(() => timecodeToFrames('00:01:00;01', df2997)).toThrow(TimecodeError);
    expect(() => timecodeToFrames('00:01:00;03', df5994)).toThrow(TimecodeError);
    expect(timecodeToFrames('00:10:00;00', df2997)).toBe(17982);
  });

  it('a drop-frame hour is 3.6 frames short of 108000, a day is 2 589 408 frames', () => {
    // Source: SMPTE ST 12-1:2014 §4.2.2 (108 labels dropped per hour at 30000/1001).
    expect(timecodeToFrames('01:00:00;00', df2997)).toBe(108000 - 108);
    expect(framesPerDay(df2997)).toBe(2_589_408);
    expect(framesPerDay(frameRates['25'])).toBe(25 * 86400);
  });
});

describe('non-drop rates', () => {
  it.each([
    ['24', 86400, '01:00:00:00'],
    ['25', 90000, '01:00:00:00'],
    ['23.976', 24 * 61 + 5, '00:01:01:05'],
    ['29.97ndf', 1800, '00:01:00:00'],
    ['50', 51, '00:00:01:01'],
    ['59.94ndf', 3600, '00:01:00:00'],
    ['60', 60 * 3600, '01:00:00:00'],
  ] as const)('%s: %i is %s', (id, frames, tc) => {
    expect(framesToTimecode(frames, frameRates[id])).toBe(tc);
    expect(timecodeToFrames(tc, frameRates[id])).toBe(frames);
  });

  it('refuses a frame number the rate does not have and text that is not timecode', () => {
    expect(() => timecodeToFrames('00:00:00:25', frameRates['25'])).toThrow(TimecodeError);
    expect(() => timecodeToFrames('00:60:00:00', frameRates['25'])).toThrow(TimecodeError);
    expect(() => timecodeToFrames('one minute', frameRates['25'])).toThrow(TimecodeError);
    expect(() => framesToTimecode(-1, frameRates['25'])).toThrow(TimecodeError);
    expect(() => framesToTimecode(1.5, frameRates['25'])).toThrow(TimecodeError);
    expect(() => framesToTimecode(framesPerDay(frameRates['25']), frameRates['25'])).toThrow(TimecodeError);
  });
});

describe('properties', () => {
  it('frames -> timecode -> frames is the identity at every rate', () => {
    fc.assert(
      fc.property(fc.constantFrom(...frameRateIds), fc.double({ min: 0, max: 1, maxExcluded: true, noNaN: true }), (id, at) => {
        const rate = frameRates[id];
        const frames = Math.floor(at * framesPerDay(rate));
        expect(timecodeToFrames(framesToTimecode(frames, rate), rate)).toBe(frames);
      }),
      { numRuns: 2000 },
    );
  });

  it('consecutive frames give increasing timecode text', () => {
    fc.assert(
      fc.property(fc.constantFrom(...frameRateIds), fc.nat(framesPerDay(frameRates['23.976']) - 2), (id, frames) => {
        const rate = frameRates[id];
        expect(framesToTimecode(frames + 1, rate) > framesToTimecode(frames, rate)).toBe(true);
      }),
      { numRuns: 2000 },
    );
  });
});

describe('seconds', () => {
  it('converts at the exact fractional rate', () => {
    expect(secondsToFrames(1001 / 30000, df2997)).toBe(1);
    expect(secondsToFrames(60, df2997)).toBe(1798);
    expect(framesToSeconds(30000, df2997)).toBeCloseTo(1001, 9);
  });

  it("turns a player's current time into the timecode of the frame on screen", () => {
    // Source: SMPTE ST 12-1 worked value, frame 1800 at 29.97 DF = 00:01:00;02; its start is 1800 × 1001 / 30000 s.
    expect(playerTimeToTimecode((1800 * 1001) / 30000, df2997)).toBe('00:01:00;02');
    expect(playerTimeToTimecode(60.06 - 1e-9, df2997)).toBe('00:01:00;02');
    // Half a frame later is still that frame; a whole frame later is the next.
    expect(playerTimeToTimecode((1800.5 * 1001) / 30000, df2997)).toBe('00:01:00;02');
    expect(playerTimeToTimecode((1801 * 1001) / 30000, df2997)).toBe('00:01:00;03');
    expect(playerTimeToTimecode(1.5, frameRates['25'])).toBe('00:00:01:12');
    expect(playerTimeToTimecode(0, frameRates['24'])).toBe('00:00:00:00');
    expect(playerTimeToTimecode(Number.NaN, frameRates['24'])).toBe('00:00:00:00');
    expect(playerTimeToTimecode(-3, frameRates['24'])).toBe('00:00:00:00');
  });

  it('maps a probed rate to the nearest listed rate', () => {
    expect(nearestFrameRate(29.97).id).toBe('29.97df');
    expect(nearestFrameRate(29.97, false).id).toBe('29.97ndf');
    expect(nearestFrameRate(23.976023).id).toBe('23.976');
    expect(nearestFrameRate(25).id).toBe('25');
  });
});
