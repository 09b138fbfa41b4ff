import type { Level, SegmentKind } from '@/lib/segments/schemas';

export type StarterSegment = { title: string; kind: SegmentKind; level: Level | null; actionSeconds: number };

/**
 * The "three-level build" outline: one project shown at three skill levels, a sponsor read and an outro.
 * Titles are placeholders the host renames; action time starts at zero until the host plans montages.
 */
export function threeLevelBuild(levelLabels: readonly [string, string, string]): StarterSegment[] {
  return [
    { title: 'Cold open: the three finished pieces side by side', kind: 'cold_open', level: null, actionSeconds: 0 },
    { title: `${levelLabels[0]} build`, kind: 'build', level: 1, actionSeconds: 0 },
    { title: `${levelLabels[1]} build`, kind: 'build', level: 2, actionSeconds: 0 },
    { title: `${levelLabels[2]} build`, kind: 'build', level: 3, actionSeconds: 0 },
    { title: 'Sponsor read', kind: 'sponsor_read', level: null, actionSeconds: 0 },
    { title: 'Outro: which level to try first', kind: 'outro', level: null, actionSeconds: 0 },
  ];
}
