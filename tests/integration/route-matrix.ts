import { describe, expect, it } from 'vitest';
import type { Role } from '@/lib/auth/policy';
import { call, makeCrew } from './helpers';

export type Crew = Awaited<ReturnType<typeof makeCrew>>;

export type RouteCase = {
  name: string;
  fn: Parameters<typeof call>[0];
  method: string;
  allowed: Role[];
  params: (c: Crew) => Promise<Record<string, string>> | Record<string, string>;
  body?: (c: Crew) => unknown;
  badBody?: unknown;
  okStatus: number;
  /** Request path with its query string, for routes that read one. */
  path?: string;
};

const asRole = (c: Crew, role: Role) => ({ host: c.host, shop_hand: c.shopHand, editor: c.editor })[role];

/** DESIGN.md: every route has tests for 401, 403, 404 (other channel), 400 with fields and the happy path. */
export function describeRouteMatrix(cases: RouteCase[]) {
  describe.each(cases)('$name', (tc) => {
    it('401 when signed out', async () => {
      const c = await makeCrew();
      const res = await call(tc.fn, tc.method, { params: await tc.params(c), body: tc.body?.(c), path: tc.path });
      expect(res.status).toBe(401);
      expect(res.json.error?.code).toBe('unauthenticated');
    });

    it('404 for someone of another channel', async () => {
      const c = await makeCrew();
      const other = await makeCrew();
      const res = await call(tc.fn, tc.method, { as: other.host, params: await tc.params(c), body: tc.body?.(c), path: tc.path });
      expect(res.status).toBe(404);
    });

    it('403 for each role without the capability, success for each role with it', async () => {
      for (const role of ['host', 'shop_hand', 'editor'] as const) {
        const c = await makeCrew();
        const res = await call(tc.fn, tc.method, { as: asRole(c, role), params: await tc.params(c), body: tc.body?.(c), path: tc.path });
        expect(res.status, `${role}: ${JSON.stringify(res.json)}`).toBe(tc.allowed.includes(role) ? tc.okStatus : 403);
      }
    });

    if (tc.method !== 'GET') {
      it('403 for a state change sent from another site, or with a cookie and no Origin', async () => {
        const c = await makeCrew();
        const params = await tc.params(c);
        for (const headers of [{ origin: 'https://evil.example' }, { origin: 'null' }]) {
          const res = await call(tc.fn, tc.method, { as: c.host, params, body: tc.body?.(c), headers });
          expect(res.status, JSON.stringify(headers)).toBe(403);
          expect(res.json.error?.message).toMatch(/did not come from a Kerfline page/);
        }
      });
    }

    if (tc.badBody !== undefined) {
      it('400 with field errors for bad input', async () => {
        const c = await makeCrew();
        const res = await call(tc.fn, tc.method, { as: c.host, params: await tc.params(c), body: tc.badBody, path: tc.path });
        expect(res.status).toBe(400);
        expect(Object.keys(res.json.error?.fields ?? {}).length).toBeGreaterThan(0);
      });
    }
  });
}
