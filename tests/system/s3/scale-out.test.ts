import { createHash, randomBytes } from 'node:crypto';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { db } from '@/db/client';
import { mailAfterEverythingSent, waitForMail } from '../../support/mail-catcher';
import { makeCrew, PASSWORD, sessionCookie } from '../../integration/helpers';
import type { Crew } from '../../integration/route-matrix';
import { makeShotEpisode } from '../../integration/shot-fixtures';
import { startTusUpload } from '../tus-client';
import { bucketStore, clipsOf, idOf, makeVideo, ports, s3App, slowPatch, storedSha } from './s3-apps';

// Two app processes over one PostgreSQL and one S3 server, as behind a load balancer; both run the
// background workers (assignment e-mail, clip media jobs) at a quick poll.
const workers = { KERFLINE_MAIL_WORKER: 'on', SHOT_MAIL_POLL_MS: '200', CLIP_JOB_POLL_MS: '200' };
const a = s3App(ports.a, workers);
const b = s3App(ports.b, workers);
const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'kerfline-scale-'));
const tus = { 'Tus-Resumable': '1.0.0' };
// Sized for two cores shared with builds and benchmarks (load averages of 15-25 seen): ffmpeg, Swift and
// two app processes share them, so media jobs and uploads take several times what they take on an idle machine.
const HEAVY = { timeout: 240_000 };
const MEDIA_WAIT_MS = 150_000;

let crew: Crew;
let segmentId: string;
let cookie: string;

beforeAll(async () => {
  await Promise.all([a.start(), b.start()]);
  crew = await makeCrew();
  segmentId = (await makeShotEpisode(crew)).build.id;
  cookie = await sessionCookie(crew.shopHand);
});

afterAll(async () => {
  // allSettled: one process failing to die must not keep the other running.
  await Promise.allSettled([a.kill(), b.kill()]);
  fs.rmSync(dir, { recursive: true, force: true });
});

const meta = (filename: string) => ({ segmentId, filename, filetype: 'video/quicktime' });

describe('two app processes behind one address', () => {
  it('accepts a sign-in made on one process on the other', async () => {
    const csrf = await fetch(`${a.url}/api/auth/csrf`);
    const { csrfToken } = (await csrf.json()) as { csrfToken: string };
    const csrfCookie = csrf.headers.getSetCookie().map((c) => c.split(';')[0]).join('; ');
    const signIn = await fetch(`${a.url}/api/auth/callback/credentials`, {
      method: 'POST',
      redirect: 'manual',
      headers: { 'content-type': 'application/x-www-form-urlencoded', cookie: csrfCookie, origin: a.url },
      body: new URLSearchParams({ csrfToken, email: crew.editor.email, password: PASSWORD, json: 'true' }),
    });
    const session = signIn.headers.getSetCookie().find((c) => c.startsWith('next-auth.session-token='));
    expect(session).toBeTruthy();
    const onB = session!.split(';')[0]!;
    const me = await fetch(`${b.url}/api/auth/session`, { headers: { cookie: onB } });
    expect(((await me.json()) as { user?: { email?: string } }).user?.email).toBe(crew.editor.email);
    expect((await fetch(`${b.url}/api/channels/${crew.channel.slug}`, { headers: { cookie: onB } })).status).toBe(200);
    expect((await fetch(`${b.url}/api/channels/${crew.channel.slug}`)).status).toBe(401);
  });

  it('finishes on one process an upload begun on the other, with the right hash, one clip row and one poster', HEAVY, async () => {
    const video = path.join(dir, 'moved.mov');
    const { sha, size } = makeVideo(video, 10);
    let aborted: Promise<void> | null = null;
    const first = startTusUpload(`${a.url}/api/uploads`, video, {
      cookie,
      metadata: meta('moved.mov'),
      onProgress: (sent) => {
        if (!aborted && sent > size * 0.5) aborted = first.abort();
      },
    });
    await expect.poll(() => aborted !== null, { timeout: 60_000, interval: 50 }).toBe(true);
    await aborted;
    const id = idOf(first.url!);
    // The upload URL is relative to whichever process answers: the same path on B.
    const onB = `${b.url}/api/uploads/${id}`;
    const head = await fetch(onB, { method: 'HEAD', headers: { ...tus, cookie } });
    expect(head.status).toBe(200);
    expect(Number(head.headers.get('upload-offset'))).toBeGreaterThan(0);
    await startTusUpload(`${b.url}/api/uploads`, video, { cookie, metadata: {}, uploadUrl: onB }).done;

    const clips = await clipsOf(id);
    expect(clips).toHaveLength(1);
    expect(clips[0]).toMatchObject({ sha256: sha, size_bytes: String(size) });
    expect(await storedSha(id)).toBe(sha);
    await expect.poll(async () => (await db('clips').where({ upload_id: id }).first('probe_state')).probe_state, { timeout: MEDIA_WAIT_MS, interval: 300 }).toBe('done');
    expect((await db('clips').where({ upload_id: id }).first('has_poster')).has_poster).toBe(true);
    const clipId = clips[0]!.id as string;
    for (const app of [a, b]) {
      const poster = await fetch(`${app.url}/api/channels/${crew.channel.slug}/clips/${clipId}/poster`, { headers: { cookie } });
      expect(poster.status).toBe(200);
    }
  });

  it('lets one of two simultaneous PATCHes to the same upload through different processes win; the bytes are all the winner’s', HEAVY, async () => {
    const size = 12 * 1024 * 1024;
    const bodies = [randomBytes(size), randomBytes(size)] as const;
    const made = await fetch(`${a.url}/api/uploads`, {
      method: 'POST',
      headers: { ...tus, cookie, origin: a.url, 'Upload-Length': String(size), 'Upload-Metadata': `segmentId ${Buffer.from(segmentId).toString('base64')},filename ${Buffer.from('race.bin').toString('base64')},filetype ${Buffer.from('video/mp4').toString('base64')}` },
    });
    expect(made.status).toBe(201);
    const id = idOf(made.headers.get('location')!);
    const statuses = await Promise.all([
      slowPatch(`${a.url}/api/uploads/${id}`, cookie, 0, bodies[0]),
      slowPatch(`${b.url}/api/uploads/${id}`, cookie, 0, bodies[1]),
    ]);
    // One writes every byte; the other, let in only after, finds the offset moved (409 Conflict).
    expect([...statuses].sort()).toEqual([204, 409]);
    const winner = bodies[statuses.indexOf(204)]!;
    const winnerSha = createHash('sha256').update(winner).digest('hex');
    expect(await storedSha(id)).toBe(winnerSha);
    const clips = await clipsOf(id);
    expect(clips).toHaveLength(1);
    expect(clips[0]).toMatchObject({ sha256: winnerSha, size_bytes: String(size) });
  });
});

describe('background work with two processes running', () => {
  const auditSql = `
    create table if not exists test_job_audit (job_id bigint, event text, at timestamptz default clock_timestamp());
    create or replace function test_audit_clip_jobs() returns trigger language plpgsql as $$
    begin
      if tg_op = 'DELETE' then insert into test_job_audit (job_id, event) values (old.id, 'done'); return old; end if;
      if old.locked_at is null and new.locked_at is not null then insert into test_job_audit (job_id, event) values (new.id, 'claimed'); end if;
      return new;
    end $$;
    drop trigger if exists test_audit_clip_jobs on clip_jobs;
    create trigger test_audit_clip_jobs after update or delete on clip_jobs for each row execute function test_audit_clip_jobs();`;

  beforeAll(async () => {
    // A test-only witness: every claim and completion of a clip media job, whichever process made it.
    await db.raw(auditSql);
  });

  afterAll(async () => {
    await db.raw('drop trigger if exists test_audit_clip_jobs on clip_jobs; drop function if exists test_audit_clip_jobs(); drop table if exists test_job_audit;');
  });

  it('runs each clip media job once and gives every clip one poster, uploads spread over both processes', HEAVY, async () => {
    const video = path.join(dir, 'short.mov');
    makeVideo(video, 1);
    const runs = Array.from({ length: 6 }, (_, i) => startTusUpload(`${(i % 2 ? a : b).url}/api/uploads`, video, { cookie, metadata: meta(`take-${i}.mov`) }));
    await Promise.all(runs.map((r) => r.done));
    const ids = runs.map((r) => idOf(r.url!));
    const clips: { id: string; upload_id: string }[] = await db('clips').whereIn('upload_id', ids).select('id', 'upload_id');
    expect(clips).toHaveLength(6);
    const jobIds: string[] = (await db('clip_jobs').whereIn('clip_id', clips.map((c) => c.id)).pluck('id')).map(String);
    await expect
      .poll(async () => db('clips').whereIn('upload_id', ids).where({ probe_state: 'done', has_poster: true }).count<{ n: string }[]>('* as n').first().then((r) => Number(r?.n)), { timeout: MEDIA_WAIT_MS, interval: 300 })
      .toBe(6);
    const audit: { job_id: string; event: string }[] = await db('test_job_audit').whereIn('job_id', jobIds).select('job_id', 'event');
    for (const job of jobIds) {
      expect(audit.filter((e) => String(e.job_id) === job).map((e) => e.event).sort(), `job ${job}`).toEqual(['claimed', 'done']);
    }
    const store = bucketStore();
    for (const c of clips) expect(await store.readPoster(c.id), c.id).not.toBeNull();
  });

  it('sends each due assignment burst exactly once', HEAVY, async () => {
    const crews = await Promise.all(Array.from({ length: 5 }, async () => {
      const c = await makeCrew();
      await makeShotEpisode(c);
      return c;
    }));
    const channelIds = crews.map((c) => c.channel.id);
    const bursts: { user_id: string }[] = await db('shot_mail_bursts').whereIn('channel_id', channelIds).select('user_id');
    expect(bursts.length).toBeGreaterThanOrEqual(5);
    await db('shot_mail_bursts').whereIn('channel_id', channelIds).update({ due_at: db.raw(`now() - interval '1 second'`) });
    await expect.poll(async () => (await db('shot_mail_bursts').whereIn('channel_id', channelIds)).length, { timeout: 60_000, interval: 200 }).toBe(0);
    const emails = new Map(crews.flatMap((c) => [c.host, c.shopHand, c.editor]).map((u) => [u.id, u.email]));
    for (const { user_id } of bursts) {
      const address = emails.get(user_id)!;
      await waitForMail(address, { timeoutMs: 60_000 });
      // Everything sent so far has landed: a duplicate from the other process would be here too.
      expect(await mailAfterEverythingSent(address), address).toHaveLength(1);
    }
  });
});
