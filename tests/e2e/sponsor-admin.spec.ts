import type { Page } from '@playwright/test';
import type { EpisodeSummaryDto } from '@/lib/episodes/schemas';
import { DEMO_SLUG, demo, expect, expectAccessible, sameOrigin, test, waitForMail } from './fixtures';
import { dayFromToday, moveClockBy } from './test-clock';

const api = `/api/channels/${DEMO_SLUG}`;

async function demoEpisodeId(page: Page): Promise<string> {
  const list = (await (await page.request.get(`${api}/episodes`)).json()) as { episodes: EpisodeSummaryDto[] };
  return list.episodes.find((e) => e.title === 'One Stool, Three Ways')!.id;
}

/** A sponsor and a deal with one description link due `dueOn` (Script due), made through the API. */
async function bookDeal(page: Page, sponsorName: string, dueOn: string) {
  const sponsor = await page.request.post(`${api}/sponsors`, { headers: sameOrigin, data: { name: sponsorName } });
  expect(sponsor.status()).toBe(201);
  const sponsorId = ((await sponsor.json()) as { sponsor: { id: string } }).sponsor.id;
  const deal = await page.request.post(`${api}/deals`, { headers: sameOrigin, data: { sponsorId, title: 'Reminder check', feeMinor: 10_000, currency: 'USD' } });
  expect(deal.status()).toBe(201);
  const dealId = ((await deal.json()) as { deal: { id: string } }).deal.id;
  const added = await page.request.post(`${api}/deals/${dealId}/deliverables`, {
    headers: sameOrigin,
    data: { episodeId: await demoEpisodeId(page), kind: 'description_link', dueDates: { script_due: dueOn } },
  });
  expect(added.status()).toBe(201);
  return { sponsorId, dealId };
}

test('a host sets reminder days in Settings, moves the test clock, and reads each reminder from the caught mail', async ({ signedIn }) => {
  test.setTimeout(120_000);
  const page = await signedIn('host', { viewport: { width: 1280, height: 1000 } });
  const stamp = Date.now();
  const sponsorName = `Fenwold Glue ${stamp}`;
  const dueOn = dayFromToday(20);

  await page.goto(`/c/${DEMO_SLUG}/settings`);
  const days = page.getByLabel('Reminder days before a due date');
  const before = await days.inputValue();
  await days.fill('5, 5');
  await page.getByRole('button', { name: 'Save settings' }).click();
  await expect(page.getByText('Give each day only once.')).toBeVisible();
  await expect(days).toHaveAttribute('aria-invalid', 'true');
  await expectAccessible(page);
  await days.fill('5, 1');
  await page.getByRole('button', { name: 'Save settings' }).click();
  await expect(page.getByText('Saved.')).toBeVisible();

  const { sponsorId, dealId } = await bookDeal(page, sponsorName, dueOn);
  try {
    // Five days before Script due: the new five-day reminder, which the default 3 and 1 would not send.
    await moveClockBy(15);
    const [first] = await waitForMail(demo.host.email, { needle: sponsorName, timeoutMs: 30_000 });
    expect(first!.subject).toBe(`Script due for ${sponsorName} is due within 5 days (${dueOn})`);
    expect(first!.text).toContain(`/c/${DEMO_SLUG}/sponsors/${dealId}`);

    // A day past it: one more mail, overdue (not a one-day reminder as well), and the dashboard agrees.
    await moveClockBy(21);
    const all = await waitForMail(demo.host.email, { needle: sponsorName, atLeast: 2, timeoutMs: 30_000 });
    expect(all.map((m) => m.subject).sort()).toEqual([first!.subject, `Script due for ${sponsorName} is overdue (${dueOn})`].sort());
    await page.goto(`/c/${DEMO_SLUG}`);
    const row = page.getByRole('listitem').filter({ hasText: sponsorName });
    await expect(row).toContainText('overdue 1 d');
    await expectAccessible(page);
  } finally {
    await moveClockBy(0);
    expect((await page.request.patch(api, { headers: sameOrigin, data: { reminderDays: before.split(/\s*,\s*/).map(Number) } })).status()).toBe(200);
    expect((await page.request.delete(`${api}/deals/${dealId}`, { headers: sameOrigin })).status()).toBe(204);
    expect((await page.request.delete(`${api}/sponsors/${sponsorId}`, { headers: sameOrigin })).status()).toBe(204);
  }
});

test('a host edits a sponsor, deletes one without deals, and filters the Sponsors page by episode in the URL', async ({ signedIn }) => {
  const page = await signedIn('host', { viewport: { width: 1280, height: 1000 } });
  const name = `Orrin Bench Dogs ${Date.now()}`;
  expect((await page.request.post(`${api}/sponsors`, { headers: sameOrigin, data: { name } })).status()).toBe(201);

  await page.goto(`/c/${DEMO_SLUG}/sponsors`);
  const card = page.locator(`[data-sponsor="${name}"]`);
  await expect(card).toContainText('0 deals');
  await card.getByRole('button', { name: `Edit ${name}` }).click();
  const form = page.getByRole('form', { name: `Edit ${name}` });
  await form.getByRole('button', { name: 'Add contact' }).click();
  await form.getByLabel('Contact 1 name').fill('Wren Halloway');
  await form.getByLabel('Contact 1 e-mail').fill('not an address');
  await form.getByRole('button', { name: 'Save sponsor' }).click();
  await expect(form.getByLabel('Contact 1 e-mail')).toHaveAttribute('aria-invalid', 'true');
  await expectAccessible(page);
  await form.getByLabel('Contact 1 e-mail').fill('wren@orrin.test');
  await form.getByLabel('Notes').fill('Ships from the coast; allow two weeks.');
  await form.getByRole('button', { name: 'Save sponsor' }).click();
  await expect(card.getByRole('link', { name: 'wren@orrin.test' })).toBeVisible();
  await expect(card).toContainText('Ships from the coast; allow two weeks.');
  // Focus goes back to the button that opened the form.
  await expect(card.getByRole('button', { name: `Edit ${name}` })).toBeFocused();

  // The demo sponsor holds a deal: no delete offered. This one holds none: it goes.
  await expect(page.locator('[data-sponsor="Brightgrain Abrasives"]').getByRole('button', { name: /^Delete/ })).toHaveCount(0);
  page.once('dialog', (dialog) => void dialog.accept());
  await card.getByRole('button', { name: `Delete ${name}` }).click();
  await expect(card).toHaveCount(0);

  const episodeId = await demoEpisodeId(page);
  await page.getByLabel('Episode', { exact: true }).selectOption({ label: 'One Stool, Three Ways' });
  await expect(page).toHaveURL(new RegExp(`[?&]episode=${episodeId}`));
  await page.reload();
  await expect(page.getByLabel('Episode', { exact: true })).toHaveValue(episodeId);
  await expect(page.getByRole('link', { name: 'Brightgrain Abrasives' }).first()).toBeVisible();
  await page.setViewportSize({ width: 375, height: 800 });
  await expectAccessible(page);
  await page.getByLabel('Episode', { exact: true }).selectOption({ label: 'All episodes' });
  await expect(page).not.toHaveURL(/episode=/);
});
