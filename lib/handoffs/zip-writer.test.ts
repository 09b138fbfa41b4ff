import { execFileSync } from 'node:child_process';
import { createHash } from 'node:crypto';
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { Readable } from 'node:stream';
import { crc32 } from 'node:zlib';
import { describe, expect, it } from 'vitest';
import { createZipArchive, type ZipEntrySource } from './zip-writer';

/** The whole web stream as one Buffer (rejects with the stream's own error). */
async function readAll(stream: ReadableStream<Uint8Array>): Promise<Buffer> {
  const parts: Uint8Array[] = [];
  const reader = stream.getReader();
  for (let r = await reader.read(); !r.done; r = await reader.read()) parts.push(r.value);
  return Buffer.concat(parts);
}

const mtime = new Date('2026-03-14T15:09:26Z');
const big = Buffer.alloc(3 * 1024 * 1024 + 17);
for (let i = 0; i < big.length; i++) big[i] = (i * 31) % 251;
const chunked = (bytes: Buffer, size = 65536) => async () => Readable.from(Array.from({ length: Math.ceil(bytes.length / size) }, (_, i) => bytes.subarray(i * size, (i + 1) * size)));

const entries = (): ZipEntrySource[] => [
  { path: '01 Cold open/S01 A001.mov', mtime, size: big.length, open: chunked(big) },
  { path: '02 Légs/empty.mov', mtime, size: 0, open: chunked(Buffer.alloc(0)) },
  { path: 'manifest.json', mtime, data: Buffer.from('{"a":1}\n') },
];

function withArchive(zip: Buffer, check: (file: string, dir: string) => void) {
  const dir = mkdtempSync(join(tmpdir(), 'kerfline-zip-'));
  try {
    writeFileSync(join(dir, 'a.zip'), zip);
    check(join(dir, 'a.zip'), dir);
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}

// An independent reader besides Info-ZIP: Python's zipfile checks every CRC and reads ZIP64 records.
const pythonCheck = `
import sys, zipfile, hashlib
with zipfile.ZipFile(sys.argv[1]) as z:
    assert z.testzip() is None
    for i in z.infolist():
        print(i.filename, i.file_size, i.compress_type, i.date_time, hashlib.sha256(z.read(i)).hexdigest())
`;

describe('stored ZIP writer', () => {
  for (const forceZip64 of [false, true]) {
    it(`${forceZip64 ? 'with ZIP64 records' : 'plain'}: predicted size, unzip -t and Python's zipfile accept it, bytes intact`, async () => {
      const archive = createZipArchive(entries(), { forceZip64 });
      const zip = await readAll(archive.stream);
      expect(zip.length).toBe(archive.size);
      withArchive(zip, (file) => {
        expect(execFileSync('unzip', ['-t', file]).toString()).toContain('No errors detected');
        const verbose = execFileSync('zipinfo', ['-v', file]).toString();
        expect(verbose).toContain('compression method:                             none (stored)');
        if (forceZip64) expect(verbose).toContain('ID 0x0001 (PKWARE 64-bit sizes)');
        else expect(verbose).not.toContain('ID 0x0001');
        const listing = execFileSync('python3', ['-c', pythonCheck, file]).toString().trim().split('\n');
        const sha = createHash('sha256').update(big).digest('hex');
        expect(listing).toEqual([
          `01 Cold open/S01 A001.mov ${big.length} 0 (2026, 3, 14, 15, 9, 26) ${sha}`,
          `02 Légs/empty.mov 0 0 (2026, 3, 14, 15, 9, 26) ${createHash('sha256').digest('hex')}`,
          `manifest.json 8 0 (2026, 3, 14, 15, 9, 26) ${createHash('sha256').update('{"a":1}\n').digest('hex')}`,
        ]);
      });
    });
  }

  it('takes a CRC-32 known beforehand instead of computing it', async () => {
    const bytes = Buffer.from('known crc');
    const right = createZipArchive([{ path: 'k', mtime, size: bytes.length, crc32: crc32(bytes), open: chunked(bytes) }]);
    const wrong = createZipArchive([{ path: 'k', mtime, size: bytes.length, crc32: (crc32(bytes) + 1) >>> 0, open: chunked(bytes) }]);
    withArchive(await readAll(right.stream), (file) => expect(execFileSync('unzip', ['-t', file]).toString()).toContain('No errors detected'));
    // The writer trusts the CRC it is given: a wrong one is what unzip -t catches.
    withArchive(await readAll(wrong.stream), (file) => expect(() => execFileSync('unzip', ['-t', file], { stdio: 'pipe' })).toThrow());
  });

  it('reads nothing before the consumer pulls, and only one entry at a time', async () => {
    const opened: string[] = [];
    const sources: ZipEntrySource[] = ['a', 'b'].map((name) => ({
      path: name,
      mtime,
      size: 4,
      open: async () => {
        opened.push(name);
        return Readable.from([Buffer.from('1234')]);
      },
    }));
    const archive = createZipArchive(sources);
    await new Promise((r) => setImmediate(r));
    expect(opened).toEqual([]);
    const reader = archive.stream.getReader();
    await reader.read(); // a's local header
    await reader.read(); // a's bytes
    expect(opened).toEqual(['a']);
    await reader.cancel();
  });

  it('errors the stream when a file is shorter or longer than declared, or cannot be opened', async () => {
    const short = createZipArchive([{ path: 'x', mtime, size: 10, open: chunked(Buffer.alloc(9)) }]);
    await expect(readAll(short.stream)).rejects.toThrow('x: expected 10 bytes, read 9');
    const long = createZipArchive([{ path: 'y', mtime, size: 10, open: chunked(Buffer.alloc(11), 4) }]);
    await expect(readAll(long.stream)).rejects.toThrow('y: expected 10 bytes, read 11');
    const gone = createZipArchive([{ path: 'z', mtime, size: 1, open: () => Promise.reject(new Error('no such clip')) }]);
    await expect(readAll(gone.stream)).rejects.toThrow('no such clip');
  });
});
