import { DEMO_SLUG, demo, expect, expectAccessible, sameOrigin, test } from './fixtures';
import { CrewSettingsPage } from './pages/crew-settings-page';
import { SignInPage } from './pages/sign-in-page';

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
    await new SignInPage(page).signIn(account);
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

test('a shop hand opening crew settings is refused, on the page and by the API', async ({ signedIn }) => {
  const page = await signedIn('shopHand');
  const res = await new CrewSettingsPage(page).goto();
  expect(res?.status()).toBe(403);
  await expect(page.getByRole('heading', { name: 'Not for your role' })).toBeVisible();
  await expectAccessible(page);
  const api = await page.request.post(`/api/channels/${DEMO_SLUG}/invitations`, { headers: sameOrigin, data: { email: 'x@y.test', role: 'host' } });
  expect(api.status()).toBe(403);
});

test('keyboard-only sign-in works', async ({ page }) => {
  const signIn = new SignInPage(page);
  await signIn.goto();
  await page.keyboard.press('Tab');
  await expect(signIn.email()).toBeFocused();
  await page.keyboard.type(demo.editor.email);
  await page.keyboard.press('Tab');
  await expect(signIn.password()).toBeFocused();
  await page.keyboard.type(demo.editor.password);
  await page.keyboard.press('Enter');
  await page.waitForURL(new RegExp(`/c/${DEMO_SLUG}$`));
  await expect(page.getByText('Signed in as Mira Castellan, Editor.')).toBeVisible();
});

test('a wrong password gets the generic message', async ({ page }) => {
  const signIn = new SignInPage(page);
  await signIn.goto();
  await signIn.email().fill(demo.editor.email);
  await signIn.password().fill('not-the-password');
  await signIn.submit().click();
  // Next's route announcer is also role=alert, so pick ours by its text.
  await expect(page.getByRole('alert').filter({ hasText: 'did not match' })).toBeVisible();
  await expectAccessible(page);
});

test('the shell works on a phone-sized screen', async ({ signedIn }) => {
  const page = await signedIn('shopHand', { viewport: { width: 375, height: 740 } });
  await page.goto(`/c/${DEMO_SLUG}`);
  const nav = page.getByRole('navigation', { name: 'Main' });
  await expect(nav.getByRole('link', { name: 'Settings' })).toBeInViewport();
  const overflow = await page.evaluate(() => document.documentElement.scrollWidth - window.innerWidth);
  expect(overflow).toBeLessThanOrEqual(0);
  await expectAccessible(page);
});
