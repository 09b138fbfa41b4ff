import { describe, expect, it } from 'vitest';
import * as profileRoute from '@/app/api/profile/route';
import { call, makeUser } from './helpers';

describe('profile', () => {
  it('401 when signed out', async () => {
    expect((await call(profileRoute.GET, 'GET')).status).toBe(401);
    expect((await call(profileRoute.PATCH, 'PATCH', { body: { emailOptOut: true } })).status).toBe(401);
  });

  it('turns shot e-mails off and on, and renames, for the signed-in person only', async () => {
    const me = await makeUser('me');
    const other = await makeUser('other');
    const off = await call(profileRoute.PATCH, 'PATCH', { as: me, body: { emailOptOut: true, name: 'Sam Joiner' } });
    expect(off.status).toBe(200);
    expect(off.json.profile).toMatchObject({ id: me.id, emailOptOut: true, name: 'Sam Joiner' });
    expect((await call(profileRoute.GET, 'GET', { as: other })).json.profile).toMatchObject({ id: other.id, emailOptOut: false });
  });

  it('400 with fields for bad input', async () => {
    const me = await makeUser('me');
    const res = await call(profileRoute.PATCH, 'PATCH', { as: me, body: { emailOptOut: 'sometimes', name: '' } });
    expect(res.status).toBe(400);
    expect(Object.keys(res.json.error?.fields ?? {})).toEqual(expect.arrayContaining(['emailOptOut', 'name']));
    expect((await call(profileRoute.PATCH, 'PATCH', { as: me, body: { email: 'x@y.z' } })).status).toBe(400);
  });
});
