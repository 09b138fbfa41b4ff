import { execFileSync } from 'node:child_process';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import type { Page } from '@playwright/test';
import { DEMO_SLUG, PHONE, expect, expectAccessible, newEpisode, sameOrigin, test } from './fixtures';
import { SegmentPage } from './pages/segment-page';
import { ShopBoardPage } from './pages/shop-board-page';
import { expectAnnounced, pressUntilAnnounced } from './pages/live-region';
import { StockRackPage } from './pages/stock-rack-page';

// Issue 15, one check per thing a new crew noticed in its first hour (the phone widths are phone-layout.spec.ts).
const api = `/api/channels/${DEMO_SLUG}`;
const DESKTOP = { viewport: { width: 1280, height: 900 } };

const escapeRegExp = (text: string) => text.replace(/[.*+?^${}()|[\]\\]/g, '\\$&');

async function shopHandId(host: Page): Promise<string> {
  const res = await host.request.get(`${api}/crew`);
  const { crew } = (await res.json()) as { crew: { userId: string; role: string }[] };
  return crew.find((m) => m.role === 'shop_hand')!.userId;
}

test.describe('refusals', () => {
  test('a refused page is a 403 inside the app shell that names the role it is for', async ({ signedIn }) => {
    const editor = await signedIn('editor', DESKTOP);
    const res = await editor.goto(`/c/${DEMO_SLUG}/episodes/new`);
    expect(res?.status()).toBe(403);
    await expect(editor.getByRole('heading', { level: 1, name: 'Not for your role' })).toBeVisible();
    await expect(editor.getByText('This page is for the Host.')).toBeVisible();
    await expect(editor.getByText('You are signed in as Editor')).toBeVisible();
    await expect(editor.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Episodes' })).toBeVisible();
    await expectAccessible(editor);

    const shop = await signedIn('shopHand', PHONE);
    const sponsors = await shop.goto(`/c/${DEMO_SLUG}/sponsors`);
    expect(sponsors?.status()).toBe(403);
    await expect(shop.getByText('This page is for the Host and the Editor.')).toBeVisible();
    await expect(shop.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Shots' })).toBeVisible();
    await expectAccessible(shop);
  });

  test('an Editor’s shots page promises no assignments', async ({ signedIn }) => {
    const editor = await signedIn('editor', DESKTOP);
    await editor.goto(`/c/${DEMO_SLUG}/shots?view=mine`);
    await expect(editor.getByRole('heading', { level: 1, name: 'Shots' })).toBeVisible();
    await expect(editor.getByRole('link', { name: 'My shots' })).toHaveCount(0);
    await expect(editor.getByText(/assigned to you/)).toHaveCount(0);
    await expectAccessible(editor);
  });
});

test('a segment waiting for its safety review: Captured disabled with the reason, and the review asked for before shoot day', async ({ signedIn }) => {
  const stamp = Date.now().toString(36);
  const host = await signedIn('host', DESKTOP);
  const { episodeId, build } = await newEpisode(host, `Safety first ${stamp}`);
  expect((await host.request.put(`${api}/segments/${build.id}/tools`, { headers: sameOrigin, data: { tools: ['table_saw'] } })).status()).toBe(200);
  const description = `Rip the rails ${stamp}`;
  const shot = await host.request.post(`${api}/segments/${build.id}/shots`, { headers: sameOrigin, data: { description, assigneeId: await shopHandId(host) } });
  expect(shot.status()).toBe(201);

  const shop = await signedIn('shopHand', PHONE);
  await shop.goto(`/c/${DEMO_SLUG}/shots?view=mine`);
  const card = shop.getByRole('listitem').filter({ hasText: description });
  const captured = card.getByRole('button', { name: `Mark captured: ${description}` });
  await expect(captured).toBeDisabled();
  await expect(card.getByText('Captured waits for the safety review of this segment’s tools. A Host can review it on the segment page.')).toBeVisible();
  // Shots of several segments mix here: the number says which segment (segment.shot).
  await expect(card.getByRole('link', { name: new RegExp(`^${escapeRegExp(build.title)} · Shot \\d+\\.1$`) })).toBeVisible();
  await expectAccessible(shop);

  await shop.goto(`/c/${DEMO_SLUG}`);
  const panel = shop.getByRole('region', { name: 'Safety reviews before the shoot' });
  await expect(panel.getByRole('link', { name: new RegExp(escapeRegExp(build.title)) }).filter({ hasText: `Safety first ${stamp}` })).toBeVisible();
  await expectAccessible(shop);

  await host.goto(`/c/${DEMO_SLUG}/episodes/${episodeId}/shoot-sheet`);
  const banner = host.getByRole('region', { name: /segments? waits? for a safety review/ });
  await expect(banner.getByRole('link', { name: build.title })).toBeVisible();
  await expectAccessible(host);
});

test('on a desktop board, a card waiting for its safety review cannot be dropped into Captured, and the column says why', async ({ signedIn }) => {
  const stamp = Date.now().toString(36);
  const host = await signedIn('host', DESKTOP);
  const { episodeId, build } = await newEpisode(host, `Drag guard ${stamp}`);
  expect((await host.request.put(`${api}/segments/${build.id}/tools`, { headers: sameOrigin, data: { tools: ['router'] } })).status()).toBe(200);
  const description = `Round over the edges ${stamp}`;
  expect((await host.request.post(`${api}/segments/${build.id}/shots`, { headers: sameOrigin, data: { description } })).status()).toBe(201);

  const board = new ShopBoardPage(host);
  await board.goto(episodeId);
  // The page already warns of the pending review; a refused move would add an error alert to it.
  await expect(host.getByRole('alert').filter({ hasText: 'Waiting for a Host' })).toBeVisible();
  const alertsBefore = await host.getByRole('alert').count();
  let stateWrites = 0;
  host.on('request', (r) => {
    if (r.url().includes('/state') && r.method() === 'PUT') stateWrites += 1;
  });
  await host.getByRole('button', { name: `Move: ${description}` }).focus();
  await host.keyboard.press('Space');
  await expectAnnounced(host, /Picked up|is over/);
  await pressUntilAnnounced(host, 'ArrowRight', `${description} cannot go to Captured.`);
  await expect(board.column('Captured').getByRole('note')).toHaveText(/Captured waits for the safety review of this segment’s tools/);
  await host.keyboard.press('Space');
  await expectAnnounced(host, `${description} stays where it was.`);
  await expect(board.column('Planned').getByRole('listitem').filter({ hasText: description })).toBeVisible();
  await expect(board.column('Captured').getByRole('note')).toHaveCount(0);
  await expect(host.getByRole('alert')).toHaveCount(alertsBefore);
  expect(stateWrites).toBe(0);
  // Checked once the card is down: while it is carried, the card left behind is drawn faint on purpose.
  await expectAccessible(host);
});

test.describe('numbers a person reads', () => {
  test('an empty episode’s runtime bar gives no verdict; dates read as the locale writes them, on one line', async ({ signedIn }) => {
    const stamp = Date.now().toString(36);
    const host = await signedIn('host', { ...PHONE, locale: 'en-GB' });
    const title = `Empty ${stamp}`;
    const ep = await host.request.post(`${api}/episodes`, { headers: sameOrigin, data: { title, stage: 'idea', shootDate: '2027-01-16', targetSeconds: 840 } });
    expect(ep.status()).toBe(201);
    const { episode } = (await ep.json()) as { episode: { id: string } };
    // The starter's segments, with no script or action time yet: nothing to forecast.
    expect((await host.request.post(`${api}/episodes/${episode.id}/starter`, { headers: sameOrigin })).status()).toBe(201);
    await host.goto(`/c/${DEMO_SLUG}/episodes/${episode.id}`);
    const bar = host.getByRole('region', { name: 'Runtime forecast' });
    await expect(bar.getByText('Nothing forecast yet')).toBeVisible();
    await expect(bar.getByText(/Under target/)).toHaveCount(0);

    await host.goto(`/c/${DEMO_SLUG}/episodes`);
    const day = host.getByRole('listitem').filter({ hasText: title }).locator('time[datetime="2027-01-16"]');
    // en-GB writes "Sat 16 Jan", with ", 2027" after a comma when it is not this year.
    await expect(day).toHaveText(/^Sat,? 16 Jan/);
    expect(await day.evaluate((el) => getComputedStyle(el).whiteSpace)).toBe('nowrap');
    await expectAccessible(host);
  });

  test('the cut plan sits under its episode, and every piece label stays inside its piece', async ({ signedIn }) => {
    const host = await signedIn('host', DESKTOP);
    await host.goto(`/c/${DEMO_SLUG}/episodes`);
    await host.getByRole('link', { name: 'One Stool, Three Ways' }).first().click();
    await host.getByRole('link', { name: /cut plan/i }).first().click();
    await expect(host.getByRole('heading', { level: 1, name: /^Cut plan/ })).toBeVisible();
    const crumbs = host.getByRole('navigation', { name: 'Breadcrumb' });
    await expect(crumbs.getByRole('link')).toHaveText(['Episodes', 'One Stool, Three Ways']);
    const spills = await host.locator('figure svg g').evaluateAll((groups) =>
      groups.flatMap((g) => {
        const rect = g.querySelector('rect')?.getBoundingClientRect();
        const text = g.querySelector('text')?.getBoundingClientRect();
        if (!rect || !text) return [];
        const inside = text.left >= rect.left - 0.5 && text.right <= rect.right + 0.5 && text.top >= rect.top - 0.5 && text.bottom <= rect.bottom + 0.5;
        return inside ? [] : [g.textContent ?? ''];
      }),
    );
    expect(await host.locator('figure svg g text').count()).toBeGreaterThan(0);
    expect(spills).toEqual([]);
    await expectAccessible(host);
  });
});

test('Sizes on sale reads a list as people write it, and names what it could not read', async ({ signedIn }) => {
  const species = `Larch ${Date.now().toString(36)}`;
  const page = await signedIn('shopHand', PHONE);
  await page.goto(`/c/${DEMO_SLUG}/stock`);
  await page.getByLabel('Species').fill(species);
  await page.getByLabel('Profile').fill('2x6');
  await page.getByLabel('Sizes on sale').fill('8 ft 4.50, ten ft 6.20');
  await page.getByRole('button', { name: 'Add to rack' }).click();
  await expect(page.getByText('Could not read “ten ft” as a length in “ten ft 6.20”', { exact: false })).toBeVisible();
  await page.getByLabel('Sizes on sale').fill("8' 4.50, 10' 6.20\n12 ft 7.40");
  await page.getByRole('button', { name: 'Add to rack' }).click();
  // The rack item's card; the name is also a choice in the On hand form below.
  await expect(new StockRackPage(page).item(`2x6 ${species}`)).toBeVisible();
  await expectAccessible(page);
});

test('the same bytes twice warn and link the first clip; a clip is tied to a shot and moved afterwards', async ({ signedIn }) => {
  const stamp = Date.now().toString(36);
  const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'kerfline-e2e-'));
  const first = path.join(dir, `take-${stamp}.webm`);
  const second = path.join(dir, `take-${stamp}-again.webm`);
  execFileSync('ffmpeg', ['-v', 'error', '-y', '-f', 'lavfi', '-i', 'testsrc=duration=1:size=160x120:rate=10', '-c:v', 'libvpx', first]);
  fs.copyFileSync(first, second);

  const host = await signedIn('host', DESKTOP);
  const { build, segmentUrl } = await newEpisode(host, `Clips later ${stamp}`);
  const description = `Glue-up wide ${stamp}`;
  expect((await host.request.post(`${api}/segments/${build.id}/shots`, { headers: sameOrigin, data: { description } })).status()).toBe(201);

  const shop = await signedIn('shopHand', PHONE);
  const segment = new SegmentPage(shop);
  await segment.goto(segmentUrl);
  await shop.waitForLoadState('networkidle');
  for (const file of [first, second]) {
    await segment.clipPicker().setInputFiles(file);
    await expect(segment.uploadProgress(path.basename(file))).toHaveAttribute('aria-valuenow', '100', { timeout: 30_000 });
  }
  const again = shop.getByRole('article', { name: path.basename(second) });
  await expect(again.getByText('Same bytes as an earlier clip:')).toBeVisible();
  await expect(again.getByRole('link', { name: path.basename(first) })).toHaveAttribute('href', new RegExp(`#clip-`));

  const clip = shop.getByRole('article', { name: path.basename(first) });
  await clip.getByText('Shot and segment').click();
  await clip.getByLabel('Shot').selectOption({ label: `Shot 1: ${description}` });
  await clip.getByRole('button', { name: 'Save shot' }).click();
  await expect(shop.getByText(`Tied ${path.basename(first)} to Shot 1: ${description}.`)).toBeVisible();
  await expect(clip.getByText(`Shot 1: ${description}`).first()).toBeVisible();
  await expectAccessible(shop);

  // The Host moves the copy to another segment; it leaves this segment's list.
  await host.goto(segmentUrl);
  const copy = host.getByRole('article', { name: path.basename(second) });
  await copy.getByText('Shot and segment').click();
  const target = copy.getByLabel('Segment');
  const other = await target.locator('option').filter({ hasNotText: build.title }).first().textContent();
  await target.selectOption({ label: other! });
  await copy.getByRole('button', { name: 'Move clip' }).click();
  await expect(host.getByText(`Moved ${path.basename(second)} to ${other}.`)).toBeVisible();
  await expect(host.getByRole('article', { name: path.basename(second) })).toHaveCount(0);
});
