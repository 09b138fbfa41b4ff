import { crc32 } from 'node:zlib';

// A streaming writer for stored (uncompressed) ZIP archives, ZIP64 where sizes or offsets need it.
// Every entry's size is known before the first byte, so the archive's layout and length are fixed up
// front (Content-Length); the CRC-32 goes into a data descriptor after each entry. A clip's CRC is
// taken at ingest (storage/ingest.ts) so the package only copies bytes; for a file without one it is
// computed while the bytes pass, with Node's native zlib.crc32 (Node >= 20.15). Per-byte CRC work was
// the bottleneck of the clip package (bench/handoff, issue 14).
// The output is a pull-based web stream, so nothing is read before the client asks for it.
// Source for every record below: PKWARE APPNOTE.TXT 6.3.10 (sections cited beside each record).

export type ZipEntrySource =
  | { path: string; mtime: Date; data: Uint8Array }
  | {
      path: string;
      mtime: Date;
      size: number;
      /** The bytes' CRC-32 when known beforehand (taken at ingest); otherwise computed while they pass. */
      crc32?: number | null;
      open: () => Promise<AsyncIterable<Uint8Array>>;
    };

type PlannedEntry = { source: ZipEntrySource; name: Buffer; size: number; offset: number; zip64: boolean; crc: number };

const MAX32 = 0xffffffff;
const MAX16 = 0xffff;
const LOCAL_FIXED = 30; // §4.3.7
const ZIP64_LOCAL_EXTRA = 20; // §4.5.3: tag, size, original and compressed size
const DESCRIPTOR = 16; // §4.3.9 with its optional signature
const ZIP64_DESCRIPTOR = 24; // §4.3.9.2: 8-byte sizes when the entry is ZIP64
const CENTRAL_FIXED = 46; // §4.3.12
const UT_EXTRA = 9; // Info-ZIP extended timestamp 0x5455, central form: flags + mtime (APPNOTE §4.6.1 lists the tag)
const ZIP64_CENTRAL_EXTRA = 28; // §4.5.3: original size, compressed size, local header offset
const EOCD = 22; // §4.3.16
const ZIP64_EOCD = 56; // §4.3.14
const ZIP64_LOCATOR = 20; // §4.3.15
const VERSION_MADE_BY = (3 << 8) | 63; // §4.4.2: Unix, spec 6.3
const NEEDS_20 = 20; // §4.4.3.2: stored entries, folders
const NEEDS_45 = 45; // §4.4.3.2: ZIP64
const FLAG_DESCRIPTOR = 1 << 3; // §4.4.4 bit 3: CRC and sizes follow the data
const FLAG_UTF8 = 1 << 11; // §4.4.4 bit 11: names are UTF-8
const FILE_MODE = 0o100644;

const sizeOf = (source: ZipEntrySource) => ('data' in source ? source.data.byteLength : source.size);

/** 64-bit little-endian from a safe integer (archives stay far below 2^53 bytes). */
function writeU64(buf: Buffer, value: number, at: number) {
  buf.writeUInt32LE(value % 0x100000000, at);
  buf.writeUInt32LE(Math.floor(value / 0x100000000), at + 4);
}

/** MS-DOS date and time, §4.4.6; in UTC so the archive does not depend on the server's time zone. */
function dosDateTime(date: Date): { date: number; time: number } {
  const year = Math.min(Math.max(date.getUTCFullYear(), 1980), 2107);
  return {
    date: ((year - 1980) << 9) | ((date.getUTCMonth() + 1) << 5) | date.getUTCDate(),
    time: (date.getUTCHours() << 11) | (date.getUTCMinutes() << 5) | Math.floor(date.getUTCSeconds() / 2),
  };
}

type Plan = { entries: PlannedEntry[]; centralOffset: number; centralSize: number; zip64End: boolean; size: number };

function planZip(sources: ZipEntrySource[], forceZip64: boolean): Plan {
  let cursor = 0;
  let centralSize = 0;
  const entries = sources.map((source): PlannedEntry => {
    const name = Buffer.from(source.path, 'utf8');
    if (name.length > MAX16) throw new Error(`ZIP entry name too long: ${source.path}`);
    const size = sizeOf(source);
    // §4.4.8, §4.4.16: 0xFFFFFFFF in a 32-bit field means "see the ZIP64 extra field".
    const zip64 = forceZip64 || size >= MAX32 || cursor >= MAX32;
    const entry: PlannedEntry = { source, name, size, offset: cursor, zip64, crc: 0 };
    cursor += LOCAL_FIXED + name.length + (zip64 ? ZIP64_LOCAL_EXTRA : 0) + size + (zip64 ? ZIP64_DESCRIPTOR : DESCRIPTOR);
    centralSize += CENTRAL_FIXED + name.length + UT_EXTRA + (zip64 ? ZIP64_CENTRAL_EXTRA : 0);
    return entry;
  });
  const zip64End = forceZip64 || entries.length >= MAX16 || centralSize >= MAX32 || cursor >= MAX32;
  return { entries, centralOffset: cursor, centralSize, zip64End, size: cursor + centralSize + (zip64End ? ZIP64_EOCD + ZIP64_LOCATOR : 0) + EOCD };
}

/** Local file header, §4.3.7; CRC and sizes are zero because bit 3 is set (§4.4.4). */
function localHeader(e: PlannedEntry): Buffer {
  const buf = Buffer.alloc(LOCAL_FIXED + e.name.length + (e.zip64 ? ZIP64_LOCAL_EXTRA : 0));
  const { date, time } = dosDateTime(e.source.mtime);
  buf.writeUInt32LE(0x04034b50, 0);
  buf.writeUInt16LE(e.zip64 ? NEEDS_45 : NEEDS_20, 4);
  buf.writeUInt16LE(FLAG_DESCRIPTOR | FLAG_UTF8, 6);
  buf.writeUInt16LE(0, 8); // stored
  buf.writeUInt16LE(time, 10);
  buf.writeUInt16LE(date, 12);
  buf.writeUInt32LE(0, 14);
  buf.writeUInt32LE(e.zip64 ? MAX32 : 0, 18);
  buf.writeUInt32LE(e.zip64 ? MAX32 : 0, 22);
  buf.writeUInt16LE(e.name.length, 26);
  buf.writeUInt16LE(e.zip64 ? ZIP64_LOCAL_EXTRA : 0, 28);
  e.name.copy(buf, LOCAL_FIXED);
  if (e.zip64) {
    // §4.5.3: "This entry in the Local header MUST include BOTH original and compressed file size fields."
    const at = LOCAL_FIXED + e.name.length;
    buf.writeUInt16LE(0x0001, at);
    buf.writeUInt16LE(16, at + 2);
  }
  return buf;
}

/** Data descriptor with its signature, §4.3.9. */
function dataDescriptor(e: PlannedEntry): Buffer {
  const buf = Buffer.alloc(e.zip64 ? ZIP64_DESCRIPTOR : DESCRIPTOR);
  buf.writeUInt32LE(0x08074b50, 0);
  buf.writeUInt32LE(e.crc, 4);
  if (e.zip64) {
    writeU64(buf, e.size, 8);
    writeU64(buf, e.size, 16);
  } else {
    buf.writeUInt32LE(e.size, 8);
    buf.writeUInt32LE(e.size, 12);
  }
  return buf;
}

/** Central directory file header, §4.3.12, with the extended timestamp and, for ZIP64, §4.5.3. */
function centralRecord(e: PlannedEntry): Buffer {
  const buf = Buffer.alloc(CENTRAL_FIXED + e.name.length + UT_EXTRA + (e.zip64 ? ZIP64_CENTRAL_EXTRA : 0));
  const { date, time } = dosDateTime(e.source.mtime);
  buf.writeUInt32LE(0x02014b50, 0);
  buf.writeUInt16LE(VERSION_MADE_BY, 4);
  buf.writeUInt16LE(e.zip64 ? NEEDS_45 : NEEDS_20, 6);
  buf.writeUInt16LE(FLAG_DESCRIPTOR | FLAG_UTF8, 8);
  buf.writeUInt16LE(0, 10);
  buf.writeUInt16LE(time, 12);
  buf.writeUInt16LE(date, 14);
  buf.writeUInt32LE(e.crc, 16);
  buf.writeUInt32LE(e.zip64 ? MAX32 : e.size, 20);
  buf.writeUInt32LE(e.zip64 ? MAX32 : e.size, 24);
  buf.writeUInt16LE(e.name.length, 28);
  buf.writeUInt16LE(UT_EXTRA + (e.zip64 ? ZIP64_CENTRAL_EXTRA : 0), 30);
  buf.writeUInt16LE(0, 32); // comment length
  buf.writeUInt16LE(0, 34); // disk number start
  buf.writeUInt16LE(0, 36); // internal attributes
  buf.writeUInt32LE((FILE_MODE << 16) >>> 0, 38); // external attributes: Unix mode in the high half
  buf.writeUInt32LE(e.zip64 ? MAX32 : e.offset, 42);
  let at = CENTRAL_FIXED;
  e.name.copy(buf, at);
  at += e.name.length;
  // Info-ZIP "UT" field, central form: flags (mtime, atime) and the mtime only, as Info-ZIP's zip writes it.
  buf.writeUInt16LE(0x5455, at);
  buf.writeUInt16LE(5, at + 2);
  buf.writeUInt8(0b11, at + 4);
  buf.writeInt32LE(Math.max(-0x80000000, Math.min(0x7fffffff, Math.floor(e.source.mtime.getTime() / 1000))), at + 5);
  at += UT_EXTRA;
  if (e.zip64) {
    buf.writeUInt16LE(0x0001, at);
    buf.writeUInt16LE(24, at + 2);
    writeU64(buf, e.size, at + 4);
    writeU64(buf, e.size, at + 12);
    writeU64(buf, e.offset, at + 20);
  }
  return buf;
}

/** ZIP64 end of central directory record and locator (§4.3.14, §4.3.15) when needed, then the EOCD (§4.3.16). */
function endRecords(plan: Plan): Buffer {
  const count = plan.entries.length;
  const eocd = Buffer.alloc(EOCD);
  eocd.writeUInt32LE(0x06054b50, 0);
  eocd.writeUInt16LE(plan.zip64End ? MAX16 : count, 8);
  eocd.writeUInt16LE(plan.zip64End ? MAX16 : count, 10);
  eocd.writeUInt32LE(plan.zip64End ? MAX32 : plan.centralSize, 12);
  eocd.writeUInt32LE(plan.zip64End ? MAX32 : plan.centralOffset, 16);
  if (!plan.zip64End) return eocd;
  const z = Buffer.alloc(ZIP64_EOCD + ZIP64_LOCATOR);
  z.writeUInt32LE(0x06064b50, 0);
  writeU64(z, ZIP64_EOCD - 12, 4); // size of the record after this field
  z.writeUInt16LE(VERSION_MADE_BY, 12);
  z.writeUInt16LE(NEEDS_45, 14);
  writeU64(z, count, 24);
  writeU64(z, count, 32);
  writeU64(z, plan.centralSize, 40);
  writeU64(z, plan.centralOffset, 48);
  z.writeUInt32LE(0x07064b50, ZIP64_EOCD);
  writeU64(z, plan.centralOffset + plan.centralSize, ZIP64_EOCD + 8); // where the ZIP64 EOCD record starts
  z.writeUInt32LE(1, ZIP64_EOCD + 16); // total number of disks
  return Buffer.concat([z, eocd]);
}

async function* archiveChunks(plan: Plan): AsyncGenerator<Uint8Array> {
  for (const e of plan.entries) {
    yield localHeader(e);
    let crc = 0;
    let read = 0;
    if ('data' in e.source) {
      crc = crc32(e.source.data);
      read = e.source.data.byteLength;
      yield e.source.data;
    } else {
      const known = e.source.crc32 ?? null;
      for await (const chunk of await e.source.open()) {
        read += chunk.byteLength;
        // A file that grew would shift every later offset: stop rather than send a corrupt archive.
        if (read > e.size) break;
        if (known === null) crc = crc32(chunk, crc);
        yield chunk;
      }
      if (known !== null) crc = known;
    }
    if (read !== e.size) throw new Error(`${e.source.path}: expected ${e.size} bytes, read ${read}`);
    e.crc = crc;
    yield dataDescriptor(e);
  }
  yield Buffer.concat(plan.entries.map(centralRecord));
  yield endRecords(plan);
}

export type ZipArchive = { size: number; stream: ReadableStream<Uint8Array> };

/**
 * A stored ZIP of the given entries, in that order. `size` is exact before any byte is read. An entry
 * that cannot be opened or read, or whose length differs from its declared size, errors the stream, so a
 * client sees a failed download rather than a short, valid-looking archive.
 * @param options.forceZip64 ZIP64 records for every entry (tests check the ZIP64 layout with small files).
 */
export function createZipArchive(sources: ZipEntrySource[], options: { forceZip64?: boolean } = {}): ZipArchive {
  const plan = planZip(sources, options.forceZip64 ?? false);
  const chunks = archiveChunks(plan);
  // highWaterMark 0: read the next chunk only when the consumer pulls, so memory stays at one chunk.
  const stream = new ReadableStream<Uint8Array>(
    {
      async pull(controller) {
        const next = await chunks.next();
        if (next.done) controller.close();
        else controller.enqueue(next.value);
      },
      async cancel() {
        await chunks.return(undefined);
      },
    },
    { highWaterMark: 0 },
  );
  return { size: plan.size, stream };
}
