import type { Page } from '@playwright/test';
import { DEMO_SLUG, expect, expectAccessible, test, type DemoRole } from './fixtures';
import { channelLinks, measureOverflow, routeShape } from './pages/overflow';

// Issue 15: visit every page of the app as each role at a phone's width (and at a desktop's) and
// check that nothing is wider than the viewport. The pages are found as a new user finds them: by
// following the links of each page from the dashboard, as the Host (who sees every link); then each
// role opens every one of those pages, including the ones its role is refused.
const start = `/c/${DEMO_SLUG}`;
const PHONE = { viewport: { width: 375, height: 800 }, hasTouch: true, isMobile: true };
const DESKTOP = { viewport: { width: 1280, height: 900 } };

async function crawl(page: Page): Promise<string[]> {
  const seen = new Map<string, string>();
  const queue = [start];
  while (queue.length > 0) {
    const path = queue.shift()!;
    const shape = routeShape(path);
    if (seen.has(shape)) continue;
    seen.set(shape, path);
    const res = await page.goto(path);
    expect(res?.status(), path).toBe(200);
    await page.waitForLoadState('networkidle');
    for (const link of await channelLinks(page, DEMO_SLUG)) if (!seen.has(routeShape(link))) queue.push(link);
  }
  return [...seen.values()];
}

// Found once per worker; a worker restarted after a failure crawls again.
let found: string[] = [];
async function appPages(signedIn: (role: DemoRole, o?: object) => Promise<Page>): Promise<string[]> {
  if (found.length === 0) found = await crawl(await signedIn('host', DESKTOP));
  return found;
}

test.describe('every page fits the screen', () => {
  test('the host can reach every kind of page from the dashboard', async ({ signedIn }) => {
    test.setTimeout(180_000);
    const pages = await appPages(signedIn);
    const shapes = pages.map(routeShape);
    // The crawl must have found the app, not stopped at the dashboard.
    for (const expected of ['/episodes', '/episodes/:id', '/episodes/:id/segments/:id', '/episodes/:id/cut-plan', '/episodes/:id/shoot-sheet', '/shots', '/stock', '/sponsors', '/sponsors/:id', '/settings', '/settings/crew', '/episodes/new']) {
      expect(shapes).toContain(`${start}${expected}`.replace(`${start}${start}`, start));
    }
  });

  // Every role at a phone's width; the desktop width once, as the Host, who is shown the most.
  const runs: [DemoRole, string, typeof PHONE | typeof DESKTOP][] = [
    ['host', '375 px', PHONE],
    ['shopHand', '375 px', PHONE],
    ['editor', '375 px', PHONE],
    ['host', '1280 px', DESKTOP],
  ];
  for (const [role, label, viewport] of runs) {
    test(`as the ${role}, at ${label} nothing is wider than the viewport`, async ({ signedIn }) => {
      test.setTimeout(300_000);
      const pages = await appPages(signedIn);
      expect(pages.length).toBeGreaterThan(10);
      const page = await signedIn(role, viewport);
      const problems: string[] = [];
      for (const path of pages) {
        const res = await page.goto(path);
        // A role may be refused a page (403, inside the shell); it must still fit.
        expect([200, 403], `${path} as ${role}`).toContain(res?.status());
        await expect(page.locator('main h1').first()).toBeVisible();
        const o = await measureOverflow(page);
        if (o.scrollWidth > o.innerWidth || o.offenders.length > 0) problems.push(`${routeShape(path)}: ${o.scrollWidth}px wide; ${o.offenders.join('; ')}`);
        // axe on every page as the Host; the other roles see the same pages with less on them, so they run
        // it where their page differs in kind (a refusal), which keeps this check inside npm test's budget.
        if (viewport === PHONE && (role === 'host' || res?.status() === 403)) await expectAccessible(page);
      }
      expect(problems).toEqual([]);
    });
  }
});
