import { randomUUID } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { db } from '@/db/client';
import { AppServer } from './app-server';
import { makeOutlinedEpisode } from '../integration/episode-fixtures';
import { PASSWORD, makeCrew, makeUser, sessionCookie } from '../integration/helpers';
import { makeDeal } from '../integration/sponsor-fixtures';
import { hostMember } from '../integration/handoff-fixtures';
import { lockHandoff } from '@/lib/handoffs/queries';

// Real HTTP against the built app: status codes of streamed pages, and what the server takes as
// the client's address, are only visible there. Its own port, next to the upload tests' one.
const PORT = Number(process.env.PAGE_TEST_PORT ?? Number(process.env.UPLOAD_TEST_PORT ?? 3197) - 1);
const app = new AppServer(PORT, {
  DATABASE_URL: process.env.DATABASE_URL ?? '',
  NEXTAUTH_SECRET: process.env.NEXTAUTH_SECRET ?? '',
  NEXTAUTH_URL: `http://127.0.0.1:${PORT}`,
  APP_URL: `http://127.0.0.1:${PORT}`,
  KERFLINE_CLIP_WORKER: 'off',
});

beforeAll(() => app.start(), 90_000);
afterAll(() => app.kill());

const page = async (path: string, cookie?: string) =>
  fetch(`${app.url}${path}`, { headers: cookie ? { cookie } : {}, redirect: 'manual' });

describe('pages answer real 404 and 403 statuses (issue 12 item 15)', () => {
  it('an outsider gets 404 for another channel’s episode, under either channel’s address', async () => {
    const owner = await makeCrew();
    const outsider = await makeCrew();
    const { episode } = await makeOutlinedEpisode(owner);
    const cookie = await sessionCookie(outsider.host);
    expect((await page(`/c/${outsider.channel.slug}/episodes/${episode.id}`, cookie)).status).toBe(404);
    expect((await page(`/c/${owner.channel.slug}/episodes/${episode.id}`, cookie)).status).toBe(404);
    expect((await page(`/c/${outsider.channel.slug}/episodes/${episode.id}/shoot-sheet`, cookie)).status).toBe(404);
    expect((await page(`/c/${owner.channel.slug}/episodes/${episode.id}`, await sessionCookie(owner.host))).status).toBe(200);
  });

  it('an Editor gets 403 on the new-episode page; a Host gets it', async () => {
    const crew = await makeCrew();
    const refused = await page(`/c/${crew.channel.slug}/episodes/new`, await sessionCookie(crew.editor));
    expect(refused.status).toBe(403);
    // Issue 15: the refusal comes inside the channel's app shell (its navigation) as the not-allowed page. A 403
    // is streamed as Next's error document plus the React payload, so the payload is what names them; the
    // rendered words are checked in the browser (tests/e2e/first-hour.spec.ts).
    const html = await refused.text();
    expect(html).toContain('NEXT_HTTP_ERROR_FALLBACK;403');
    expect(html).toContain('NavLinks');
    expect(html).toContain('NotAllowed');
    expect((await page(`/c/${crew.channel.slug}/episodes/new`, await sessionCookie(crew.host))).status).toBe(200);
  });

  it('sponsor pages: a shop hand gets 403 on the list, an editor 403 on a deal, an outsider 404 on another channel’s deal', async () => {
    const crew = await makeCrew();
    const { deal } = await makeDeal(crew);
    const outsider = await makeCrew();
    expect((await page(`/c/${crew.channel.slug}/sponsors`, await sessionCookie(crew.shopHand))).status).toBe(403);
    expect((await page(`/c/${crew.channel.slug}/sponsors`, await sessionCookie(crew.editor))).status).toBe(200);
    expect((await page(`/c/${crew.channel.slug}/sponsors/${deal.id}`, await sessionCookie(crew.editor))).status).toBe(403);
    expect((await page(`/c/${outsider.channel.slug}/sponsors/${deal.id}`, await sessionCookie(outsider.host))).status).toBe(404);
    expect((await page(`/c/${crew.channel.slug}/sponsors/${deal.id}`, await sessionCookie(crew.host))).status).toBe(200);
  });

  it('the handoff page: a shop hand gets 403, a version that was never locked 404, the editor 200', async () => {
    const crew = await makeCrew();
    const { episode } = await makeOutlinedEpisode(crew);
    await lockHandoff(await hostMember(crew), crew.host, episode.id, { note: '' });
    const at = (v: string) => `/c/${crew.channel.slug}/episodes/${episode.id}/handoff/${v}`;
    expect((await page(at('1'), await sessionCookie(crew.shopHand))).status).toBe(403);
    expect((await page(at('2'), await sessionCookie(crew.editor))).status).toBe(404);
    expect((await page(at('1'), await sessionCookie(crew.editor))).status).toBe(200);
  });

  it('a signed-out session sends pages to sign-in, not into the channel (issue 12 item 10)', async () => {
    const crew = await makeCrew();
    const sid = randomUUID();
    const cookie = await sessionCookie(crew.host, { sid, sv: 0 });
    expect((await page(`/c/${crew.channel.slug}`, cookie)).status).toBe(200);
    await db('revoked_sessions').insert({ sid, user_id: crew.host.id, expires_at: db.raw(`now() + interval '1 day'`) });
    const after = await page(`/c/${crew.channel.slug}`, cookie);
    expect(after.status).toBe(307);
    expect(after.headers.get('location')).toMatch(/\/sign-in/);
  });
});

describe('the throttle keys on the socket address, not on X-Forwarded-For (issue 12 item 9)', () => {
  it('a client-sent X-Forwarded-For does not pick the throttle key', async () => {
    const user = await makeUser('spoof');
    const csrfRes = await fetch(`${app.url}/api/auth/csrf`);
    const { csrfToken } = (await csrfRes.json()) as { csrfToken: string };
    const csrfCookie = (csrfRes.headers.getSetCookie().find((c) => c.startsWith('next-auth.csrf-token=')) ?? '').split(';')[0] ?? '';
    // An address no other test uses (the integration tests share this database and use 198.51.100.x).
    const spoofed = `2001:db8:5eed::${randomUUID().slice(0, 4)}`;
    const before = (await db('rate_limits').where({ limit_key: 'ip:127.0.0.1' }).first('hits'))?.hits ?? 0;
    const res = await fetch(`${app.url}/api/auth/callback/credentials`, {
      method: 'POST',
      redirect: 'manual',
      headers: {
        'content-type': 'application/x-www-form-urlencoded',
        cookie: csrfCookie,
        origin: app.url,
        'x-forwarded-for': spoofed,
        'x-kerfline-peer': spoofed,
      },
      body: new URLSearchParams({ csrfToken, email: user.email, password: 'wrong-password', json: 'true' }).toString(),
    });
    expect(res.status).toBeLessThan(500);
    expect(await db('rate_limits').where({ limit_key: `ip:${spoofed}` }).first()).toBeUndefined();
    const after = (await db('rate_limits').where({ limit_key: 'ip:127.0.0.1' }).first('hits'))?.hits ?? 0;
    expect(after === before + 1 || after === 1).toBe(true);
  });

  it('next-auth over HTTP answers malformed JSON with 400 (issue 12 item 16)', async () => {
    const res = await fetch(`${app.url}/api/auth/callback/credentials`, { method: 'POST', headers: { 'content-type': 'application/json', origin: app.url }, body: '{"email":' });
    expect(res.status).toBe(400);
  });
});

/** next-auth's csrf token and its cookie, as its sign-in and sign-out forms send them. */
async function csrf(): Promise<{ token: string; cookie: string }> {
  const res = await fetch(`${app.url}/api/auth/csrf`);
  const { csrfToken } = (await res.json()) as { csrfToken: string };
  const cookie = (res.headers.getSetCookie().find((c) => c.startsWith('next-auth.csrf-token=')) ?? '').split(';')[0] ?? '';
  return { token: csrfToken, cookie };
}

const form = (fields: Record<string, string>) => new URLSearchParams(fields).toString();

describe('signing out ends the session on the server (issue 12 item 10)', () => {
  it('a real sign-in, then sign-out: the old cookie gets 401 from the API and sign-in from pages', async () => {
    const crew = await makeCrew();
    const { token, cookie: csrfCookie } = await csrf();
    const signIn = await fetch(`${app.url}/api/auth/callback/credentials`, {
      method: 'POST',
      redirect: 'manual',
      headers: { 'content-type': 'application/x-www-form-urlencoded', cookie: csrfCookie, origin: app.url },
      body: form({ csrfToken: token, email: crew.host.email, password: PASSWORD, json: 'true' }),
    });
    const session = (signIn.headers.getSetCookie().find((c) => c.startsWith('next-auth.session-token=')) ?? '').split(';')[0] ?? '';
    expect(session).not.toBe('');
    expect((await fetch(`${app.url}/api/profile`, { headers: { cookie: session } })).status).toBe(200);

    const out = await fetch(`${app.url}/api/auth/signout`, {
      method: 'POST',
      redirect: 'manual',
      headers: { 'content-type': 'application/x-www-form-urlencoded', cookie: `${session}; ${csrfCookie}`, origin: app.url },
      body: form({ csrfToken: token, json: 'true' }),
    });
    expect(out.status).toBeLessThan(400);
    expect(await db('revoked_sessions').where({ user_id: crew.host.id }).first()).toBeTruthy();

    // The browser dropped the cookie; whoever copied it finds it dead.
    expect((await fetch(`${app.url}/api/profile`, { headers: { cookie: session } })).status).toBe(401);
    const pageAfter = await page(`/c/${crew.channel.slug}`, session);
    expect(pageAfter.status).toBe(307);
  });
});

describe('next-auth’s routes never answer 500 to a bad body (issue 12 item 16)', () => {
  it('for sign-in and sign-out with broken, empty and wrong-type bodies', async () => {
    const bodies = ['', '{', '[]', 'null', '"str"', '{"a":1}{', '\u0000', '{"csrfToken":{"$ne":1}}', 'csrfToken=&email=x'];
    const types = ['application/json', 'application/x-www-form-urlencoded', 'text/plain', ''];
    for (const action of ['callback/credentials', 'signout']) {
      for (const body of bodies) {
        for (const type of types) {
          const res = await fetch(`${app.url}/api/auth/${action}`, {
            method: 'POST',
            redirect: 'manual',
            headers: { ...(type ? { 'content-type': type } : {}), origin: app.url },
            body,
          });
          expect(res.status, `${action} ${type} ${body}`).toBeLessThan(500);
        }
      }
    }
  });
});
