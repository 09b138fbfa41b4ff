import { execFileSync } from 'node:child_process';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { demo, expect, expectAccessible, newEpisode, signIn, test } from './fixtures';

test('the shop hand uploads a real video and sees it with duration and poster; the editor previews it', async ({ browser }) => {
  const stamp = Date.now().toString(36);
  const name = `glue-up-${stamp}.webm`;
  const video = path.join(fs.mkdtempSync(path.join(os.tmpdir(), 'kerfline-e2e-')), name);
  // ffmpeg's built-in test pattern, 3 s at 320x240, as VP8 so any Chromium build plays it.
  execFileSync('ffmpeg', ['-v', 'error', '-y', '-f', 'lavfi', '-i', 'testsrc=duration=3:size=320x240:rate=30', '-c:v', 'libvpx', '-b:v', '300k', video]);

  const hostContext = await browser.newContext();
  const host = await hostContext.newPage();
  await signIn(host, demo.host);
  const { segmentUrl } = await newEpisode(host, `Clip upload ${stamp}`);
  await hostContext.close();

  const shopContext = await browser.newContext({ viewport: { width: 375, height: 800 }, hasTouch: true, isMobile: true });
  const shop = await shopContext.newPage();
  await signIn(shop, demo.shopHand);
  await shop.goto(segmentUrl);
  // A person picks a file once the page is up; a pick before that is the next test.
  await shop.waitForLoadState('networkidle');
  await shop.getByLabel('Choose clips to upload').setInputFiles(video);
  const progress = shop.getByRole('progressbar', { name: `Upload progress for ${name}` });
  await expect(progress).toHaveAttribute('aria-valuenow', '100', { timeout: 30_000 });
  await expect(shop.getByText('Uploaded', { exact: true })).toBeVisible();
  const clip = shop.getByRole('article', { name });
  await expect(clip).toContainText('0:03', { timeout: 30_000 });
  await expect(clip).toContainText('320×240');
  await expect(clip.getByRole('img', { name: `Poster frame of ${name}` })).toBeVisible();
  await expectAccessible(shop);
  await shopContext.close();

  const editorContext = await browser.newContext({ viewport: { width: 1280, height: 900 } });
  const editor = await editorContext.newPage();
  await signIn(editor, demo.editor);
  await editor.goto(segmentUrl);
  await expect(editor.getByLabel('Choose clips to upload')).toHaveCount(0);
  await editor.getByRole('button', { name: `Preview ${name}` }).click();
  const player = editor.getByLabel(`Preview of ${name}`);
  await expect.poll(() => player.evaluate((v: HTMLVideoElement) => v.readyState), { timeout: 15_000 }).toBeGreaterThan(0);
  expect(await player.evaluate((v: HTMLVideoElement) => v.duration)).toBeCloseTo(3, 0);
  await editorContext.close();
});

test('a clip picked before the page has finished loading still uploads', async ({ page }) => {
  const stamp = Date.now().toString(36);
  const name = `early-${stamp}.webm`;
  const video = path.join(fs.mkdtempSync(path.join(os.tmpdir(), 'kerfline-e2e-')), name);
  execFileSync('ffmpeg', ['-v', 'error', '-y', '-f', 'lavfi', '-i', 'testsrc=duration=1:size=160x120:rate=10', '-c:v', 'libvpx', video]);
  await signIn(page, demo.host);
  const { segmentUrl } = await newEpisode(page, `Early pick ${stamp}`);
  // Hold the page's scripts back so the file is chosen before React has attached any handler.
  let release = () => {};
  const held = new Promise<void>((r) => (release = r));
  await page.route('**/_next/static/**/*.js', async (route) => {
    await held;
    await route.continue();
  });
  await page.goto(segmentUrl, { waitUntil: 'domcontentloaded' });
  await page.getByLabel('Choose clips to upload').setInputFiles(video);
  release();
  await expect(page.getByRole('progressbar', { name: `Upload progress for ${name}` })).toHaveAttribute('aria-valuenow', '100', { timeout: 30_000 });
});
