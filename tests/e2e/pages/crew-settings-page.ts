import { expect, type Page } from '@playwright/test';
import { DEMO_SLUG } from '../fixtures';

/** Crew settings: the channel's members, open invitations and the invite form. */
export class CrewSettingsPage {
  constructor(readonly page: Page) {}

  url() {
    return `/c/${DEMO_SLUG}/settings/crew`;
  }

  async goto() {
    return this.page.goto(this.url());
  }

  inviteForm() {
    return this.page.getByRole('form', { name: 'Invite someone' });
  }

  /** Sends an invitation and waits for the form to say it went out. */
  async invite(email: string, role: 'host' | 'shop_hand' | 'editor') {
    const form = this.inviteForm();
    await form.getByLabel('E-mail').fill(email);
    await form.getByLabel('Role', { exact: true }).selectOption(role);
    await form.getByRole('button', { name: 'Send invitation' }).click();
    await expect(this.page.getByText(`Invitation sent to ${email}.`)).toBeVisible();
  }

  /** A member's name or an invited address, as the lists show it. */
  entry(text: string) {
    return this.page.getByText(text, { exact: true });
  }
}
