import { randomUUID } from 'node:crypto';
import { expect, expectAccessible, sameOrigin, test } from './fixtures';

// A fresh account of its own: "Sign out everywhere" must not end the demo accounts' other tests.
test('a new Host signs up, then “Sign out everywhere” ends every session, old cookies included', async ({ page, browser }, testInfo) => {
  const email = `sessions-${randomUUID().slice(0, 8)}@e2e.kerfline.test`;
  await page.goto('/sign-up');
  await expectAccessible(page);
  await page.getByLabel('Your name').fill('Wren Halloway');
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password').fill('a-long-enough-password');
  await page.getByLabel('Channel name').fill('Halloway Joinery');
  await page.getByRole('button', { name: 'Create channel' }).click();
  await page.waitForURL(/\/c\/halloway-joinery-[0-9a-f]{6}$/);
  const channelUrl = new URL(page.url()).pathname;

  // A second device: the same cookies in another browser context.
  const cookies = await page.context().cookies();
  const other = await browser.newContext();
  await other.addCookies(cookies);
  expect((await other.request.get('/api/profile')).status()).toBe(200);

  await page.goto(`${channelUrl}/settings`);
  await expect(page.getByRole('heading', { name: 'Signed-in devices' })).toBeVisible();
  await expectAccessible(page);
  // For a person to look at: the section on a desktop and on a phone.
  await page.getByRole('heading', { name: 'Signed-in devices' }).scrollIntoViewIfNeeded();
  await page.screenshot({ path: testInfo.outputPath('settings-1280.png') });
  await page.setViewportSize({ width: 375, height: 740 });
  await page.getByRole('button', { name: 'Sign out everywhere' }).scrollIntoViewIfNeeded();
  await page.screenshot({ path: testInfo.outputPath('settings-375.png') });
  const overflow = await page.evaluate(() => document.documentElement.scrollWidth - window.innerWidth);
  expect(overflow).toBeLessThanOrEqual(0);
  await page.getByRole('button', { name: 'Sign out everywhere' }).click();
  await expect(page).toHaveURL(/\/sign-in/);

  expect((await other.request.get('/api/profile')).status()).toBe(401);
  expect((await other.request.delete('/api/profile/sessions', { headers: sameOrigin })).status()).toBe(401);
  const again = await other.newPage();
  await again.goto(channelUrl);
  await expect(again).toHaveURL(/\/sign-in/);
  await other.close();
});

test('signing up with an address that has an account says nothing about it and signs no one in', async ({ page }, testInfo) => {
  await page.goto('/sign-up');
  await page.getByLabel('Your name').fill('Someone Else');
  await page.getByLabel('E-mail').fill('rowan@tallowmere.test');
  await page.getByLabel('Password').fill('not-the-real-password');
  await page.getByLabel('Channel name').fill('Not Theirs');
  await page.getByRole('button', { name: 'Create channel' }).click();
  await expect(page.getByRole('status').filter({ hasText: 'We sent a message to that address' })).toBeVisible();
  await expect(page).toHaveURL(/\/sign-up/);
  await expectAccessible(page);
  await page.screenshot({ path: testInfo.outputPath('sign-up-known-address-1280.png') });
});
