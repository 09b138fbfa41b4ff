import { execFileSync } from 'node:child_process';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { checkOtio } from '@/lib/handoffs/otio-check';
import { demo, DEMO_SLUG, expect, expectAccessible, newEpisode, sameOrigin, test, type CaughtMail } from './fixtures';
import { mailTo } from '../support/mail-catcher';

/** The handoff mail for this episode's version `v`, to the demo Editor. */
async function handoffMail(title: string, v: number): Promise<CaughtMail> {
  let found: CaughtMail | undefined;
  await expect
    .poll(async () => (found = (await mailTo(demo.editor.email)).find((m) => m.subject.includes(`v${v} of “${title}”`))) !== undefined, { timeout: 15_000 })
    .toBe(true);
  return found!;
}

const linkPath = (mail: CaughtMail) => new URL(/https?:\/\/\S+\/handoff\/\d+/.exec(mail.text)![0]).pathname;

test('host locks v1, the editor opens it from the e-mail, previews, notes and sets Rough cut; v2 shows what changed; OTIO and ZIP check out', async ({ signedIn }) => {
  test.setTimeout(120_000);
  const stamp = Date.now().toString(36);
  const title = `Handoff ${stamp}`;
  const name = `saw-${stamp}.webm`;
  const tmp = fs.mkdtempSync(path.join(os.tmpdir(), 'kerfline-e2e-'));
  const video = path.join(tmp, name);
  execFileSync('ffmpeg', ['-v', 'error', '-y', '-f', 'lavfi', '-i', 'testsrc=duration=2:size=320x240:rate=30', '-c:v', 'libvpx', '-b:v', '300k', video]);

  const host = await signedIn('host', { viewport: { width: 1280, height: 900 } });
  const { episodeId, build, segmentUrl } = await newEpisode(host, title);
  await host.goto(segmentUrl);
  await host.waitForLoadState('networkidle');
  await host.getByLabel('Choose clips to upload').setInputFiles(video);
  await expect(host.getByRole('article', { name })).toContainText('0:02', { timeout: 30_000 });

  const episodeUrl = `/c/${DEMO_SLUG}/episodes/${episodeId}`;
  await host.goto(episodeUrl);
  await host.getByLabel('Note to the editor').fill('First assembly, please');
  await host.getByRole('button', { name: 'Lock for edit' }).click();
  await expect(host.getByRole('status').filter({ hasText: 'Locked' })).toContainText('v1');
  // The version list shows the new version without a reload.
  await expect(host.getByRole('list', { name: 'Locked versions' }).getByRole('link', { name: 'v1' })).toBeVisible();
  await expectAccessible(host);

  const editor = await signedIn('editor', { viewport: { width: 1280, height: 900 }, acceptDownloads: true });
  const v1 = linkPath(await handoffMail(title, 1));
  await editor.goto(v1);
  await expect(editor.getByRole('heading', { level: 1 })).toContainText(`${title} v1`);
  await expect(editor.getByText('Note from the host: First assembly, please')).toBeVisible();
  await expectAccessible(editor);

  await editor.getByRole('button', { name: `Preview ${name}` }).click();
  const player = editor.getByLabel(`Preview of ${name}`);
  await expect.poll(() => player.evaluate((v: HTMLVideoElement) => v.readyState), { timeout: 15_000 }).toBeGreaterThan(0);
  // "Use player time": the player parked on frame 45 gives that frame's timecode at 29.97 DF and pins the note to the clip.
  await player.evaluate((v: HTMLVideoElement) => {
    v.currentTime = (45 * 1001) / 30000;
  });
  await expect(editor.getByText(`Player at 00:00:01;15 in ${name}`)).toBeVisible();
  await editor.getByRole('button', { name: 'Use player time' }).click();
  await expect(editor.getByLabel('Timecode')).toHaveValue('00:00:01;15');
  await expect(editor.getByLabel('Pinned to').locator('option:checked')).toHaveText(new RegExp(`^Clip ${name.replace('.', '\\.')}`));
  await editor.getByLabel('Note', { exact: true }).fill('Blade guard is out of frame here');
  await editor.getByRole('button', { name: 'Add note' }).click();
  await expect(editor.getByRole('list', { name: 'Note threads' })).toContainText('Blade guard is out of frame here');
  await editor.getByRole('button', { name: `Hide preview ${name}` }).click();

  await editor.getByLabel('Pinned to').selectOption(`segment:${build.id}`);
  await editor.getByLabel('Timecode').fill('00:01:00;02');
  await editor.getByLabel('Note', { exact: true }).fill('Trim the head of the crosscut');
  await editor.getByRole('button', { name: 'Add note' }).click();
  const thread = editor.getByRole('list', { name: 'Note threads' }).getByRole('listitem').filter({ hasText: 'Trim the head of the crosscut' });
  await expect(thread).toContainText('00:01:00;02');
  await expect(thread).toContainText('Trim the head of the crosscut');

  await editor.getByLabel('Edit stage').selectOption('rough_cut');
  await expect(editor.getByText('Saved: Rough cut')).toBeVisible();
  await expectAccessible(editor);

  // The clip's notes show on its card for whoever may read them (the uploader, Hosts, Editors).
  await host.goto(segmentUrl);
  await host.getByRole('button', { name: `Edit notes on ${name}` }).click();
  const clipNotes = host.getByRole('list', { name: 'Edit notes on this clip' });
  await expect(clipNotes).toContainText('00:00:01;15');
  await expect(clipNotes).toContainText('Blade guard is out of frame here');
  await expectAccessible(host);

  // The host rewrites a script and locks v2.
  const api = `/api/channels/${DEMO_SLUG}`;
  const script = { type: 'doc', content: [{ type: 'paragraph', content: [{ type: 'text', text: `Crosscut all four legs at once ${stamp}` }] }] };
  expect((await host.request.put(`${api}/segments/${build.id}/script`, { headers: sameOrigin, data: { doc: script, baseVersion: 0 } })).status()).toBe(200);
  await host.goto(episodeUrl);
  await host.getByRole('button', { name: 'Lock for edit' }).click();
  await expect(host.getByRole('status').filter({ hasText: 'Locked' })).toContainText('v2');

  await editor.goto(linkPath(await handoffMail(title, 2)));
  const banner = editor.getByRole('region', { name: /Changed since v1/ });
  await expect(banner).toContainText(`Crosscut all four legs at once ${stamp}`);
  await expectAccessible(editor);

  // Exports: the OTIO follows the required-field rules; the ZIP passes unzip -t and its SHA256SUMS.
  const handoffApi = `${api}/episodes/${episodeId}/handoffs/2/exports`;
  const otio = await editor.request.get(`${handoffApi}/otio`);
  expect(otio.status()).toBe(200);
  expect(checkOtio(await otio.json())).toEqual([]);
  const zip = await editor.request.get(`${handoffApi}/zip`);
  expect(zip.status()).toBe(200);
  const body = await zip.body();
  // The handler sets Content-Length ahead (tests/integration/handoff-routes checks it), but Next 16.4.6
  // drops it from route-handler responses (FORBIDDEN_HEADERS in next/dist/server/send-response.js), so
  // over HTTP the package arrives chunked.
  expect(zip.headers()['content-type']).toBe('application/zip');
  fs.writeFileSync(path.join(tmp, 'p.zip'), body);
  expect(execFileSync('unzip', ['-t', 'p.zip'], { cwd: tmp }).toString()).toContain('No errors detected');
  execFileSync('unzip', ['-q', 'p.zip', '-d', 'x'], { cwd: tmp });
  expect(execFileSync('sha256sum', ['-c', 'SHA256SUMS'], { cwd: path.join(tmp, 'x') }).toString()).toContain(`${name}: OK`);
  fs.rmSync(tmp, { recursive: true, force: true });
});

test('the demo episode has a locked v1 that prints without the shell', async ({ signedIn }) => {
  const page = await signedIn('editor');
  const res = await page.request.get(`/api/channels/${DEMO_SLUG}/episodes`);
  const { episodes } = (await res.json()) as { episodes: { id: string; title: string }[] };
  const versions = await Promise.all(
    episodes.map(async (e) => ({ e, list: ((await (await page.request.get(`/api/channels/${DEMO_SLUG}/episodes/${e.id}/handoffs`)).json()) as { handoffs: { version: number; note: string }[] }).handoffs })),
  );
  const demoEp = versions.find((v) => v.list.some((h) => h.version === 1 && h.note.startsWith('First assembly: the Starter build')));
  expect(demoEp).toBeTruthy();
  await page.goto(`/c/${DEMO_SLUG}/episodes/${demoEp!.e.id}/handoff/1`);
  await expect(page.getByRole('heading', { name: 'Running order' })).toBeVisible();
  await expectAccessible(page);
  await page.setViewportSize({ width: 375, height: 800 });
  await expectAccessible(page);
  await page.emulateMedia({ media: 'print' });
  await expect(page.getByRole('navigation', { name: 'Downloads' })).toBeHidden();
  await expect(page.getByRole('heading', { name: 'Running order' })).toBeVisible();
});
