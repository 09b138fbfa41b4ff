import { execFileSync } from 'node:child_process';
import { createHash } from 'node:crypto';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { db } from '@/db/client';
import { AppServer } from './app-server';
import { makeLoadEpisode } from '../integration/cut-plan-fixtures';
import { makeOutlinedEpisode } from '../integration/episode-fixtures';
import { makeCrew, sessionCookie } from '../integration/helpers';
import type { Crew } from '../integration/route-matrix';
import { makeShotEpisode } from '../integration/shot-fixtures';
import { makeRandomFile, startTusUpload } from './tus-client';

// Real HTTP against the built app, so uploads go through Next, @tus/server and the disk store as in production.
const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'kerfline-uploads-'));
const uploadDir = path.join(dir, 'uploads');
const MAX = 300 * 1024 * 1024;
const UPLOAD_PORT = Number(process.env.UPLOAD_TEST_PORT ?? 3197);
const appEnv = {
  DATABASE_URL: process.env.DATABASE_URL ?? '',
  NEXTAUTH_SECRET: process.env.NEXTAUTH_SECRET ?? '',
  NEXTAUTH_URL: `http://127.0.0.1:${UPLOAD_PORT}`,
  UPLOAD_DIR: uploadDir,
  MAX_UPLOAD_BYTES: String(MAX),
  CLIP_JOB_POLL_MS: '300',
  // byte-removals.test.ts takes the removal queue of this database with its own store.
  KERFLINE_BYTE_REMOVALS: 'off',
};
const app = new AppServer(UPLOAD_PORT, appEnv);
const endpoint = () => `${app.url}/api/uploads`;
const b64 = (s: string) => Buffer.from(s).toString('base64');
const metaHeader = (m: Record<string, string>) =>
  Object.entries(m)
    .map(([k, v]) => `${k} ${b64(v)}`)
    .join(',');

let crew: Crew;
let segmentId: string;
let shotId: string;
let cookie: string;
let bigFile: string;
let bigSha: string;

beforeAll(async () => {
  await app.start();
  crew = await makeCrew();
  const made = await makeShotEpisode(crew);
  segmentId = made.build.id;
  shotId = made.shopShot.id;
  cookie = await sessionCookie(crew.shopHand);
  bigFile = path.join(dir, 'big.bin');
  bigSha = await makeRandomFile(bigFile, 110 * 1024 * 1024);
}, 120_000);

afterAll(async () => {
  await app.kill();
  fs.rmSync(dir, { recursive: true, force: true });
});

/** A bare tus creation request, for the refusals tus-js-client would only report as errors. */
async function create(opts: { cookie?: string; length?: number; metadata?: Record<string, string> }) {
  const headers: Record<string, string> = { 'Tus-Resumable': '1.0.0', 'Upload-Length': String(opts.length ?? 10) };
  if (opts.cookie) headers.cookie = opts.cookie;
  headers.origin = new URL(app.url).origin;
  if (opts.metadata) headers['Upload-Metadata'] = metaHeader(opts.metadata);
  const res = await fetch(endpoint(), { method: 'POST', headers });
  return { status: res.status, body: await res.text(), location: res.headers.get('location') };
}

const meta = (extra: Record<string, string> = {}) => ({ segmentId, filename: 'A001_C002.mp4', filetype: 'video/mp4', ...extra });
const clipsOf = (uploadId: string) => db('clips').where({ upload_id: uploadId });
const idOf = (url: string) => url.split('/').pop() ?? '';

describe('tus uploads: who may, and what is refused', () => {
  it('401 for every tus method when signed out', async () => {
    const made = await create({ cookie, metadata: meta() });
    expect(made.status).toBe(201);
    const url = new URL(made.location!, app.url).href;
    expect((await create({ metadata: meta() })).status).toBe(401);
    for (const method of ['HEAD', 'PATCH', 'GET', 'DELETE']) {
      const headers: Record<string, string> = { 'Tus-Resumable': '1.0.0' };
      if (method === 'PATCH') Object.assign(headers, { 'Upload-Offset': '0', 'Content-Type': 'application/offset+octet-stream' });
      const res = await fetch(url, { method, headers, body: method === 'PATCH' ? 'x' : undefined });
      expect(res.status, method).toBe(401);
    }
  });

  it('403 for an Editor, 404 for another channel’s segment or someone else’s upload', async () => {
    expect((await create({ cookie: await sessionCookie(crew.editor), metadata: meta() })).status).toBe(403);
    const other = await makeCrew();
    const { segments } = await makeOutlinedEpisode(other);
    const foreign = await create({ cookie, metadata: meta({ segmentId: segments[1]!.id }) });
    expect(foreign.status).toBe(404);
    const mine = await create({ cookie, metadata: meta() });
    const res = await fetch(new URL(mine.location!, app.url), { method: 'HEAD', headers: { 'Tus-Resumable': '1.0.0', cookie: await sessionCookie(other.host) } });
    expect(res.status).toBe(404);
  });

  it('400 for missing or unknown segment and a shot of another segment, 415 for a bad type, 413 when too big', async () => {
    const { segmentId: _drop, ...noSegment } = meta();
    const missing = await create({ cookie, metadata: noSegment });
    expect(missing.status).toBe(400);
    expect(missing.body).toMatch(/segmentId/);
    expect((await create({ cookie, metadata: meta({ segmentId: '00000000-0000-4000-8000-000000000000' }) })).status).toBe(404);
    const elsewhere = await makeShotEpisode(crew);
    const badShot = await create({ cookie, metadata: meta({ shotId: elsewhere.shopShot.id }) });
    expect(badShot.status).toBe(400);
    expect(badShot.body).toMatch(/not in this segment/);
    const html = await create({ cookie, metadata: meta({ filetype: 'text/html' }) });
    expect(html.status).toBe(415);
    expect((await create({ cookie, metadata: meta({ filetype: 'image/svg+xml' }) })).status).toBe(415);
    expect((await create({ cookie, length: MAX + 1, metadata: meta() })).status).toBe(413);
  });
});

describe('tus uploads: every byte arrives', () => {
  it('resumes a 110 MB upload aborted midway, and the stored SHA-256 matches the source', async () => {
    let aborted: Promise<void> | null = null;
    const first = startTusUpload(endpoint(), bigFile, {
      cookie,
      metadata: meta({ shotId, filename: 'big.bin', filetype: 'video/mp4' }),
      onProgress: (sent, total) => {
        if (!aborted && sent > total * 0.4) aborted = first.abort();
      },
    });
    // An aborted upload neither succeeds nor fails; wait for the abort itself.
    await expect.poll(() => aborted !== null, { timeout: 60_000, interval: 50 }).toBe(true);
    await aborted;
    const url = first.url!;
    const head = await fetch(url, { method: 'HEAD', headers: { 'Tus-Resumable': '1.0.0', cookie } });
    const offset = Number(head.headers.get('upload-offset'));
    expect(offset).toBeGreaterThan(0);
    expect(offset).toBeLessThan(110 * 1024 * 1024);
    expect(await clipsOf(idOf(url))).toHaveLength(0);

    await startTusUpload(endpoint(), bigFile, { cookie, metadata: {}, uploadUrl: url }).done;
    const [clip] = await clipsOf(idOf(url));
    expect(clip).toMatchObject({ sha256: bigSha, size_bytes: String(110 * 1024 * 1024), shot_id: shotId, uploaded_by: crew.shopHand.id, original_name: 'big.bin' });
    const stored = createHash('sha256').update(fs.readFileSync(path.join(uploadDir, idOf(url)))).digest('hex');
    expect(stored).toBe(bigSha);
  }, 180_000);

  it('finishes an upload across an app server restart', async () => {
    let killed = false;
    let sentAtKill = 0;
    let restarting: Promise<void> | null = null;
    const run = startTusUpload(endpoint(), bigFile, {
      cookie,
      metadata: meta({ filename: 'restart.bin' }),
      onProgress: (sent, total) => {
        if (!killed && sent > total * 0.3) {
          killed = true;
          sentAtKill = sent;
          restarting = app.kill().then(() => app.start());
        }
      },
    });
    await run.done;
    await restarting;
    expect(killed).toBe(true);
    expect(sentAtKill).toBeLessThan(110 * 1024 * 1024);
    const [clip] = await clipsOf(idOf(run.url!));
    expect(clip?.sha256).toBe(bigSha);
  }, 240_000);

  it('writes one clip row when the finishing PATCH is sent again', async () => {
    const small = path.join(dir, 'small.bin');
    await makeRandomFile(small, 1000);
    const run = startTusUpload(endpoint(), small, { cookie, metadata: meta({ filename: 'small.bin' }) });
    await run.done;
    const again = await fetch(run.url!, {
      method: 'PATCH',
      headers: { 'Tus-Resumable': '1.0.0', 'Upload-Offset': '1000', 'Content-Type': 'application/offset+octet-stream', cookie, origin: new URL(app.url).origin },
      body: new Uint8Array(0),
    });
    expect(again.status).toBeLessThan(500);
    expect(await clipsOf(idOf(run.url!))).toHaveLength(1);
  });

  it('refuses a tus request sent from another site, or with a cookie and no Origin (403)', async () => {
    const headers = { 'Tus-Resumable': '1.0.0', 'Upload-Length': '10', 'Upload-Metadata': metaHeader(meta()), cookie };
    const evil = await fetch(endpoint(), { method: 'POST', headers: { ...headers, origin: 'https://evil.example' } });
    expect(evil.status).toBe(403);
    expect(await evil.text()).toMatch(/did not come from a Kerfline page/);
    expect((await fetch(endpoint(), { method: 'POST', headers })).status).toBe(403);
  });

  it('reads back a finished upload whose name is not Latin without a 500 (RFC 6266 / 8187 header)', async () => {
    const small = path.join(dir, 'named.bin');
    await makeRandomFile(small, 500);
    const run = startTusUpload(endpoint(), small, { cookie, metadata: meta({ filename: 'Шип и паз 木工.mp4' }) });
    await run.done;
    const res = await fetch(run.url!, { headers: { 'Tus-Resumable': '1.0.0', cookie } });
    expect(res.status).toBe(200);
    expect(res.headers.get('content-disposition')).toBe(
      `attachment; filename="??? ? ??? ??.mp4"; filename*=UTF-8''%D0%A8%D0%B8%D0%BF%20%D0%B8%20%D0%BF%D0%B0%D0%B7%20%E6%9C%A8%E5%B7%A5.mp4`,
    );
    expect((await res.arrayBuffer()).byteLength).toBe(500);
  });

  it('stores a path-like file name as a harmless display name, the bytes under the server’s id', async () => {
    const small = path.join(dir, 'x.bin');
    await makeRandomFile(small, 2048);
    const before = new Set(fs.readdirSync(dir));
    const run = startTusUpload(endpoint(), small, { cookie, metadata: meta({ filename: '../../x', filetype: 'video/mp4' }) });
    await run.done;
    const id = idOf(run.url!);
    expect(id).toMatch(/^[a-f0-9]{32}$/);
    expect((await clipsOf(id))[0]?.original_name).toBe('x');
    expect(fs.existsSync(path.join(uploadDir, id))).toBe(true);
    expect(new Set(fs.readdirSync(dir))).toEqual(before);
  });
});

// Issue 12, item 4: the server dies after the last byte is stored and before the finish hook writes the clip row.
describe('an upload whose server died before its clip row', () => {
  it('gets its clip row exactly once from the reconciler when the app starts again', async () => {
    const file = path.join(dir, 'crash.bin');
    const sha = await makeRandomFile(file, 300_000);
    await app.kill();
    const crashing = new AppServer(UPLOAD_PORT, { ...appEnv, KERFLINE_TEST_CRASH_BEFORE_CLIP_ROW: '1' });
    await crashing.start();
    const run = startTusUpload(endpoint(), file, { cookie, metadata: meta({ filename: 'crash.bin' }), retryDelays: [] });
    await expect(run.done).rejects.toBeDefined();
    await expect.poll(() => crashing.exited(), { timeout: 10_000 }).toBe(true);
    const id = idOf(run.url!);
    expect(fs.statSync(path.join(uploadDir, id)).size).toBe(300_000);
    expect(await clipsOf(id)).toHaveLength(0);

    await app.start();
    await expect.poll(async () => (await clipsOf(id)).length, { timeout: 20_000, interval: 250 }).toBe(1);
    expect((await clipsOf(id))[0]).toMatchObject({ sha256: sha, size_bytes: '300000', original_name: 'crash.bin' });
    // Another start finds the row and adds none.
    await app.kill();
    await app.start();
    await new Promise((r) => setTimeout(r, 1500));
    expect(await clipsOf(id)).toHaveLength(1);
  }, 120_000);
});

describe('clip files', () => {
  let clipId: string;
  let bytes: Buffer;
  const fileUrl = () => `${app.url}/api/channels/${crew.channel.slug}/clips/${clipId}/file`;

  beforeAll(async () => {
    const video = path.join(dir, 'testsrc.mp4');
    // A real video from ffmpeg's built-in test source, so ffprobe and the poster have something to read.
    execFileSync('ffmpeg', ['-v', 'error', '-y', '-f', 'lavfi', '-i', 'testsrc=duration=3:size=320x240:rate=30', '-pix_fmt', 'yuv420p', '-c:v', 'libx264', video]);
    bytes = fs.readFileSync(video);
    const run = startTusUpload(endpoint(), video, { cookie, metadata: meta({ filename: 'Glue up – take 2.mp4' }) });
    await run.done;
    clipId = (await clipsOf(idOf(run.url!)))[0]!.id as string;
  }, 60_000);

  it('reads duration, resolution and frame rate with ffprobe and makes a poster, off the upload’s path', async () => {
    await expect
      // ffprobe and ffmpeg run as child processes: on a loaded 2-core box they take far longer than alone.
      .poll(async () => (await db('clips').where({ id: clipId }).first('probe_state')).probe_state, { timeout: 90_000, interval: 300 })
      .toBe('done');
    const clip = await db('clips').where({ id: clipId }).first();
    expect(clip).toMatchObject({ width: 320, height: 240, frame_rate: 30, codec: 'h264', has_poster: true });
    expect(clip.duration_seconds).toBeCloseTo(3, 1);
    const poster = await fetch(`${app.url}/api/channels/${crew.channel.slug}/clips/${clipId}/poster`, { headers: { cookie: await sessionCookie(crew.editor) } });
    expect(poster.status).toBe(200);
    expect(poster.headers.get('content-type')).toBe('image/jpeg');
  }, 120_000);

  it('serves byte ranges with 206 and the right Content-Range, 416 past the end, and downloads under the original name', async () => {
    const editor = await sessionCookie(crew.editor);
    const part = await fetch(fileUrl(), { headers: { cookie: editor, range: 'bytes=100-1099' } });
    expect(part.status).toBe(206);
    expect(part.headers.get('content-range')).toBe(`bytes 100-1099/${bytes.length}`);
    // The route's own sandbox CSP, not the pages' CSP that allows inline scripts (issue 12 item 13).
    expect(part.headers.get('content-security-policy')).toBe("sandbox; default-src 'none'");
    expect(Buffer.from(await part.arrayBuffer()).equals(bytes.subarray(100, 1100))).toBe(true);
    const tail = await fetch(fileUrl(), { headers: { cookie: editor, range: 'bytes=-10' } });
    expect(Buffer.from(await tail.arrayBuffer()).equals(bytes.subarray(bytes.length - 10))).toBe(true);
    const bad = await fetch(fileUrl(), { headers: { cookie: editor, range: `bytes=${bytes.length}-` } });
    expect(bad.status).toBe(416);
    expect(bad.headers.get('content-range')).toBe(`bytes */${bytes.length}`);
    const whole = await fetch(`${fileUrl()}?download=1`, { headers: { cookie: editor } });
    expect(whole.status).toBe(200);
    // Source: RFC 6266 §4.3 and RFC 8187: an ASCII fallback plus filename* in UTF-8.
    expect(whole.headers.get('content-disposition')).toBe(`attachment; filename="Glue up ? take 2.mp4"; filename*=UTF-8''Glue%20up%20%E2%80%93%20take%202.mp4`);
    expect(Buffer.from(await whole.arrayBuffer()).equals(bytes)).toBe(true);
    expect((await fetch(fileUrl())).status).toBe(401);
  });
});

// Issue 12, item 1: the planner's worker file is not part of Next's bundle, so it must load from `next start` too.
describe('cut plans in the built app', () => {
  it('plans an episode of 8 stock items x 9 parts on the worker pool under next start', async () => {
    const { episode } = await makeLoadEpisode(crew, 401);
    const res = await fetch(`${app.url}/api/channels/${crew.channel.slug}/episodes/${episode.id}/cut-plan`, { headers: { cookie } });
    expect(res.status, app.output()).toBe(200);
    const plan = (await res.json()) as { whole: { groups: unknown[]; pieceCount: number }; levels: unknown[] };
    expect(plan.whole.groups).toHaveLength(8);
    expect(plan.whole.pieceCount).toBeGreaterThan(0);
    expect(plan.levels).toHaveLength(3);
  });
});
