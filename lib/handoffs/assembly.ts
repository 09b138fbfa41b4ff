import { displayName } from '@/lib/clips/names';
import { frameRates, secondsToFrames, type FrameRate } from '@/lib/timecode';
import type { HandoffSnapshot, SnapshotClip, SnapshotSegment, SnapshotShot } from './snapshot';

// The version laid end to end, as the OTIO, the EDL, the CSV and the clip package all see it: per
// segment in running order, each shot's clips in shot order (a gap where a shot has no clip yet),
// then the segment's clips filed under no shot. Pure.

export type AssemblyClip = { kind: 'clip'; segment: SnapshotSegment; shot: SnapshotShot | null; clip: SnapshotClip; path: string; recordIn: number; frames: number };
export type AssemblyGap = { kind: 'gap'; segment: SnapshotSegment; shot: SnapshotShot | null; recordIn: number; frames: number };
export type AssemblyItem = AssemblyClip | AssemblyGap;
export type Assembly = {
  rate: FrameRate;
  items: AssemblyItem[];
  /** Record frame where each segment starts, by segment id. */
  segmentStarts: Map<string, number>;
  folders: { segment: SnapshotSegment; folder: string }[];
  totalFrames: number;
  /** Clips whose duration is unknown (ffprobe could not read them): packaged, but not on the timeline. */
  untimed: AssemblyClip[];
};

const pad2 = (n: number) => String(n).padStart(2, '0');

/** A file or folder name every common file system accepts (common practice, no published source). */
export function safeName(raw: string, max = 100): string {
  const name = displayName(raw)
    .replace(/[<>:"/\\|?*]/g, '-')
    .replace(/[. ]+$/, '')
    .slice(0, max)
    .trim();
  return name || 'untitled';
}

export const segmentFolder = (segment: SnapshotSegment): string => `${pad2(segment.number)} ${safeName(segment.title, 60)}`;

/** "S02 A001.mov" for a shot's clip, the plain name otherwise; " (2)" and on when a name repeats. */
function uniqueFileName(used: Set<string>, shot: SnapshotShot | null, clip: SnapshotClip): string {
  const base = `${shot ? `S${pad2(shot.number)} ` : ''}${safeName(clip.name)}`;
  let name = base;
  for (let n = 2; used.has(name.toLowerCase()); n++) {
    const dot = base.lastIndexOf('.');
    name = dot > 0 ? `${base.slice(0, dot)} (${n})${base.slice(dot)}` : `${base} (${n})`;
  }
  used.add(name.toLowerCase());
  return name;
}

export function buildAssembly(snapshot: HandoffSnapshot): Assembly {
  const rate = frameRates[snapshot.episode.frameRate];
  const items: AssemblyItem[] = [];
  const untimed: AssemblyClip[] = [];
  const segmentStarts = new Map<string, number>();
  const folders: Assembly['folders'] = [];
  let at = 0;
  for (const segment of snapshot.segments) {
    const folder = segmentFolder(segment);
    folders.push({ segment, folder });
    segmentStarts.set(segment.id, at);
    const used = new Set<string>();
    // A planned shot without a clip holds its share of the segment's forecast, at least a second.
    const gapFrames = secondsToFrames(Math.max(1, Math.round(segment.totalSeconds / Math.max(1, segment.shots.length))), rate);
    const addClip = (shot: SnapshotShot | null, clip: SnapshotClip) => {
      const path = `${folder}/${uniqueFileName(used, shot, clip)}`;
      const frames = clip.durationSeconds ? secondsToFrames(clip.durationSeconds, rate) : 0;
      const item: AssemblyClip = { kind: 'clip', segment, shot, clip, path, recordIn: at, frames };
      if (frames > 0) {
        items.push(item);
        at += frames;
      } else untimed.push(item);
    };
    for (const shot of segment.shots) {
      if (shot.clips.length === 0) {
        items.push({ kind: 'gap', segment, shot, recordIn: at, frames: gapFrames });
        at += gapFrames;
      }
      for (const clip of shot.clips) addClip(shot, clip);
    }
    for (const clip of segment.otherClips) addClip(null, clip);
    if (segment.shots.length === 0 && segment.otherClips.length === 0) {
      // Nothing planned yet: the segment keeps its forecast length so the running order stays readable.
      const frames = secondsToFrames(Math.max(1, segment.totalSeconds), rate);
      items.push({ kind: 'gap', segment, shot: null, recordIn: at, frames });
      at += frames;
    }
  }
  return { rate, items, segmentStarts, folders, totalFrames: at, untimed };
}

/** Every clip of the version with its path in the package, timed or not, in package order. */
export function packageClips(assembly: Assembly): AssemblyClip[] {
  const all = [...assembly.items.filter((i): i is AssemblyClip => i.kind === 'clip'), ...assembly.untimed];
  const order = new Map(assembly.folders.map((f, i) => [f.segment.id, i]));
  return all.sort((a, b) => order.get(a.segment.id)! - order.get(b.segment.id)! || a.path.localeCompare(b.path));
}

/** Every clip of the snapshot, in running order. */
export const clipsOfAll = (snapshot: HandoffSnapshot): SnapshotClip[] => snapshot.segments.flatMap((s) => [...s.shots.flatMap((sh) => sh.clips), ...s.otherClips]);
