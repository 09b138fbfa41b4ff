import type { Page } from '@playwright/test';

export class SignInPage {
  constructor(readonly page: Page) {}

  readonly email = () => this.page.getByLabel('E-mail');
  readonly password = () => this.page.getByLabel('Password');
  readonly submit = () => this.page.getByRole('button', { name: 'Sign in' });

  async goto() {
    await this.page.goto('/sign-in');
  }

  /** Signs in and waits for the channel dashboard the app lands on. */
  async signIn(account: { email: string; password: string }) {
    await this.goto();
    await this.email().fill(account.email);
    await this.password().fill(account.password);
    await this.submit().click();
    await this.page.waitForURL(/\/c\/[a-z0-9-]+$/);
  }
}
