import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { countWords, forecastEpisode, formatDuration, parseDuration, spokenSeconds } from '.';

describe('countWords', () => {
  it.each([
    ['', 0],
    ['   \n\t ', 0],
    ['— … !? , .', 0],
    ["Don't skip the half-lap.", 4],
    ['Rip a 2x4 to 1-1/2 wide.', 7],
    ['Glue-up, clamp, wait; then plane.', 5],
    ['Ça coûte 12 €', 3],
    ['rock’n’roll', 1],
    ['word-', 1],
    ['-word', 1],
  ])('%j has %i words', (text, n) => {
    expect(countWords(text)).toBe(n);
  });

  it('counts a huge script without trouble', () => {
    expect(countWords('cut '.repeat(200_000))).toBe(200_000);
  });
});

describe('spokenSeconds', () => {
  // Worked values at the default 150 words per minute (common practice, no published source).
  it.each([
    [300, 150, 120],
    [150, 150, 60],
    [0, 150, 0],
    [1, 150, 0], // 0.4 s rounds to 0
    [2, 150, 1], // 0.8 s rounds to 1
    [1000, 200, 300],
  ])('%i words at %i wpm = %i s', (words, wpm, seconds) => {
    expect(spokenSeconds(words, wpm)).toBe(seconds);
  });
  it('refuses a speaking rate of zero', () => {
    expect(() => spokenSeconds(10, 0)).toThrow(RangeError);
  });
});

describe('forecastEpisode', () => {
  it('gives start, spoken, action and total per segment in running order', () => {
    const f = forecastEpisode(
      [
        { id: 'open', wordCount: 75, actionSeconds: 5 },
        { id: 'build', wordCount: 300, actionSeconds: 90 },
        { id: 'outro', wordCount: 0, actionSeconds: 0 },
      ],
      150,
    );
    expect(f.segments).toEqual([
      { id: 'open', startSeconds: 0, spokenSeconds: 30, actionSeconds: 5, totalSeconds: 35 },
      { id: 'build', startSeconds: 35, spokenSeconds: 120, actionSeconds: 90, totalSeconds: 210 },
      { id: 'outro', startSeconds: 245, spokenSeconds: 0, actionSeconds: 0, totalSeconds: 0 },
    ]);
    expect(f.totalSeconds).toBe(245);
  });

  it('is empty for an empty episode', () => {
    expect(forecastEpisode([], 150)).toEqual({ segments: [], totalSeconds: 0 });
  });

  const segments = fc.array(
    fc.record({ id: fc.uuid(), wordCount: fc.nat({ max: 20_000 }), actionSeconds: fc.nat({ max: 3600 }) }),
    { maxLength: 40 },
  );
  const wpm = fc.integer({ min: 60, max: 300 });

  it('the total is the sum of its parts, and each start is the sum of what comes before', () => {
    fc.assert(
      fc.property(segments, wpm, (segs, rate) => {
        const f = forecastEpisode(segs, rate);
        expect(f.totalSeconds).toBe(f.segments.reduce((t, s) => t + s.totalSeconds, 0));
        let start = 0;
        for (const s of f.segments) {
          expect(s.startSeconds).toBe(start);
          expect(s.totalSeconds).toBe(s.spokenSeconds + s.actionSeconds);
          start += s.totalSeconds;
        }
      }),
    );
  });

  it('reordering changes the starts, not the total', () => {
    fc.assert(
      fc.property(segments, wpm, fc.nat(), (segs, rate, seed) => {
        const shuffled = [...segs].sort((a, b) => ((a.id.charCodeAt(seed % 36) || 0) - (b.id.charCodeAt(seed % 36) || 0)));
        expect(forecastEpisode(shuffled, rate).totalSeconds).toBe(forecastEpisode(segs, rate).totalSeconds);
      }),
    );
  });
});

describe('durations', () => {
  it.each([
    [0, '00:00'],
    [95, '01:35'],
    [600, '10:00'],
    [3725, '1:02:05'],
  ])('%i s prints as %s', (s, text) => {
    expect(formatDuration(s)).toBe(text);
  });
  it.each([
    ['12:30', 750],
    ['0:45', 45],
    ['90', 90],
    ['1:02:05', 3725],
    ['75:00', 4500],
    ['12:60', null],
    ['1:75:00', null],
    ['abc', null],
    ['-5', null],
    ['', null],
  ])('%j reads as %s', (text, s) => {
    expect(parseDuration(text)).toBe(s);
  });
  it('round-trips', () => {
    fc.assert(
      fc.property(fc.nat({ max: 36_000 }), (s) => {
        expect(parseDuration(formatDuration(s))).toBe(s);
      }),
    );
  });
});
