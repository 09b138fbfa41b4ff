import { execFileSync } from 'node:child_process';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { PHONE, expect, expectAccessible, newEpisode, test } from './fixtures';
import { SegmentPage } from './pages/segment-page';

test('the shop hand uploads a real video and sees it with duration and poster; the editor previews it', async ({ signedIn }) => {
  const stamp = Date.now().toString(36);
  const name = `glue-up-${stamp}.webm`;
  const video = path.join(fs.mkdtempSync(path.join(os.tmpdir(), 'kerfline-e2e-')), name);
  // ffmpeg's built-in test pattern, 3 s at 320x240, as VP8 so any Chromium build plays it.
  execFileSync('ffmpeg', ['-v', 'error', '-y', '-f', 'lavfi', '-i', 'testsrc=duration=3:size=320x240:rate=30', '-c:v', 'libvpx', '-b:v', '300k', video]);

  const { segmentUrl } = await newEpisode(await signedIn('host'), `Clip upload ${stamp}`);

  const shop = await signedIn('shopHand', PHONE);
  const segment = new SegmentPage(shop);
  await segment.goto(segmentUrl);
  // A person picks a file once the page is up; a pick before that is the next test.
  await shop.waitForLoadState('networkidle');
  await segment.clipPicker().setInputFiles(video);
  await expect(segment.uploadProgress(name)).toHaveAttribute('aria-valuenow', '100', { timeout: 30_000 });
  await expect(shop.getByText('Uploaded', { exact: true })).toBeVisible();
  const clip = shop.getByRole('article', { name });
  await expect(clip).toContainText('0:03', { timeout: 30_000 });
  await expect(clip).toContainText('320×240');
  await expect(clip.getByRole('img', { name: `Poster frame of ${name}` })).toBeVisible();
  await expectAccessible(shop);

  const editor = await signedIn('editor', { viewport: { width: 1280, height: 900 } });
  await editor.goto(segmentUrl);
  await expect(new SegmentPage(editor).clipPicker()).toHaveCount(0);
  await editor.getByRole('button', { name: `Preview ${name}` }).click();
  const player = editor.getByLabel(`Preview of ${name}`);
  await expect.poll(() => player.evaluate((v: HTMLVideoElement) => v.readyState), { timeout: 15_000 }).toBeGreaterThan(0);
  expect(await player.evaluate((v: HTMLVideoElement) => v.duration)).toBeCloseTo(3, 0);
});

test('a clip picked before the page has finished loading still uploads', async ({ signedIn }) => {
  const stamp = Date.now().toString(36);
  const name = `early-${stamp}.webm`;
  const video = path.join(fs.mkdtempSync(path.join(os.tmpdir(), 'kerfline-e2e-')), name);
  execFileSync('ffmpeg', ['-v', 'error', '-y', '-f', 'lavfi', '-i', 'testsrc=duration=1:size=160x120:rate=10', '-c:v', 'libvpx', video]);
  const page = await signedIn('host');
  const segment = new SegmentPage(page);
  const { segmentUrl } = await newEpisode(page, `Early pick ${stamp}`);
  // Hold the page's scripts back so the file is chosen before React has attached any handler.
  let release = () => {};
  const held = new Promise<void>((r) => (release = r));
  await page.route('**/_next/static/**/*.js', async (route) => {
    await held;
    await route.continue();
  });
  await page.goto(segmentUrl, { waitUntil: 'domcontentloaded' });
  await segment.clipPicker().setInputFiles(video);
  release();
  await expect(segment.uploadProgress(name)).toHaveAttribute('aria-valuenow', '100', { timeout: 30_000 });
});
