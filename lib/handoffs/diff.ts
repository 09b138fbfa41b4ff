import { diffArrays, diffWords } from 'diff';
import type { ShotState } from '@/lib/shots/catalog';
import { clipsOfSegment, type HandoffSnapshot } from './snapshot';

// What changed between two locked versions. Pure. Word-level script changes come from the `diff`
// package (Myers' O(ND) algorithm), as does the order comparison that finds moved segments.

export type WordPart = { text: string; change: 'same' | 'added' | 'removed' };
export type SegmentRef = { id: string; title: string; number: number };

export type HandoffDiff = {
  from: number;
  to: number;
  segmentsAdded: SegmentRef[];
  segmentsRemoved: SegmentRef[];
  /** Segments in both whose place among the others changed; number is the new place. */
  segmentsMoved: (SegmentRef & { fromNumber: number })[];
  scripts: { segment: SegmentRef; words: WordPart[] }[];
  shotsAdded: { segmentTitle: string; id: string; description: string }[];
  shotsRemoved: { segmentTitle: string; id: string; description: string }[];
  shotsChanged: { segmentTitle: string; id: string; description: string; fromState: ShotState; toState: ShotState }[];
  clipsAdded: { segmentTitle: string; id: string; name: string }[];
  clipsRemoved: { segmentTitle: string; id: string; name: string }[];
  unchanged: boolean;
};

const ref = (s: { id: string; title: string; number: number }): SegmentRef => ({ id: s.id, title: s.title, number: s.number });

export function diffWordsOf(before: string, after: string): WordPart[] {
  return diffWords(before, after).map((p) => ({ text: p.value, change: p.added ? 'added' : p.removed ? 'removed' : 'same' }));
}

export function diffHandoffs(a: HandoffSnapshot, b: HandoffSnapshot): HandoffDiff {
  const aSeg = new Map(a.segments.map((s) => [s.id, s]));
  const bSeg = new Map(b.segments.map((s) => [s.id, s]));
  const segmentsAdded = b.segments.filter((s) => !aSeg.has(s.id)).map(ref);
  const segmentsRemoved = a.segments.filter((s) => !bSeg.has(s.id)).map(ref);

  // Among segments kept in both, the longest common order stays put; the rest moved.
  const keptA = a.segments.filter((s) => bSeg.has(s.id)).map((s) => s.id);
  const keptB = b.segments.filter((s) => aSeg.has(s.id)).map((s) => s.id);
  const movedIds = new Set(diffArrays(keptA, keptB).flatMap((p) => (p.added ? p.value : [])));
  const segmentsMoved = b.segments.filter((s) => movedIds.has(s.id)).map((s) => ({ ...ref(s), fromNumber: aSeg.get(s.id)!.number }));

  const scripts = b.segments.flatMap((s) => {
    const old = aSeg.get(s.id);
    if (!old || old.scriptText === s.scriptText) return [];
    return [{ segment: ref(s), words: diffWordsOf(old.scriptText, s.scriptText) }];
  });

  const shotsOf = (snap: HandoffSnapshot) => new Map(snap.segments.flatMap((seg) => seg.shots.map((sh) => [sh.id, { ...sh, segmentTitle: seg.title }] as const)));
  const aShots = shotsOf(a);
  const bShots = shotsOf(b);
  const shotOut = (s: { segmentTitle: string; id: string; description: string }) => ({ segmentTitle: s.segmentTitle, id: s.id, description: s.description });
  const shotsAdded = [...bShots.values()].filter((s) => !aShots.has(s.id)).map(shotOut);
  const shotsRemoved = [...aShots.values()].filter((s) => !bShots.has(s.id)).map(shotOut);
  const shotsChanged = [...bShots.values()].flatMap((s) => {
    const old = aShots.get(s.id);
    return old && old.state !== s.state ? [{ ...shotOut(s), fromState: old.state, toState: s.state }] : [];
  });

  const clipsOf = (snap: HandoffSnapshot) => new Map(snap.segments.flatMap((seg) => clipsOfSegment(seg).map((c) => [c.id, { segmentTitle: seg.title, id: c.id, name: c.name }] as const)));
  const aClips = clipsOf(a);
  const bClips = clipsOf(b);
  const clipsAdded = [...bClips.values()].filter((c) => !aClips.has(c.id));
  const clipsRemoved = [...aClips.values()].filter((c) => !bClips.has(c.id));

  const lists = [segmentsAdded, segmentsRemoved, segmentsMoved, scripts, shotsAdded, shotsRemoved, shotsChanged, clipsAdded, clipsRemoved];
  return {
    from: a.version,
    to: b.version,
    segmentsAdded,
    segmentsRemoved,
    segmentsMoved,
    scripts,
    shotsAdded,
    shotsRemoved,
    shotsChanged,
    clipsAdded,
    clipsRemoved,
    unchanged: lists.every((l) => l.length === 0),
  };
}
