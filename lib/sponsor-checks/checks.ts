import { formatDuration } from '@/lib/runtime';
import { findPhrase, tokenize } from './words';

export type PlacementRule = { kind: 'starts_before'; seconds: number } | { kind: 'within_percent'; percent: number };
export type ReadRange = { minSeconds: number | null; maxSeconds: number | null };
export type CheckStatus = 'pass' | 'fail' | 'unknown';
export type CheckName = 'placement' | 'length' | 'mustSay' | 'disclosure';
export type CheckResult = { name: CheckName; status: CheckStatus; message: string; missing?: string[] };

/** The disclosure must be spoken within this many seconds of the read's speech. */
export const DISCLOSURE_WINDOW_SECONDS = 30;

// Source: US FTC, "Disclosures 101 for Social Media Influencers" (November 2019): in a video the
// disclosure belongs in the video itself, said clearly, not only in the description.
export const DISCLOSURE_CAUTION =
  'Following the US FTC’s “Disclosures 101 for Social Media Influencers” (2019): say the disclosure in the video, clearly, not only in the description. This is not legal advice, and rules differ by country.';

/**
 * Where the read starts against the rule. `startSeconds` is the read segment's forecast start and
 * `episodeSeconds` the episode's forecast runtime, both from lib/runtime's forecastEpisode.
 */
export function checkPlacement(startSeconds: number, episodeSeconds: number, rule: PlacementRule | null): CheckResult {
  if (!rule) return { name: 'placement', status: 'unknown', message: 'No placement rule set.' };
  if (rule.kind === 'starts_before') {
    const ok = startSeconds < rule.seconds;
    return {
      name: 'placement',
      status: ok ? 'pass' : 'fail',
      message: `Read starts at ${formatDuration(startSeconds)}; the deal asks for before ${formatDuration(rule.seconds)}.`,
    };
  }
  if (episodeSeconds <= 0) return { name: 'placement', status: 'unknown', message: 'The episode has no runtime forecast yet.' };
  // Integer comparison, so 25 % of 100 s admits a start at exactly 25 s and float rounding never decides.
  const ok = startSeconds * 100 <= rule.percent * episodeSeconds;
  const limit = Math.floor((rule.percent * episodeSeconds) / 100);
  return {
    name: 'placement',
    status: ok ? 'pass' : 'fail',
    message: `Read starts at ${formatDuration(startSeconds)}; the first ${rule.percent} % of ${formatDuration(episodeSeconds)} ends at ${formatDuration(limit)}.`,
  };
}

export function checkLength(readSeconds: number, range: ReadRange): CheckResult {
  const { minSeconds: min, maxSeconds: max } = range;
  if (min === null && max === null) return { name: 'length', status: 'unknown', message: 'No read length set.' };
  const ok = (min === null || readSeconds >= min) && (max === null || readSeconds <= max);
  const wanted = min !== null && max !== null ? `${min}–${max} s` : min !== null ? `at least ${min} s` : `at most ${max} s`;
  return { name: 'length', status: ok ? 'pass' : 'fail', message: `Read runs ${readSeconds} s; the deal asks for ${wanted}.` };
}

export function checkMustSay(scriptText: string, phrases: readonly string[]): CheckResult {
  const wanted = phrases.filter((p) => tokenize(p).length > 0);
  if (wanted.length === 0) return { name: 'mustSay', status: 'unknown', message: 'No must-say phrases set.' };
  const words = tokenize(scriptText);
  const missing = wanted.filter((p) => findPhrase(words, tokenize(p)) < 0);
  return missing.length === 0
    ? { name: 'mustSay', status: 'pass', message: `All ${wanted.length} must-say phrases are in the script.` }
    : { name: 'mustSay', status: 'fail', message: `Missing from the script: ${missing.map((m) => `“${m}”`).join(', ')}.`, missing };
}

/** Seconds of speech before the disclosure starts, at the channel's speaking rate; null when absent. */
export function disclosureStartSeconds(scriptText: string, disclosure: string, wordsPerMinute: number): number | null {
  const at = findPhrase(tokenize(scriptText), tokenize(disclosure));
  if (at < 0) return null;
  return Math.round((at * 60) / wordsPerMinute);
}

export function checkDisclosure(scriptText: string, disclosure: string, wordsPerMinute: number): CheckResult {
  if (tokenize(disclosure).length === 0) return { name: 'disclosure', status: 'unknown', message: 'No disclosure wording set.' };
  const start = disclosureStartSeconds(scriptText, disclosure, wordsPerMinute);
  if (start === null) return { name: 'disclosure', status: 'fail', message: 'The disclosure is not in the spoken script.' };
  const ok = start <= DISCLOSURE_WINDOW_SECONDS;
  return {
    name: 'disclosure',
    status: ok ? 'pass' : 'fail',
    message: ok
      ? `Disclosure is said ${start} s into the read.`
      : `Disclosure comes ${start} s into the read; say it within the first ${DISCLOSURE_WINDOW_SECONDS} s.`,
  };
}

export type DeliverableCheckInput = {
  /** The read segment's forecast; null when the deliverable names no segment. */
  read: { startSeconds: number; totalSeconds: number; scriptText: string } | null;
  episodeSeconds: number;
  wordsPerMinute: number;
  placement: PlacementRule | null;
  range: ReadRange;
  mustSay: readonly string[];
  disclosure: string;
};

/** All four checks of a spoken deliverable, in the order the deal page shows them. */
export function checkDeliverable(input: DeliverableCheckInput): CheckResult[] {
  const { read } = input;
  if (!read) {
    const message = 'Pick the segment that carries the read to check it.';
    return (['placement', 'length', 'mustSay', 'disclosure'] as const).map((name) => ({ name, status: 'unknown', message }));
  }
  return [
    checkPlacement(read.startSeconds, input.episodeSeconds, input.placement),
    checkLength(read.totalSeconds, input.range),
    checkMustSay(read.scriptText, input.mustSay),
    checkDisclosure(read.scriptText, input.disclosure, input.wordsPerMinute),
  ];
}
