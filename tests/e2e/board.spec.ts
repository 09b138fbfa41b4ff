import type { Page } from '@playwright/test';
import { demo, DEMO_SLUG, expect, expectAccessible, sameOrigin, signIn, test } from './fixtures';

const cardTitles = (page: Page) => page.locator('ol > li article[aria-label]').evaluateAll((els) => els.map((e) => e.getAttribute('aria-label')));

const STARTER = ['Cold open: the three finished pieces side by side', 'Starter build', 'Intermediate build', 'Advanced build', 'Sponsor read', 'Outro: which level to try first'];

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
  await expect.poll(() => cardTitles(page)).toEqual(STARTER);
  return page.url();
}

async function dragWithMouse(page: Page, handleName: string, targetTitle: string) {
  const handle = page.getByRole('button', { name: handleName });
  const target = page.locator(`article[aria-label="${targetTitle}"]`);
  await target.scrollIntoViewIfNeeded();
  await handle.scrollIntoViewIfNeeded();
  const from = await handle.boundingBox();
  const to = await target.boundingBox();
  if (!from || !to) throw new Error('no boxes');
  await page.mouse.move(from.x + from.width / 2, from.y + from.height / 2);
  await page.mouse.down();
  await page.mouse.move(from.x + from.width / 2, from.y + from.height / 2 - 12, { steps: 4 });
  await page.mouse.move(from.x + from.width / 2, to.y + 8, { steps: 20 });
  await page.waitForTimeout(250);
  await page.mouse.up();
}

test('a host outlines a three-level build and reorders it with the mouse and the keyboard', async ({ page }) => {
  await page.setViewportSize({ width: 1280, height: 1200 });
  await signIn(page, demo.host);
  const url = await newOutlinedEpisode(page, `Tool tote ${Date.now()}`);
  await expectAccessible(page);

  await dragWithMouse(page, 'Move Sponsor read', 'Intermediate build');
  const afterMouse = [STARTER[0], STARTER[1], 'Sponsor read', 'Intermediate build', 'Advanced build', STARTER[5]];
  await expect.poll(() => cardTitles(page)).toEqual(afterMouse);

  const outro = page.getByRole('button', { name: `Move ${STARTER[5]}` });
  await outro.focus();
  await page.keyboard.press('Space');
  await page.waitForTimeout(250);
  await page.keyboard.press('ArrowUp');
  await page.waitForTimeout(250);
  // The move is saved by a PUT; reloading before it answers would cancel it (networkidle was reached long before).
  const saved = page.waitForResponse((r) => r.url().endsWith('/position') && r.request().method() === 'PUT');
  await page.keyboard.press('Space');
  const afterKeyboard = [STARTER[0], STARTER[1], 'Sponsor read', 'Intermediate build', STARTER[5], 'Advanced build'];
  await expect.poll(() => cardTitles(page)).toEqual(afterKeyboard);

  expect((await saved).status()).toBe(200);
  await page.goto(url);
  await expect.poll(() => cardTitles(page)).toEqual(afterKeyboard);
});

test('a script autosaves, survives a reload, moves the forecast, and a stale save keeps its text', async ({ page, browser }) => {
  await signIn(page, demo.host);
  const url = await newOutlinedEpisode(page, `Spice rack ${Date.now()}`);
  await page.getByRole('link', { name: 'Starter build' }).click();
  await expect(page.getByRole('heading', { level: 1, name: 'Starter build' })).toBeVisible();
  const editor = page.getByRole('textbox', { name: 'Script' });
  await editor.click();
  await page.keyboard.insertText(Array.from({ length: 300 }, (_, i) => `word${i}`).join(' '));
  await expect(page.getByRole('status').filter({ hasText: /^Saved$/ })).toBeVisible();
  await expectAccessible(page);

  await page.reload();
  await expect(page.getByRole('textbox', { name: 'Script' })).toContainText('word299');
  // 300 words at the channel's 150 words per minute = 2:00 of speech.
  await expect(page.getByText('02:00').first()).toBeVisible();

  await page.goto(url);
  await expect(page.locator('article[aria-label="Starter build"]')).toContainText('02:00');

  const segmentUrl = (await page.getByRole('link', { name: 'Starter build' }).getAttribute('href')) ?? '';
  const other = await browser.newContext();
  const stale = await other.newPage();
  await signIn(stale, demo.host);
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
  await other.close();
});

test('a shop hand sees the board read-only and the API refuses a reorder', async ({ page }) => {
  await signIn(page, demo.shopHand);
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
