import { execFileSync } from 'node:child_process';
import { createHash } from 'node:crypto';
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { Readable } from 'node:stream';
import { describe, expect, it } from 'vitest';
import { frameRates, timecodeToFrames } from '@/lib/timecode';
import { buildAssembly, safeName } from './assembly';
import { buildShotsCsv, neutraliseFormula } from './csv';
import { buildEdl } from './edl';
import { buildOtio } from './otio';
import { checkOtio } from './otio-check';
import { buildClipPackage } from './package';
import { sampleInput, sampleSnapshot } from './test-snapshot';

const snap = sampleSnapshot();

describe('assembly', () => {
  it('lays clips end to end in running order with gaps for shots without a clip', () => {
    const a = buildAssembly(snap);
    expect(a.items.map((i) => (i.kind === 'clip' ? i.path : `gap:${i.shot?.id ?? i.segment.id}`))).toEqual([
      '01 Cold open/intro.mp4',
      '02 Legs/S01 A001.mov',
      'gap:sh2',
      'gap:s3',
    ]);
    const rate = frameRates['29.97df'];
    expect(a.items[1]!.recordIn).toBe(Math.floor((4 * 30000) / 1001));
    expect(a.segmentStarts.get('s2')).toBe(a.items[1]!.recordIn);
    expect(a.rate).toBe(rate);
  });

  it('makes names every file system accepts', () => {
    expect(safeName('a/b:c*?.mov')).toBe('b-c--.mov');
    expect(safeName('../..')).toBe('clip');
    expect(safeName('Trailing. ')).toBe('Trailing');
  });
});

describe('OTIO', () => {
  const otio = buildOtio(snap, buildAssembly(snap));

  it('follows the required-field rules', () => {
    expect(checkOtio(otio)).toEqual([]);
  });

  it('holds one video track with clips and gaps in order, a marker per segment, relative target URLs', () => {
    const track = (otio.tracks as { children: { kind: string; markers: { name: string }[]; children: { OTIO_SCHEMA: string; media_references?: { DEFAULT_MEDIA: { target_url: string } } }[] }[] }).children;
    expect(track).toHaveLength(1);
    expect(track[0]!.kind).toBe('Video');
    expect(track[0]!.children.map((c) => c.OTIO_SCHEMA)).toEqual(['Clip.2', 'Clip.2', 'Gap.1', 'Gap.1']);
    expect(track[0]!.children[1]!.media_references!.DEFAULT_MEDIA.target_url).toBe('02%20Legs/S01%20A001.mov');
    expect(track[0]!.markers.map((m) => m.name)).toEqual(['1. Cold open', '2. Legs', '3. Outro']);
  });

  it('the checker catches a missing required field', () => {
    expect(checkOtio({ OTIO_SCHEMA: 'Clip.2', media_references: {} })).not.toEqual([]);
    expect(checkOtio({ OTIO_SCHEMA: 'Track.1', children: [], kind: 'Data' })).not.toEqual([]);
  });
});

describe('CMX 3600 EDL', () => {
  const edl = buildEdl(snap, buildAssembly(snap)).split('\n');

  it('has a title, the frame-count mode and one event per clip', () => {
    expect(edl[0]).toBe('TITLE: Walnut step stool v1');
    expect(edl[1]).toBe('FCM: DROP FRAME');
    expect(edl.filter((l) => /^\d{3} /.test(l))).toHaveLength(2);
  });

  it('puts every field in its column', () => {
    const event = edl.find((l) => l.startsWith('002'))!;
    expect(event.slice(0, 3)).toBe('002');
    expect(event.slice(3, 5)).toBe('  ');
    expect(event.slice(5, 13)).toBe('AX      ');
    expect(event.slice(14, 19)).toBe('V    ');
    expect(event.slice(20, 28)).toBe('C       ');
    const [srcIn, srcOut, recIn, recOut] = event.slice(29).split(' ');
    expect(event.slice(29)).toMatch(/^\d\d:\d\d:\d\d;\d\d \d\d:\d\d:\d\d;\d\d \d\d:\d\d:\d\d;\d\d \d\d:\d\d:\d\d;\d\d$/);
    const rate = frameRates['29.97df'];
    const f = (tc: string | undefined) => timecodeToFrames(tc!, rate);
    expect(srcIn).toBe('00:00:00;00');
    // 12.5 s of a clip at 30000/1001 is 374 frames; it follows the 4 s intro (119 frames) from 01:00:00;00.
    expect(f(srcOut)).toBe(374);
    expect(f(recIn)).toBe(f('01:00:00;00') + 119);
    expect(f(recOut) - f(recIn)).toBe(374);
    expect(edl[edl.indexOf(event) + 1]).toBe('* FROM CLIP NAME: A001.mov');
  });

  it('writes NON-DROP FRAME and colons at 25', () => {
    const pal = sampleSnapshot({ episode: { ...sampleInput().episode, frameRate: '25' } });
    const lines = buildEdl(pal, buildAssembly(pal)).split('\n');
    expect(lines[1]).toBe('FCM: NON-DROP FRAME');
    expect(lines.find((l) => l.startsWith('001'))).toContain('01:00:00:00');
  });
});

describe('CSV', () => {
  it('neutralises formulas', () => {
    expect(neutraliseFormula('=HYPERLINK("x")')).toBe(`'=HYPERLINK("x")`);
    expect(neutraliseFormula('+1')).toBe(`'+1`);
    expect(neutraliseFormula('@SUM')).toBe(`'@SUM`);
    expect(neutraliseFormula('plain')).toBe('plain');
  });

  it('has a row per clip and per shot without clips, formula cells defused', () => {
    const evil = sampleSnapshot({ shots: [{ ...sampleInput().shots[0]!, description: '=cmd|calc' }, sampleInput().shots[1]!] });
    const lines = buildShotsCsv(evil).replace(/^\uFEFF/, '').trim().split('\r\n');
    expect(lines[0]).toContain('Segment,Segment title,Shot');
    expect(lines).toHaveLength(1 + 3);
    expect(lines.join('\n')).toContain(`'=cmd|calc`);
    expect(lines.join('\n')).not.toMatch(/,=cmd/);
  });
});

/** The whole web stream as one Buffer (rejects with the stream's own error). */
async function readAll(stream: ReadableStream<Uint8Array>): Promise<Buffer> {
  const parts: Uint8Array[] = [];
  const reader = stream.getReader();
  for (let r = await reader.read(); !r.done; r = await reader.read()) parts.push(r.value);
  return Buffer.concat(parts);
}

describe('clip package', () => {
  const bytes: Record<string, Buffer> = { c1: Buffer.alloc(1000, 7), c2: Buffer.alloc(500, 9) };
  const input = sampleInput();
  input.clips = input.clips.map((c) => ({ ...c, sha256: createHash('sha256').update(bytes[c.id]!).digest('hex') }));
  const snapshot = sampleSnapshot({ clips: input.clips });
  const openClip = async (id: string) => Readable.from([bytes[id]!]);

  it('is a stored ZIP of the predicted size that unzip -t accepts and whose SHA256SUMS verify', async () => {
    const pkg = await buildClipPackage(snapshot, { openClip, available: new Set(['c1', 'c2']) });
    const zip = await readAll(pkg.stream);
    expect(pkg.size).toBe(zip.length);
    const dir = mkdtempSync(join(tmpdir(), 'kerfline-pkg-'));
    try {
      writeFileSync(join(dir, 'p.zip'), zip);
      expect(execFileSync('unzip', ['-t', join(dir, 'p.zip')]).toString()).toContain('No errors detected');
      const listing = execFileSync('unzip', ['-v', join(dir, 'p.zip')]).toString();
      expect(listing).toContain('Stored');
      expect(listing).not.toContain('Defl');
      execFileSync('unzip', ['-q', join(dir, 'p.zip'), '-d', join(dir, 'x')]);
      expect(execFileSync('sha256sum', ['-c', 'SHA256SUMS'], { cwd: join(dir, 'x') }).toString()).toContain('02 Legs/S01 A001.mov: OK');
      const manifest = JSON.parse(readFileSync(join(dir, 'x', 'manifest.json'), 'utf8')) as { clips: unknown[]; missing: string[] };
      expect(manifest.clips).toHaveLength(2);
      expect(manifest.missing).toEqual([]);
      expect(readFileSync(join(dir, 'x', 'Walnut step stool v1.otio'), 'utf8')).toContain('Timeline.1');
    } finally {
      rmSync(dir, { recursive: true, force: true });
    }
  });

  it('per segment holds only that folder, and lists a deleted clip as missing', async () => {
    const pkg = await buildClipPackage(snapshot, { openClip, available: new Set(['c2']), segmentId: 's2' });
    const zip = await readAll(pkg.stream);
    expect(pkg.size).toBe(zip.length);
    expect(pkg.missing).toEqual(['02 Legs/S01 A001.mov']);
    expect(pkg.fileName).toBe('Walnut step stool v1 - 02 Legs.zip');
    expect(zip.includes(Buffer.from('01 Cold open/'))).toBe(false);
  });
});
