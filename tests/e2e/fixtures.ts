import path from 'node:path';
import AxeBuilder from '@axe-core/playwright';
import { expect, test as base, type BrowserContextOptions, type Page } from '@playwright/test';
import type { SegmentDto } from '@/lib/segments/schemas';
import accounts from '../../db/seeds/demo-accounts.json';

export { invitationTokenFrom, waitForMail, type CaughtMail } from '../support/mail-catcher';

export type DemoRole = 'host' | 'shopHand' | 'editor';
export type Account = { email: string; password: string; name: string; role: string };

const account = (role: string): Account => {
  const found = accounts.find((a) => a.role === role);
  if (!found) throw new Error(`demo-accounts.json has no ${role}`);
  return found;
};

export const demo: Record<DemoRole, Account> = { host: account('host'), shopHand: account('shop_hand'), editor: account('editor') };
export const DEMO_SLUG = 'tallowmere-woodshop';

/** Where sign-in.setup.ts keeps each demo role's signed-in browser state (cookies) for the run. */
export const authStateFile = (role: DemoRole) => path.join(__dirname, '..', '..', 'test-results', '.auth', `${role}.json`);

/** A phone held in the shop: narrow, touch. */
export const PHONE: BrowserContextOptions = { viewport: { width: 375, height: 800 }, hasTouch: true, isMobile: true };

/** A browser sends Origin on every state change; API calls made by a test must send it too. */
export const sameOrigin = { origin: `http://127.0.0.1:${process.env.E2E_PORT ?? 3100}` };

/** Fails on serious or critical axe-core violations of the page as it is now. */
export async function expectAccessible(page: Page) {
  const results = await new AxeBuilder({ page }).analyze();
  const bad = results.violations.filter((v) => v.impact === 'serious' || v.impact === 'critical');
  expect(bad.map((v) => `${v.id}: ${v.help} (${v.nodes.map((n) => n.target.join(' ')).join(', ')})`)).toEqual([]);
}

/** A fresh episode made through the API as the signed-in host, so this test owns its shots. */
export async function newEpisode(page: Page, title: string) {
  const api = `/api/channels/${DEMO_SLUG}`;
  const ep = await page.request.post(`${api}/episodes`, { headers: sameOrigin, data: { title, stage: 'shoot', shootDate: '2027-02-06' } });
  expect(ep.status()).toBe(201);
  const { episode } = (await ep.json()) as { episode: { id: string } };
  const st = await page.request.post(`${api}/episodes/${episode.id}/starter`, { headers: sameOrigin });
  const { segments } = (await st.json()) as { segments: SegmentDto[] };
  const build = segments.find((s) => s.kind === 'build' && s.level === 1)!;
  return { episodeId: episode.id, build, segmentUrl: `/c/${DEMO_SLUG}/episodes/${episode.id}/segments/${build.id}` };
}

type Fixtures = {
  /** A page in its own browser context, already signed in as a demo role (from the saved state). */
  signedIn: (role: DemoRole, options?: BrowserContextOptions) => Promise<Page>;
};

export const test = base.extend<Fixtures>({
  signedIn: async ({ browser }, provide) => {
    const opened: { close(): Promise<void> }[] = [];
    await provide(async (role, options = {}) => {
      const context = await browser.newContext({ ...options, storageState: authStateFile(role) });
      opened.push(context);
      return context.newPage();
    });
    for (const context of opened) await context.close();
  },
});

export { expect };
