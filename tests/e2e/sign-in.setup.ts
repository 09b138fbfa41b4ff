import { test as setup } from '@playwright/test';
import { authStateFile, demo, type DemoRole } from './fixtures';
import { SignInPage } from './pages/sign-in-page';

// Signs each demo role in once per run and saves the cookies; the tests start from these states
// (the `signedIn` fixture) instead of typing a password each time. shell.spec.ts still signs in by hand.
for (const role of Object.keys(demo) as DemoRole[]) {
  setup(`sign in as ${role}`, async ({ page }) => {
    await new SignInPage(page).signIn(demo[role]);
    await page.context().storageState({ path: authStateFile(role) });
  });
}
