import { randomUUID } from 'node:crypto';
import { DEMO_SLUG, expect, expectAccessible, test, waitForMail } from './fixtures';

test('a host invites a new address; the invitee sets a password and lands in the channel as Editor', async ({ signedIn, browser }) => {
  const email = `new-editor-${randomUUID().slice(0, 8)}@e2e.kerfline.test`;
  const page = await signedIn('host');
  await page.goto(`/c/${DEMO_SLUG}/settings/crew`);
  await expectAccessible(page);
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Role', { exact: true }).selectOption('editor');
  await page.getByRole('button', { name: 'Send invitation' }).click();
  await expect(page.getByText(`Invitation sent to ${email}.`)).toBeVisible();
  await expect(page.getByText(email, { exact: true })).toBeVisible();

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
  await expect(page.getByText('Tam Newcomer', { exact: true })).toBeVisible();
});

test('a broken invitation link gets a clear page', async ({ page }) => {
  await page.goto('/invite/not-a-real-token-at-all-000000');
  await expect(page.getByRole('heading', { name: 'This link is not valid' })).toBeVisible();
  await expectAccessible(page);
});
