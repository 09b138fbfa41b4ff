import { stringify } from 'csv-stringify/sync';
import { cameraLabels, framingLabels, shotStateLabels } from '@/lib/shots/catalog';
import { framesToTimecode, timecodeToFrames } from '@/lib/timecode';
import { buildAssembly, packageClips } from './assembly';
import type { HandoffSnapshot } from './snapshot';

// Shots and clips of a version, one row per clip (a shot without clips gets one row of its own).

/**
 * A cell a spreadsheet would run as a formula gets a leading apostrophe, so it shows as text.
 * Source: OWASP, "CSV Injection" (cells starting with =, +, -, @, tab or carriage return).
 */
export function neutraliseFormula(value: string): string {
  return /^[=+\-@\t\r]/.test(value) ? `'${value}` : value;
}

export const csvColumns = [
  'Segment',
  'Segment title',
  'Shot',
  'Shot description',
  'Framing',
  'Camera',
  'State',
  'Retake reason',
  'Clip name',
  'Package path',
  'Size (bytes)',
  'Duration (s)',
  'Frame rate',
  'SHA-256',
  'Record in',
] as const;

export function buildShotsCsv(snapshot: HandoffSnapshot): string {
  const assembly = buildAssembly(snapshot);
  const start = timecodeToFrames('01:00:00:00', assembly.rate);
  const byClip = new Map(packageClips(assembly).map((c) => [c.clip.id, c]));
  const rows: (string | number)[][] = [];
  for (const segment of snapshot.segments) {
    const base = [segment.number, segment.title];
    const shotCells = (shot: (typeof segment.shots)[number] | null) =>
      shot
        ? [shot.number, shot.description, framingLabels[shot.framing], cameraLabels[shot.camera], shotStateLabels[shot.state], shot.retakeReason ?? '']
        : ['', '', '', '', '', ''];
    const clipCells = (id: string) => {
      const c = byClip.get(id)!;
      return [c.clip.name, c.path, c.clip.sizeBytes, c.clip.durationSeconds ?? '', c.clip.frameRate ?? '', c.clip.sha256, c.frames > 0 ? framesToTimecode(start + c.recordIn, assembly.rate) : ''];
    };
    for (const shot of segment.shots) {
      if (shot.clips.length === 0) rows.push([...base, ...shotCells(shot), '', '', '', '', '', '', '']);
      for (const clip of shot.clips) rows.push([...base, ...shotCells(shot), ...clipCells(clip.id)]);
    }
    for (const clip of segment.otherClips) rows.push([...base, ...shotCells(null), ...clipCells(clip.id)]);
  }
  return stringify(rows, {
    header: true,
    columns: [...csvColumns],
    cast: { string: (v) => neutraliseFormula(v), number: (v) => String(v) },
    record_delimiter: 'windows',
    bom: true,
  });
}
