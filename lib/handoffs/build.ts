import { renderToHTMLString } from '@tiptap/static-renderer/pm/html-string';
import { forecastEpisode } from '@/lib/runtime';
import { scriptExtensions } from '@/lib/scripts/extensions';
import { plainTextOf } from '@/lib/scripts/plain-text';
import type { ScriptDoc } from '@/lib/scripts/schemas';
import type { Level, SegmentKind } from '@/lib/segments/schemas';
import type { Camera, Framing, ShotState } from '@/lib/shots/catalog';
import { cautionsFor, needsSafetyReview, type Tool } from '@/lib/safety/tools';
import type { FrameRateId } from '@/lib/timecode';
import { SNAPSHOT_FORMAT, type HandoffSnapshot, type SnapshotClip, type SnapshotDeliverable, type SnapshotSegment } from './snapshot';

// Rows as queries.ts loads them (one statement each), turned into the snapshot. Pure.

export type SnapshotEpisodeInput = { id: string; title: string; premise: string; frameRate: FrameRateId; targetSeconds: number | null; levelLabels: [string, string, string] };
export type SnapshotSegmentInput = {
  id: string;
  kind: SegmentKind;
  level: Level | null;
  title: string;
  script: ScriptDoc | null;
  wordCount: number;
  actionSeconds: number;
  tools: Tool[];
  safetyReviewed: boolean;
};
export type SnapshotShotInput = {
  id: string;
  segmentId: string;
  description: string;
  framing: Framing;
  camera: Camera;
  state: ShotState;
  retakeReason: string | null;
};
export type SnapshotClipInput = SnapshotClip & { segmentId: string; shotId: string | null };

export type SnapshotInput = {
  version: number;
  lockedAt: Date;
  lockedBy: string;
  note: string;
  wordsPerMinute: number;
  episode: SnapshotEpisodeInput;
  /** In running order. */
  segments: SnapshotSegmentInput[];
  /** In shot-list order within each segment. */
  shots: SnapshotShotInput[];
  /** In upload order. */
  clips: SnapshotClipInput[];
  deliverables: SnapshotDeliverable[];
};

export function renderScriptHtml(doc: ScriptDoc | null): string {
  if (!doc || plainTextOf(doc).trim() === '') return '';
  return renderToHTMLString({ content: doc, extensions: scriptExtensions });
}

const clipOf = (c: SnapshotClipInput): SnapshotClip => ({
  id: c.id,
  name: c.name,
  mimeType: c.mimeType,
  sizeBytes: c.sizeBytes,
  durationSeconds: c.durationSeconds,
  frameRate: c.frameRate,
  sha256: c.sha256,
  hasPoster: c.hasPoster,
});

export function buildSnapshot(input: SnapshotInput): HandoffSnapshot {
  const forecast = forecastEpisode(input.segments, input.wordsPerMinute);
  const clipsByShot = new Map<string, SnapshotClip[]>();
  const looseBySegment = new Map<string, SnapshotClip[]>();
  for (const c of input.clips) {
    const [map, key] = c.shotId ? [clipsByShot, c.shotId] : [looseBySegment, c.segmentId];
    map.set(key, [...(map.get(key) ?? []), clipOf(c)]);
  }
  const shotsBySegment = new Map<string, SnapshotShotInput[]>();
  for (const s of input.shots) shotsBySegment.set(s.segmentId, [...(shotsBySegment.get(s.segmentId) ?? []), s]);

  const segments: SnapshotSegment[] = input.segments.map((seg, i) => {
    const f = forecast.segments[i]!;
    return {
      id: seg.id,
      number: i + 1,
      kind: seg.kind,
      level: seg.level,
      levelLabel: seg.level ? input.episode.levelLabels[seg.level - 1]! : null,
      title: seg.title,
      startSeconds: f.startSeconds,
      totalSeconds: f.totalSeconds,
      scriptHtml: renderScriptHtml(seg.script),
      scriptText: seg.script ? plainTextOf(seg.script) : '',
      safety: cautionsFor(seg.tools).map((c) => ({ tool: c.tool, label: c.label, cautions: c.cautions })),
      safetyReviewed: !needsSafetyReview(seg.tools) || seg.safetyReviewed,
      shots: (shotsBySegment.get(seg.id) ?? []).map((sh, n) => ({
        id: sh.id,
        number: n + 1,
        description: sh.description,
        framing: sh.framing,
        camera: sh.camera,
        state: sh.state,
        retakeReason: sh.retakeReason,
        clips: clipsByShot.get(sh.id) ?? [],
      })),
      otherClips: looseBySegment.get(seg.id) ?? [],
    };
  });

  return {
    format: SNAPSHOT_FORMAT,
    version: input.version,
    lockedAt: input.lockedAt.toISOString(),
    lockedBy: input.lockedBy,
    note: input.note,
    episode: {
      id: input.episode.id,
      title: input.episode.title,
      premise: input.episode.premise,
      frameRate: input.episode.frameRate,
      targetSeconds: input.episode.targetSeconds,
      totalSeconds: forecast.totalSeconds,
    },
    segments,
    sponsorDeliverables: input.deliverables,
  };
}
