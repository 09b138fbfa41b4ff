import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { forecastEpisode } from '@/lib/runtime';
import { checkDeliverable, checkDisclosure, checkLength, checkMustSay, checkPlacement, disclosureStartSeconds, findPhrase, tokenize, type PlacementRule } from '.';

describe('tokenize and findPhrase', () => {
  it('ignores case and punctuation and keeps whole words', () => {
    expect(tokenize('Use code KERF-10, at Bramblewick.test!')).toEqual(['use', 'code', 'kerf', '10', 'at', 'bramblewick', 'test']);
    const words = tokenize('Grab the Sharpline honing guide today.');
    expect(findPhrase(words, tokenize('sharpline HONING guide'))).toBe(2);
    // "line" is inside "Sharpline" but is not a whole word there.
    expect(findPhrase(words, tokenize('line'))).toBe(-1);
    expect(findPhrase(words, [])).toBe(-1);
  });

  it('treats composed and decomposed accents alike', () => {
    expect(findPhrase(tokenize('Le café est prêt'), tokenize('cafe\u0301'))).toBe(1);
  });
});

describe('checkPlacement (worked values)', () => {
  it.each<[number, number, PlacementRule, 'pass' | 'fail']>([
    [119, 900, { kind: 'starts_before', seconds: 120 }, 'pass'],
    [120, 900, { kind: 'starts_before', seconds: 120 }, 'fail'],
    // 25 % of 600 s is 150 s: a start at 150 s is still inside, 151 s is not.
    [150, 600, { kind: 'within_percent', percent: 25 }, 'pass'],
    [151, 600, { kind: 'within_percent', percent: 25 }, 'fail'],
    [0, 600, { kind: 'within_percent', percent: 1 }, 'pass'],
  ])('start %i s of %i s against %j is %s', (start, total, rule, status) => {
    expect(checkPlacement(start, total, rule).status).toBe(status);
  });

  it('says unknown without a rule or a runtime', () => {
    expect(checkPlacement(10, 100, null).status).toBe('unknown');
    expect(checkPlacement(0, 0, { kind: 'within_percent', percent: 50 }).status).toBe('unknown');
  });

  it('names the times in mm:ss', () => {
    expect(checkPlacement(185, 900, { kind: 'starts_before', seconds: 180 }).message).toBe('Read starts at 03:05; the deal asks for before 03:00.');
  });
});

describe('checkLength (worked values)', () => {
  it.each([
    [59, 60, 90, 'fail'],
    [60, 60, 90, 'pass'],
    [90, 60, 90, 'pass'],
    [91, 60, 90, 'fail'],
    [10, null, 90, 'pass'],
    [10, 30, null, 'fail'],
  ] as const)('%i s against %s–%s is %s', (seconds, min, max, status) => {
    expect(checkLength(seconds, { minSeconds: min, maxSeconds: max }).status).toBe(status);
  });
  it('is unknown with no range', () => {
    expect(checkLength(60, { minSeconds: null, maxSeconds: null }).status).toBe('unknown');
  });
});

describe('checkMustSay', () => {
  const script = 'This video is sponsored by Bramblewick. Use code KERF10 for ten percent off your first order!';
  it('passes when every phrase is said, whatever the case and punctuation', () => {
    expect(checkMustSay(script, ['code kerf10', 'Ten percent off', 'BRAMBLEWICK']).status).toBe('pass');
  });
  it('lists what is missing', () => {
    const r = checkMustSay(script, ['free shipping', 'first order', 'bramble']);
    expect(r.status).toBe('fail');
    expect(r.missing).toEqual(['free shipping', 'bramble']);
  });
  it('ignores blank phrases', () => {
    expect(checkMustSay(script, ['  ', '!!']).status).toBe('unknown');
  });
});

describe('checkDisclosure', () => {
  const filler = (n: number) => Array.from({ length: n }, () => 'plane').join(' ');
  it('finds the disclosure and says when it starts at the speaking rate', () => {
    // 75 words before it at 150 words per minute is 30 s: still inside the window.
    expect(disclosureStartSeconds(`${filler(75)} This video is sponsored by Bramblewick.`, 'this video is sponsored by Bramblewick', 150)).toBe(30);
    expect(checkDisclosure(`${filler(75)} This video is sponsored by Bramblewick.`, 'This video is sponsored by Bramblewick', 150).status).toBe('pass');
    // 78 words is 31.2 s, rounded to 31 s: too late.
    expect(checkDisclosure(`${filler(78)} This video is sponsored by Bramblewick.`, 'This video is sponsored by Bramblewick', 150).status).toBe('fail');
  });
  it('fails when the script does not say it', () => {
    expect(checkDisclosure('Thanks to our friends for the saw.', 'Sponsored by Bramblewick', 150)).toMatchObject({ status: 'fail', message: 'The disclosure is not in the spoken script.' });
  });
  it('is unknown when no wording is set', () => {
    expect(checkDisclosure('anything', ' ', 150).status).toBe('unknown');
  });
});

describe('checkDeliverable', () => {
  it('runs the four checks on the read, or says unknown without a segment', () => {
    const input = {
      episodeSeconds: 600,
      wordsPerMinute: 150,
      placement: { kind: 'starts_before', seconds: 120 } as const,
      range: { minSeconds: 60, maxSeconds: 90 },
      mustSay: ['code kerf10'],
      disclosure: 'sponsored by Bramblewick',
    };
    const results = checkDeliverable({ ...input, read: { startSeconds: 45, totalSeconds: 75, scriptText: 'Sponsored by Bramblewick. Use code KERF10.' } });
    expect(results.map((r) => [r.name, r.status])).toEqual([
      ['placement', 'pass'],
      ['length', 'pass'],
      ['mustSay', 'pass'],
      ['disclosure', 'pass'],
    ]);
    expect(checkDeliverable({ ...input, read: null }).every((r) => r.status === 'unknown')).toBe(true);
  });
});

describe('properties', () => {
  const rule = fc.oneof(
    fc.record({ kind: fc.constant('starts_before' as const), seconds: fc.integer({ min: 0, max: 36000 }) }),
    fc.record({ kind: fc.constant('within_percent' as const), percent: fc.integer({ min: 1, max: 100 }) }),
  );

  it('a later start never turns a failing placement into a pass', () => {
    fc.assert(
      fc.property(fc.integer({ min: 0, max: 36000 }), fc.integer({ min: 0, max: 36000 }), fc.integer({ min: 1, max: 36000 }), rule, (a, b, total, r) => {
        const [early, late] = a <= b ? [a, b] : [b, a];
        if (checkPlacement(early, total, r).status === 'fail') expect(checkPlacement(late, total, r).status).toBe('fail');
      }),
    );
  });

  it('moving the read later in the running order never makes a failing placement pass', () => {
    const segment = fc.record({ wordCount: fc.integer({ min: 0, max: 2000 }), actionSeconds: fc.integer({ min: 0, max: 1200 }) });
    fc.assert(
      fc.property(fc.array(segment, { minLength: 2, maxLength: 10 }), fc.nat(), fc.nat(), rule, (segs, from, to, r) => {
        const items = segs.map((s, i) => ({ ...s, id: `s${i}` }));
        const i = from % items.length;
        const j = i + (to % (items.length - i));
        const moved = [...items];
        const [read] = moved.splice(i, 1);
        moved.splice(j, 0, read!);
        const before = forecastEpisode(items, 150);
        const after = forecastEpisode(moved, 150);
        const startBefore = before.segments.find((s) => s.id === read!.id)!.startSeconds;
        const startAfter = after.segments.find((s) => s.id === read!.id)!.startSeconds;
        expect(after.totalSeconds).toBe(before.totalSeconds);
        if (checkPlacement(startBefore, before.totalSeconds, r).status === 'fail') {
          expect(checkPlacement(startAfter, after.totalSeconds, r).status).toBe('fail');
        }
      }),
    );
  });

  it('a phrase cut out of the script is always found in it', () => {
    fc.assert(
      fc.property(fc.array(fc.constantFrom('saw', 'Glue', 'clamp,', 'oak.', 'KERF', 'it’s'), { minLength: 1, maxLength: 30 }), fc.nat(), fc.nat(), (words, a, b) => {
        const i = a % words.length;
        const j = i + 1 + (b % (words.length - i));
        expect(checkMustSay(words.join(' '), [words.slice(i, j).join(' ')]).status).toBe('pass');
      }),
    );
  });
});
