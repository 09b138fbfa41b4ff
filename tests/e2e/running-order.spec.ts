import type { Page } from '@playwright/test';
import { DEMO_SLUG, expect, expectAccessible, sameOrigin, test } from './fixtures';
import { RunningOrderPage } from './pages/running-order-page';
import { SegmentPage } from './pages/segment-page';

const STARTER = ['Cold open: the three finished pieces side by side', 'Starter build', 'Intermediate build', 'Advanced build', 'Sponsor read', 'Outro: which level to try first'] as const;

async function newOutlinedEpisode(page: Page, title: string) {
  await page.goto(`/c/${DEMO_SLUG}/episodes`);
  await page.getByRole('link', { name: 'New episode' }).first().click();
  await page.getByLabel('Title').fill(title);
  await page.getByLabel('Target runtime (mm:ss)').fill('15:00');
  await page.getByLabel('Stage').selectOption('outline');
  await expectAccessible(page);
  await page.getByRole('button', { name: 'Create episode' }).click();
  await expect(page.getByRole('heading', { level: 1, name: title })).toBeVisible();
  await page.getByRole('button', { name: 'Start a three-level build' }).click();
  await new RunningOrderPage(page).expectTitles(STARTER);
  return page.url();
}

test('a host outlines a three-level build and reorders it with the mouse and the keyboard', async ({ signedIn }) => {
  const page = await signedIn('host', { viewport: { width: 1280, height: 1200 } });
  const runningOrder = new RunningOrderPage(page);
  const url = await newOutlinedEpisode(page, `Tool tote ${Date.now()}`);
  await expectAccessible(page);

  const positionSaved = () => page.waitForResponse((r) => r.url().endsWith('/position') && r.request().method() === 'PUT');
  const mouseSaved = positionSaved();
  await runningOrder.dragWithMouse('Sponsor read', 'Intermediate build');
  const afterMouse = [STARTER[0], STARTER[1], 'Sponsor read', 'Intermediate build', 'Advanced build', STARTER[5]];
  await runningOrder.expectTitles(afterMouse);
  expect((await mouseSaved).status()).toBe(200);

  const keyboardSaved = positionSaved();
  await runningOrder.moveWithKeyboard(STARTER[5], 'ArrowUp');
  const afterKeyboard = [STARTER[0], STARTER[1], 'Sponsor read', 'Intermediate build', STARTER[5], 'Advanced build'];
  await runningOrder.expectTitles(afterKeyboard);
  expect((await keyboardSaved).status()).toBe(200);

  await page.goto(url);
  await runningOrder.expectTitles(afterKeyboard);
});

test('a script autosaves, survives a reload, moves the forecast, and a stale save keeps its text', async ({ signedIn }) => {
  const page = await signedIn('host');
  const url = await newOutlinedEpisode(page, `Spice rack ${Date.now()}`);
  await page.getByRole('link', { name: 'Starter build' }).click();
  await expect(page.getByRole('heading', { level: 1, name: 'Starter build' })).toBeVisible();
  const editor = page.getByRole('textbox', { name: 'Script' });
  await editor.click();
  await page.keyboard.insertText(Array.from({ length: 300 }, (_, i) => `word${i}`).join(' '));
  await expect(new SegmentPage(page).savedStatus()).toBeVisible();
  await expectAccessible(page);

  await page.reload();
  await expect(page.getByRole('textbox', { name: 'Script' })).toContainText('word299');
  // 300 words at the channel's 150 words per minute = 2:00 of speech.
  await expect(page.getByText('02:00').first()).toBeVisible();

  await page.goto(url);
  await expect(page.locator('article[aria-label="Starter build"]')).toContainText('02:00');

  const segmentUrl = (await page.getByRole('link', { name: 'Starter build' }).getAttribute('href')) ?? '';
  const stale = await signedIn('host');
  await stale.goto(segmentUrl);
  await expect(stale.getByRole('textbox', { name: 'Script' })).toContainText('word299');

  await page.goto(segmentUrl);
  await page.getByRole('textbox', { name: 'Script' }).click();
  await page.keyboard.press('End');
  await page.keyboard.insertText(' first writer wins');
  await expect(page.getByRole('status').filter({ hasText: /^Saved$/ })).toBeVisible();

  await stale.getByRole('textbox', { name: 'Script' }).click();
  await stale.keyboard.press('End');
  await stale.keyboard.insertText(' second writer typed this');
  await expect(stale.getByText('Someone else changed this script since you opened it.')).toBeVisible();
  await expect(stale.getByRole('textbox', { name: 'Script' })).toContainText('second writer typed this');
  await expectAccessible(stale);
});

test('a shop hand sees the running order read-only and the API refuses a reorder', async ({ signedIn }) => {
  const page = await signedIn('shopHand');
  await page.goto(`/c/${DEMO_SLUG}/episodes`);
  await expectAccessible(page);
  await page.getByRole('link', { name: 'One Stool, Three Ways' }).click();
  await expect(page.getByText('Read-only: only a Host can change the running order.')).toBeVisible();
  await expect(page.getByRole('button', { name: /^Move / })).toHaveCount(0);
  await expectAccessible(page);

  const href = await page.locator('ol > li a').first().getAttribute('href');
  const segmentId = href?.split('/').pop() ?? '';
  const res = await page.request.put(`/api/channels/${DEMO_SLUG}/segments/${segmentId}/position`, { headers: sameOrigin, data: { afterId: null } });
  expect(res.status()).toBe(403);

  await page.locator('ol > li a').first().click();
  await expect(page.getByText('Read-only: only a Host writes scripts.')).toBeVisible();
  await expectAccessible(page);
});
