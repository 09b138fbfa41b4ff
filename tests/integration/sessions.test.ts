import { randomUUID } from 'node:crypto';
import { NextRequest } from 'next/server';
import { describe, expect, it } from 'vitest';
import * as authRoute from '@/app/api/auth/[...nextauth]/route';
import * as profileRoute from '@/app/api/profile/route';
import * as sessionsRoute from '@/app/api/profile/sessions/route';
import { db } from '@/db/client';
import { BASE, ORIGIN, call, makeUser, sessionCookie } from './helpers';

type AuthFn = (req: NextRequest, ctx: { params: Promise<{ nextauth: string[] }> }) => Promise<Response>;

/**
 * Calls next-auth's own route in-process. Only for answers given before next-auth runs (it calls
 * cookies() from next/headers, which needs a real request): sign-out itself is tested over HTTP
 * in page-status.test.ts.
 */
async function nextAuth(fn: AuthFn, method: string, action: string[], init: { cookie?: string; body?: string; contentType?: string } = {}) {
  const headers = new Headers({ origin: ORIGIN });
  if (init.cookie) headers.set('cookie', init.cookie);
  if (init.contentType) headers.set('content-type', init.contentType);
  const req = new NextRequest(new URL(`/api/auth/${action.join('/')}`, BASE), { method, headers, body: init.body });
  return fn(req, { params: Promise.resolve({ nextauth: action }) });
}

describe('sessions end on the server (issue 12 item 10)', () => {
  it('“Sign out everywhere” ends every session of the user, and only theirs', async () => {
    const user = await makeUser('everywhere');
    const other = await makeUser('bystander');
    const phone = await sessionCookie(user, { sid: randomUUID(), sv: 0 });
    const laptop = await sessionCookie(user, { sid: randomUUID(), sv: 0 });
    const res = await call(sessionsRoute.DELETE, 'DELETE', { headers: { cookie: phone } });
    expect(res.status).toBe(204);
    for (const cookie of [phone, laptop]) expect((await call(profileRoute.GET, 'GET', { headers: { cookie } })).status).toBe(401);
    expect((await db('users').where({ id: user.id }).first('session_version')).session_version).toBe(1);
    // A new sign-in carries the new version and works.
    expect((await call(profileRoute.GET, 'GET', { headers: { cookie: await sessionCookie(user, { sid: randomUUID(), sv: 1 }) } })).status).toBe(200);
    expect((await call(profileRoute.GET, 'GET', { as: other })).status).toBe(200);
  });

  it('DELETE /api/profile/sessions: 401 signed out, 403 from another site, and nothing changes', async () => {
    const user = await makeUser('sessions-matrix');
    expect((await call(sessionsRoute.DELETE, 'DELETE')).status).toBe(401);
    const cross = await call(sessionsRoute.DELETE, 'DELETE', { as: user, headers: { origin: 'https://evil.example' } });
    expect(cross.status).toBe(403);
    const noOrigin = await call(sessionsRoute.DELETE, 'DELETE', { as: user, headers: { origin: '' } });
    expect(noOrigin.status).toBe(403);
    expect((await db('users').where({ id: user.id }).first('session_version')).session_version).toBe(0);
  });
});

describe('next-auth routes and bad bodies (issue 12 item 16)', () => {
  it('answer a malformed or non-object JSON body with 400, not 500', async () => {
    for (const body of ['{', '{"email":', '[]', '"x"', 'null']) {
      const res = await nextAuth(authRoute.POST as AuthFn, 'POST', ['callback', 'credentials'], { body, contentType: 'application/json' });
      expect(res.status, body).toBe(400);
      expect(((await res.json()) as { error: { code: string } }).error.code).toBe('malformed_json');
    }
  });
});
