import type { Page } from '@playwright/test';
import type { EpisodeSummaryDto } from '@/lib/episodes/schemas';
import type { RunningOrderDto } from '@/lib/segments/schemas';
import { DEMO_SLUG, expect, expectAccessible, sameOrigin, test, waitForMail } from './fixtures';
import { SponsorsPage } from './pages/sponsors-page';

const api = `/api/channels/${DEMO_SLUG}`;

async function demoRunningOrder(page: Page) {
  const list = (await (await page.request.get(`${api}/episodes`)).json()) as { episodes: EpisodeSummaryDto[] };
  const episode = list.episodes.find((e) => e.title === 'One Stool, Three Ways')!;
  const board = (await (await page.request.get(`${api}/episodes/${episode.id}/running-order`)).json()) as RunningOrderDto;
  const read = board.segments.find((s) => s.kind === 'sponsor_read')!;
  const advanced = board.segments.find((s) => s.kind === 'build' && s.level === 3)!;
  const before = board.segments[board.segments.indexOf(read) - 1]!;
  return { episode, read, advanced, before };
}

const check = (page: Page, name: string) => page.locator(`[data-check="${name}"]`).first();

test('a host books a read on the demo episode, sees placement follow the running order, and gets the sponsor approval', async ({ signedIn, browser }) => {
  // A long journey through five pages and two browsers: more than the default 60 s on a busy 2-core box.
  test.setTimeout(240_000);
  const page = await signedIn('host', { viewport: { width: 1280, height: 1100 } });
  const stamp = Date.now();
  const sponsorName = `Larchmoor Clamps ${stamp}`;
  const contact = `pell.${stamp}@larchmoor.test`;
  const sponsors = new SponsorsPage(page);
  await sponsors.goto();
  await expectAccessible(page);
  await sponsors.createDealForNewSponsor({ sponsorName, contactName: 'Pell Andrade', contactEmail: contact, title: 'Bar clamp read', fee: '1250.00', currency: 'EUR' });
  await expect(page.getByText('€1,250.00')).toBeVisible();

  const form = page.getByRole('form', { name: 'Add deliverable' });
  await form.getByLabel('Episode').selectOption({ label: 'One Stool, Three Ways' });
  await form.getByLabel('Disclosure wording').fill('This video is sponsored by Brightgrain Abrasives');
  await form.getByLabel('Must-say phrases (one per line)').fill('starter pack');
  await form.getByLabel('Shortest read (m:ss)').fill('0:20');
  await form.getByLabel('Longest read (m:ss)').fill('1:30');
  await form.getByLabel('Placement rule').selectOption('within_percent');
  await form.getByLabel('Within the first (%)').fill('60');
  await form.getByLabel('Go-live').fill('2027-02-04');
  await form.getByRole('button', { name: 'Add deliverable' }).click();
  await expect(check(page, 'placement')).toHaveAttribute('data-status', 'pass');
  await expect(check(page, 'mustSay')).toHaveAttribute('data-status', 'pass');
  await expect(check(page, 'disclosure')).toHaveAttribute('data-status', 'pass');
  // Payment due follows go-live plus the default 30 days' terms.
  await expect(page.getByRole('textbox', { name: /^Payment due/ })).toHaveValue('2027-03-06');

  const editor = page.getByRole('textbox', { name: 'Talking points' });
  await editor.click();
  await page.keyboard.insertText('Quick-release bar clamps, one hand.');
  await page.getByRole('button', { name: 'Save talking points' }).click();
  await expect(page.getByRole('status').filter({ hasText: 'Talking points saved.' })).toBeVisible();
  await expectAccessible(page);
  const dealUrl = page.url();

  const { episode, read, advanced, before } = await demoRunningOrder(page);
  try {
    expect((await page.request.put(`${api}/segments/${read.id}/position`, { headers: sameOrigin, data: { afterId: advanced.id } })).status()).toBe(200);
    await page.goto(dealUrl);
    await expect(check(page, 'placement')).toHaveAttribute('data-status', 'fail');
  } finally {
    expect((await page.request.put(`${api}/segments/${read.id}/position`, { headers: sameOrigin, data: { afterId: before.id } })).status()).toBe(200);
  }
  await page.goto(dealUrl);
  await expect(check(page, 'placement')).toHaveAttribute('data-status', 'pass');

  // The sponsor approves from the caught mail, without signing in, in a browser of their own.
  await page.getByRole('button', { name: 'Send approval link' }).click();
  await expect(page.getByRole('status').filter({ hasText: `Link sent to ${contact}.` })).toBeVisible();
  const [mail] = await waitForMail(contact);
  const link = /https?:\/\/\S+\/approve\/[A-Za-z0-9_-]+/.exec(mail?.text ?? '')![0];
  const sponsorContext = await browser.newContext();
  const sponsorPage = await sponsorContext.newPage();
  await sponsorPage.goto(new URL(link).pathname);
  await expect(sponsorPage.getByRole('heading', { name: /The sponsor read in “One Stool, Three Ways”/ })).toBeVisible();
  await expect(sponsorPage.getByText('Quick-release bar clamps, one hand.')).toBeVisible();
  await expect(sponsorPage.locator('body')).not.toContainText('€');
  await expectAccessible(sponsorPage);
  await sponsorPage.getByRole('button', { name: 'Approve' }).click();
  await expect(sponsorPage.getByRole('status').filter({ hasText: 'You approved this read.' })).toBeVisible();
  await sponsorContext.close();

  await page.goto(dealUrl);
  await expect(page.locator('[data-approval="approved"]')).toBeVisible();
  const { script } = (await (await page.request.get(`${api}/segments/${read.id}/script`)).json()) as { script: { doc: unknown; version: number } };
  const doc = script.doc as { type: 'doc'; content: unknown[] };
  const edited = { ...doc, content: [...doc.content, { type: 'paragraph', content: [{ type: 'text', text: 'Link below.' }] }] };
  expect((await page.request.put(`${api}/segments/${read.id}/script`, { headers: sameOrigin, data: { doc: edited, baseVersion: script.version } })).status()).toBe(200);
  await page.goto(dealUrl);
  await expect(page.locator('[data-approval="changed"]')).toBeVisible();
  // The running order flags the read's card, and only that card.
  await page.goto(`/c/${DEMO_SLUG}/episodes/${episode.id}`);
  await expect(page.getByRole('article', { name: read.title }).getByText('Changed since approval')).toBeVisible();
  await expect(page.getByText('Changed since approval')).toHaveCount(1);
  await expectAccessible(page);
  await page.goto(`/c/${DEMO_SLUG}`);
  await expect(page.getByRole('heading', { name: 'Changed since approval' })).toBeVisible();
  await expectAccessible(page);

  await sponsors.goto();
  await expect(sponsors.sponsorLink(sponsorName)).toBeVisible();
  await page.setViewportSize({ width: 375, height: 800 });
  await expectAccessible(page);
});

test('the editor reads talking points and disclosure without fees; the shop hand is refused', async ({ signedIn }) => {
  const editorPage = await signedIn('editor');
  await new SponsorsPage(editorPage).goto();
  await expect(editorPage.getByRole('heading', { level: 1, name: 'Sponsor reads' })).toBeVisible();
  await expect(editorPage.getByText('Mesh discs let dust through to the extractor', { exact: false }).first()).toBeVisible();
  await expect(editorPage.getByText('This video is sponsored by Brightgrain Abrasives').first()).toBeVisible();
  await expect(editorPage.locator('main')).not.toContainText(/\$|€|Fee|Invoice/);
  await expectAccessible(editorPage);
  expect((await editorPage.request.get(`${api}/deals`)).status()).toBe(403);

  const shopPage = await signedIn('shopHand');
  expect((await shopPage.request.get(`${api}/deals`)).status()).toBe(403);
  expect((await shopPage.request.post(`${api}/sponsors`, { headers: sameOrigin, data: { name: 'Nope' } })).status()).toBe(403);
});
