import { framesPerDay, framesToTimecode, timecodeToFrames } from '@/lib/timecode';
import type { Assembly } from './assembly';
import type { HandoffSnapshot } from './snapshot';

// CMX 3600 EDL, one event per timed clip, cuts only. Columns (From memory: the CMX 3600 layout as
// written by common editing tools): event number 1-3, reel 6-13, track 15-19, transition 21-28,
// then source in, source out, record in, record out, space separated. Record time starts at
// 01:00:00:00 (common practice, no published source). Reel "AX" marks a source that is a file, named
// by the "* FROM CLIP NAME:" and "* SOURCE FILE:" comments that follow the event.

export const EDL_RECORD_START_HOURS = 1;

const sanitizeComment = (s: string) => s.replace(/[\r\n]+/g, ' ');

export function buildEdl(snapshot: HandoffSnapshot, assembly: Assembly): string {
  const rate = assembly.rate;
  const day = framesPerDay(rate);
  const offset = timecodeToFrames(`0${EDL_RECORD_START_HOURS}:00:00:00`, rate);
  const tc = (frames: number) => framesToTimecode(frames % day, rate);
  const title = sanitizeComment(`${snapshot.episode.title} v${snapshot.version}`).slice(0, 70);
  const lines = [`TITLE: ${title}`, `FCM: ${rate.dropFrame ? 'DROP FRAME' : 'NON-DROP FRAME'}`, ''];
  let event = 0;
  for (const item of assembly.items) {
    if (item.kind !== 'clip') continue;
    // The event column has three digits; a longer list counts on from 001 (From memory: how common tools wrap).
    event = (event % 999) + 1;
    const recIn = offset + item.recordIn;
    lines.push(
      `${String(event).padStart(3, '0')}  ${'AX'.padEnd(8)} ${'V'.padEnd(5)} ${'C'.padEnd(8)} ${tc(0)} ${tc(item.frames)} ${tc(recIn)} ${tc(recIn + item.frames)}`,
      `* FROM CLIP NAME: ${sanitizeComment(item.clip.name)}`,
      `* SOURCE FILE: ${sanitizeComment(item.path)}`,
      '',
    );
  }
  return lines.join('\n');
}
