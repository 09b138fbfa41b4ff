import type { FrameRate } from './rates';

// Frames <-> SMPTE timecode. Source: SMPTE ST 12-1:2014 §4.2.2 (drop-frame): at 30000/1001 the frame
// numbers 00 and 01 are skipped at the start of every minute except minutes 00, 10, 20, 30, 40, 50;
// at 60000/1001 the numbers 00 to 03 are skipped likewise.

export class TimecodeError extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'TimecodeError';
  }
}

const HOURS_PER_DAY = 24;

/** Frame labels skipped per minute: 2 at a timebase of 30, 4 at 60, 0 without drop-frame. */
const droppedPerMinute = (rate: FrameRate): number => (rate.dropFrame ? rate.timebase / 15 : 0);

/** Frames in one 24-hour timecode day at this rate; frame counts wrap here. */
export function framesPerDay(rate: FrameRate): number {
  const drop = droppedPerMinute(rate);
  const minutes = HOURS_PER_DAY * 60;
  return minutes * 60 * rate.timebase - drop * (minutes - minutes / 10);
}

export type TimecodeParts = { hours: number; minutes: number; seconds: number; frames: number };

const pad = (n: number) => String(n).padStart(2, '0');

/** The separator before the frames field: ';' marks drop-frame (common practice, no published source). */
export const frameSeparator = (rate: FrameRate): string => (rate.dropFrame ? ';' : ':');

export function framesToParts(frameCount: number, rate: FrameRate): TimecodeParts {
  if (!Number.isInteger(frameCount) || frameCount < 0 || frameCount >= framesPerDay(rate)) {
    throw new TimecodeError(`Frame ${frameCount} is outside one day of timecode.`);
  }
  const tb = rate.timebase;
  let f = frameCount;
  const drop = droppedPerMinute(rate);
  if (drop > 0) {
    const per10 = tb * 600 - drop * 9;
    const perMinute = tb * 60 - drop;
    const tens = Math.floor(f / per10);
    const rest = f % per10;
    // The first minute of each ten keeps all its labels; each later one skips `drop` of them.
    const skipped = rest < drop ? 0 : drop * Math.floor((rest - drop) / perMinute);
    f += 9 * drop * tens + skipped;
  }
  return {
    hours: Math.floor(f / (tb * 3600)),
    minutes: Math.floor(f / (tb * 60)) % 60,
    seconds: Math.floor(f / tb) % 60,
    frames: f % tb,
  };
}

export function formatTimecode(parts: TimecodeParts, rate: FrameRate): string {
  return `${pad(parts.hours)}:${pad(parts.minutes)}:${pad(parts.seconds)}${frameSeparator(rate)}${pad(parts.frames)}`;
}

/** Frame count to "HH:MM:SS:FF" (or "HH:MM:SS;FF" at a drop-frame rate). */
export function framesToTimecode(frameCount: number, rate: FrameRate): string {
  return formatTimecode(framesToParts(frameCount, rate), rate);
}

export function partsToFrames(parts: TimecodeParts, rate: FrameRate): number {
  const { hours, minutes, seconds, frames } = parts;
  const tb = rate.timebase;
  const drop = droppedPerMinute(rate);
  if (![hours, minutes, seconds, frames].every(Number.isInteger) || hours < 0 || hours >= HOURS_PER_DAY || minutes < 0 || minutes > 59) {
    throw new TimecodeError('Hours run 00–23 and minutes 00–59.');
  }
  if (seconds < 0 || seconds > 59) throw new TimecodeError('Seconds run 00–59.');
  if (frames < 0 || frames >= tb) throw new TimecodeError(`Frames run 00–${pad(tb - 1)} at this rate.`);
  if (drop > 0 && seconds === 0 && minutes % 10 !== 0 && frames < drop) {
    throw new TimecodeError(`At drop-frame, ${pad(minutes)}:00;${pad(frames)} is skipped; the minute starts at ;${pad(drop)}.`);
  }
  const totalMinutes = hours * 60 + minutes;
  return ((hours * 60 + minutes) * 60 + seconds) * tb + frames - drop * (totalMinutes - Math.floor(totalMinutes / 10));
}

const timecodePattern = /^(\d{1,2})[:.;](\d{2})[:.;](\d{2})[:.;,](\d{2,3})$/;

/** Parses "HH:MM:SS:FF" or "HH:MM:SS;FF" (the separators are not trusted: the rate decides). */
export function timecodeToFrames(text: string, rate: FrameRate): number {
  const match = timecodePattern.exec(text.trim());
  if (!match) throw new TimecodeError('Write a timecode like 00:01:00:00.');
  const [hours, minutes, seconds, frames] = match.slice(1, 5).map(Number) as [number, number, number, number];
  return partsToFrames({ hours, minutes, seconds, frames }, rate);
}

/** Whole frames at or before a time in seconds. */
export const secondsToFrames = (seconds: number, rate: FrameRate): number => Math.floor((seconds * rate.num) / rate.den + 1e-9);

export const framesToSeconds = (frames: number, rate: FrameRate): number => (frames * rate.den) / rate.num;

/**
 * A media player's current time (HTMLMediaElement.currentTime, seconds as a double) as a timecode.
 * A player parked on a frame reports that frame's start time, which double arithmetic can put a hair
 * below the exact value (60.0599999… for frame 1800 at 29.97); a thousandth of a frame of slack keeps
 * such a time on its frame without ever reaching the next one. Negative or non-finite times read as 0.
 */
export function playerTimeToTimecode(seconds: number, rate: FrameRate): string {
  const time = Number.isFinite(seconds) && seconds > 0 ? seconds : 0;
  return framesToTimecode(Math.floor((time * rate.num) / rate.den + 1e-3), rate);
}
