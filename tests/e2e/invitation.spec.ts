import { randomUUID } from 'node:crypto';
import { DEMO_SLUG, expect, expectAccessible, test, waitForMail } from './fixtures';
import { CrewSettingsPage } from './pages/crew-settings-page';

test('a host invites a new address; the invitee sets a password and lands in the channel as Editor', async ({ signedIn, browser }) => {
  const email = `new-editor-${randomUUID().slice(0, 8)}@e2e.kerfline.test`;
  const page = await signedIn('host');
  const crew = new CrewSettingsPage(page);
  await crew.goto();
  await expectAccessible(page);
  await crew.invite(email, 'editor');
  await expect(crew.entry(email)).toBeVisible();

  const [mail] = await waitForMail(email);
  if (!mail) throw new Error('no mail');
  expect(mail.subject).toContain('Tallowmere Woodshop');
  const link = /(http:\/\/\S+\/invite\/[A-Za-z0-9_-]+)/.exec(mail.text)?.[1];
  expect(link).toBeTruthy();

  const invitee = await browser.newContext();
  const p2 = await invitee.newPage();
  await p2.goto(link!);
  await expect(p2.getByRole('heading', { name: 'Join Tallowmere Woodshop' })).toBeVisible();
  await expectAccessible(p2);
  await p2.getByLabel('Your name').fill('Tam Newcomer');
  await p2.getByLabel('Choose a password').fill('short');
  await p2.getByRole('button', { name: 'Create account and join' }).click();
  await expect(p2.getByText('Use at least 10 characters.')).toBeVisible();
  await p2.getByLabel('Choose a password').fill('a-long-enough-password');
  await p2.getByRole('button', { name: 'Create account and join' }).click();
  await p2.waitForURL(new RegExp(`/c/${DEMO_SLUG}$`));
  await expect(p2.getByText('Signed in as Tam Newcomer, Editor.')).toBeVisible();

  await p2.goto(link!);
  await expect(p2.getByRole('heading', { name: 'This invitation has already been used' })).toBeVisible();
  await expectAccessible(p2);
  await invitee.close();

  await page.reload();
  await expect(crew.entry('Tam Newcomer')).toBeVisible();
});

test('a broken invitation link gets a clear page', async ({ page }) => {
  await page.goto('/invite/not-a-real-token-at-all-000000');
  await expect(page.getByRole('heading', { name: 'This link is not valid' })).toBeVisible();
  await expectAccessible(page);
});
