import AxeBuilder from '@axe-core/playwright';
import { expect, test as base, type Page } from '@playwright/test';
import type { SegmentDto } from '@/lib/segments/schemas';
import accounts from '../../db/seeds/demo-accounts.json';

export const demo = {
  host: accounts.find((a) => a.role === 'host')!,
  shopHand: accounts.find((a) => a.role === 'shop_hand')!,
  editor: accounts.find((a) => a.role === 'editor')!,
};
export const DEMO_SLUG = 'tallowmere-woodshop';

/** A browser sends Origin on every state change; API calls made by a test must send it too. */
export const sameOrigin = { origin: `http://127.0.0.1:${process.env.E2E_PORT ?? 3100}` };

/** Fails on serious or critical axe-core violations of the page as it is now. */
export async function expectAccessible(page: Page) {
  const results = await new AxeBuilder({ page }).analyze();
  const bad = results.violations.filter((v) => v.impact === 'serious' || v.impact === 'critical');
  expect(bad.map((v) => `${v.id}: ${v.help} (${v.nodes.map((n) => n.target.join(' ')).join(', ')})`)).toEqual([]);
}

export async function signIn(page: Page, account: { email: string; password: string }) {
  await page.goto('/sign-in');
  await page.getByLabel('E-mail').fill(account.email);
  await page.getByLabel('Password').fill(account.password);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await page.waitForURL(/\/c\/[a-z0-9-]+$/);
}

type CaughtMail = { subject: string; text: string; to: { address: string }[] };

export async function waitForMail(address: string): Promise<CaughtMail> {
  const url = `${process.env.MAILDEV_WEB_URL ?? 'http://127.0.0.1:1081'}/api/email`;
  let found: CaughtMail | undefined;
  await expect
    .poll(async () => {
      const all = (await (await fetch(url)).json()) as CaughtMail[];
      found = all.find((m) => m.to.some((t) => t.address === address));
      return Boolean(found);
    }, { timeout: 15_000 })
    .toBe(true);
  return found!;
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

export const test = base;
export { expect };
