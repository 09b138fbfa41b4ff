import { createHash } from 'node:crypto';
import type { Level, SegmentKind } from '@/lib/segments/schemas';
import type { Camera, Framing, ShotState } from '@/lib/shots/catalog';
import type { FrameRateId } from '@/lib/timecode';

// The locked content of one handoff version. Pure: built from rows the caller already loaded,
// serialised once with a fixed key order, stored as that exact text and hashed.

export const SNAPSHOT_FORMAT = 1;

export type SnapshotClip = {
  id: string;
  name: string;
  mimeType: string;
  sizeBytes: number;
  durationSeconds: number | null;
  frameRate: number | null;
  sha256: string;
  hasPoster: boolean;
};

export type SnapshotShot = {
  id: string;
  number: number;
  description: string;
  framing: Framing;
  camera: Camera;
  state: ShotState;
  retakeReason: string | null;
  clips: SnapshotClip[];
};

export type SnapshotSafety = { tool: string; label: string; cautions: string[] };

export type SnapshotDeliverable = {
  id: string;
  sponsorName: string;
  segmentId: string | null;
  talkingPoints: string[];
  disclosure: string;
  placementRule: string;
  /** Forecast start of the read in the episode, in seconds; null when it has no segment. */
  forecastStartSeconds: number | null;
};

export type SnapshotSegment = {
  id: string;
  number: number;
  kind: SegmentKind;
  level: Level | null;
  levelLabel: string | null;
  title: string;
  startSeconds: number;
  totalSeconds: number;
  scriptHtml: string;
  scriptText: string;
  safety: SnapshotSafety[];
  safetyReviewed: boolean;
  shots: SnapshotShot[];
  /** Clips of the segment not filed under a shot. */
  otherClips: SnapshotClip[];
};

export type HandoffSnapshot = {
  format: typeof SNAPSHOT_FORMAT;
  version: number;
  lockedAt: string;
  lockedBy: string;
  note: string;
  episode: { id: string; title: string; premise: string; frameRate: FrameRateId; targetSeconds: number | null; totalSeconds: number };
  segments: SnapshotSegment[];
  sponsorDeliverables: SnapshotDeliverable[];
};

/** Text of the snapshot as stored and served: the builder fixes the key order, so equal input gives equal bytes. */
export const serializeSnapshot = (snapshot: HandoffSnapshot): string => JSON.stringify(snapshot);

export const hashContent = (content: string): string => createHash('sha256').update(content, 'utf8').digest('hex');

export const parseSnapshot = (content: string): HandoffSnapshot => JSON.parse(content) as HandoffSnapshot;

/** Every clip of a segment in the order the edit uses: shots in order, then the segment's other clips. */
export const clipsOfSegment = (segment: SnapshotSegment): SnapshotClip[] => [...segment.shots.flatMap((s) => s.clips), ...segment.otherClips];
