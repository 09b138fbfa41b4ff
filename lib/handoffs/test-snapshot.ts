import { buildSnapshot, type SnapshotInput } from './build';
import type { HandoffSnapshot } from './snapshot';

// A small snapshot input for the pure modules' tests: three segments, shots, a clip on a shot and one loose.
export function sampleInput(overrides: Partial<SnapshotInput> = {}): SnapshotInput {
  const doc = (text: string) => ({ type: 'doc' as const, content: [{ type: 'paragraph' as const, content: [{ type: 'text' as const, text }] }] });
  return {
    version: 1,
    lockedAt: new Date('2027-01-10T09:00:00Z'),
    lockedBy: 'Test host',
    note: 'First cut please',
    wordsPerMinute: 150,
    episode: { id: 'e1', title: 'Walnut step stool', premise: '', frameRate: '29.97df', targetSeconds: 600, levelLabels: ['Starter', 'Intermediate', 'Advanced'] },
    segments: [
      { id: 's1', kind: 'cold_open', level: null, title: 'Cold open', script: doc('Today we build a stool'), wordCount: 5, actionSeconds: 10, tools: [], safetyReviewed: false },
      { id: 's2', kind: 'build', level: 1, title: 'Legs', script: doc('Cut the legs to length'), wordCount: 5, actionSeconds: 60, tools: ['table_saw'], safetyReviewed: true },
      { id: 's3', kind: 'outro', level: null, title: 'Outro', script: null, wordCount: 0, actionSeconds: 5, tools: [], safetyReviewed: false },
    ],
    shots: [
      { id: 'sh1', segmentId: 's2', description: 'Wide of the saw', framing: 'wide', camera: 'a_cam', state: 'captured', retakeReason: null },
      { id: 'sh2', segmentId: 's2', description: 'Close on the blade', framing: 'close_up', camera: 'b_cam', state: 'planned', retakeReason: null },
    ],
    clips: [
      { id: 'c1', segmentId: 's2', shotId: 'sh1', name: 'A001.mov', mimeType: 'video/quicktime', sizeBytes: 1000, durationSeconds: 12.5, frameRate: 29.97, sha256: 'a'.repeat(64), hasPoster: true },
      { id: 'c2', segmentId: 's1', shotId: null, name: 'intro.mp4', mimeType: 'video/mp4', sizeBytes: 500, durationSeconds: 4, frameRate: 29.97, sha256: 'b'.repeat(64), hasPoster: false },
    ],
    deliverables: [],
    ...overrides,
  };
}

export const sampleSnapshot = (overrides: Partial<SnapshotInput> = {}): HandoffSnapshot => buildSnapshot(sampleInput(overrides));
