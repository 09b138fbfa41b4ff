import { demo, DEMO_SLUG, expect, expectAccessible, sameOrigin, signIn, test } from './fixtures';

test('the sign-in page is accessible and signed-out pages redirect to it', async ({ page }) => {
  await page.goto(`/c/${DEMO_SLUG}/episodes`);
  await expect(page).toHaveURL(/\/sign-in/);
  await expect(page.getByRole('heading', { name: 'Sign in' })).toBeVisible();
  await expectAccessible(page);
});

for (const [label, account, roleLabel] of [
  ['Host', demo.host, 'Host'],
  ['Shop hand', demo.shopHand, 'Shop hand'],
  ['Editor', demo.editor, 'Editor'],
] as const) {
  test(`${label} signs in and sees the shell`, async ({ page }) => {
    await signIn(page, account);
    await expect(page.getByRole('heading', { level: 1, name: 'Tallowmere Woodshop' })).toBeVisible();
    await expect(page.getByText(`Signed in as ${account.name}, ${roleLabel}.`)).toBeVisible();
    const nav = page.getByRole('navigation', { name: 'Main' });
    for (const item of ['Dashboard', 'Episodes', 'Shots', 'Sponsors', 'Settings']) {
      await expect(nav.getByRole('link', { name: item })).toBeVisible();
    }
    await expectAccessible(page);
    await nav.getByRole('link', { name: 'Episodes' }).click();
    await expect(page.getByRole('heading', { level: 1, name: 'Episodes' })).toBeVisible();
    await expect(page.getByRole('link', { name: 'One Stool, Three Ways' })).toBeVisible();
    await expectAccessible(page);

    await page.getByText(account.name, { exact: true }).first().click();
    await page.getByRole('button', { name: 'Sign out' }).click();
    await expect(page).toHaveURL(/\/sign-in/);
  });
}

test('a shop hand opening crew settings is refused, on the page and by the API', async ({ page }) => {
  await signIn(page, demo.shopHand);
  const res = await page.goto(`/c/${DEMO_SLUG}/settings/crew`);
  expect(res?.status()).toBe(403);
  await expect(page.getByRole('heading', { name: 'Not for your role' })).toBeVisible();
  await expectAccessible(page);
  const api = await page.request.post(`/api/channels/${DEMO_SLUG}/invitations`, { headers: sameOrigin, data: { email: 'x@y.test', role: 'host' } });
  expect(api.status()).toBe(403);
});

test('keyboard-only sign-in works', async ({ page }) => {
  await page.goto('/sign-in');
  await page.keyboard.press('Tab');
  await expect(page.getByLabel('E-mail')).toBeFocused();
  await page.keyboard.type(demo.editor.email);
  await page.keyboard.press('Tab');
  await expect(page.getByLabel('Password')).toBeFocused();
  await page.keyboard.type(demo.editor.password);
  await page.keyboard.press('Enter');
  await page.waitForURL(new RegExp(`/c/${DEMO_SLUG}$`));
  await expect(page.getByText('Signed in as Mira Castellan, Editor.')).toBeVisible();
});

test('a wrong password gets the generic message', async ({ page }) => {
  await page.goto('/sign-in');
  await page.getByLabel('E-mail').fill(demo.editor.email);
  await page.getByLabel('Password').fill('not-the-password');
  await page.getByRole('button', { name: 'Sign in' }).click();
  // Next's route announcer is also role=alert, so pick ours by its text.
  await expect(page.getByRole('alert').filter({ hasText: 'did not match' })).toBeVisible();
  await expectAccessible(page);
});

test('the shell works on a phone-sized screen', async ({ page }) => {
  await page.setViewportSize({ width: 375, height: 740 });
  await signIn(page, demo.shopHand);
  const nav = page.getByRole('navigation', { name: 'Main' });
  await expect(nav.getByRole('link', { name: 'Settings' })).toBeInViewport();
  const overflow = await page.evaluate(() => document.documentElement.scrollWidth - window.innerWidth);
  expect(overflow).toBeLessThanOrEqual(0);
  await expectAccessible(page);
});
