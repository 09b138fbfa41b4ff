import { DEMO_SLUG, expect, expectAccessible, sameOrigin, newEpisode, test } from './fixtures';
import { RunningOrderPage } from './pages/running-order-page';

test('the shoot-day sheet lists the day’s shots with cautions, and prints without the app around it', async ({ signedIn }) => {
  const page = await signedIn('host', { viewport: { width: 1280, height: 900 } });
  const stamp = Date.now().toString(36);
  const { episodeId, build } = await newEpisode(page, `Sheet ${stamp}`);
  const api = `/api/channels/${DEMO_SLUG}`;
  expect((await page.request.post(`${api}/segments/${build.id}/shots/bulk`, { headers: sameOrigin, data: { text: `Wide: rip the legs ${stamp}`, dueDate: '2027-02-06' } })).status()).toBe(201);
  expect((await page.request.post(`${api}/segments/${build.id}/shots/bulk`, { headers: sameOrigin, data: { text: `CU: sand the edges ${stamp}`, dueDate: '2027-02-07' } })).status()).toBe(201);
  expect((await page.request.put(`${api}/segments/${build.id}/tools`, { headers: sameOrigin, data: { tools: ['table_saw', 'finishes'] } })).status()).toBe(200);

  await new RunningOrderPage(page).goto(episodeId);
  await expect(page.getByRole('link', { name: 'Stock rack' })).toBeVisible();
  await page.getByRole('link', { name: 'Shoot-day sheet' }).click();
  await expect(page.getByRole('heading', { level: 1, name: 'Shoot-day sheet' })).toBeVisible();
  const segment = page.getByRole('region', { name: 'Starter build' });
  // The episode's shoot date is 2027-02-06: the shot due the day after is left off.
  await expect(segment.getByText(`rip the legs ${stamp}`)).toBeVisible();
  await expect(segment.getByText(`sand the edges ${stamp}`)).toHaveCount(0);
  await expect(segment).toContainText('riving knife');
  await expect(segment).toContainText('manual, local codes and licensed practice come first');
  await expect(segment).toContainText('Safety review: not done yet');
  await expectAccessible(page);

  await page.getByLabel('Shoot date').fill('2027-02-07');
  await page.getByRole('button', { name: 'Show' }).click();
  await expect(segment.getByText(`sand the edges ${stamp}`)).toBeVisible();
  await expect(segment.getByText(`rip the legs ${stamp}`)).toHaveCount(0);

  await page.emulateMedia({ media: 'print' });
  await expect(page.getByRole('button', { name: 'Print' })).toBeHidden();
  await expect(page.getByRole('navigation', { name: 'Breadcrumb' })).toBeHidden();
  await expect(page.getByRole('link', { name: 'Stock rack' })).toBeHidden();
  await expect(segment.getByText(`sand the edges ${stamp}`)).toBeVisible();
});
