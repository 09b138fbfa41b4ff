import { expect, type Page } from '@playwright/test';

/** A segment's page: script, shot list, safety, parts and clips. */
export class SegmentPage {
  constructor(readonly page: Page) {}

  async goto(url: string) {
    await this.page.goto(url);
  }

  script() {
    return this.page.getByRole('textbox', { name: 'Script' });
  }

  savedStatus() {
    return this.page.getByRole('status').filter({ hasText: /^Saved$/ });
  }

  shotList() {
    return this.page.getByRole('table', { name: 'Shot list' });
  }

  /** Pastes shot lines into quick add, checks its preview counts them all, optionally assigns them, and adds them. */
  async pasteShots(lines: readonly string[], assignee?: string) {
    await this.page.getByLabel('Paste shots, one per line').fill(lines.join('\n'));
    await expect(this.page.getByText(`${lines.length} ${lines.length === 1 ? 'shot' : 'shots'} will be added`)).toBeVisible();
    if (assignee) await this.page.getByLabel('Assign to').selectOption({ label: assignee });
    await this.page.getByRole('button', { name: 'Add shots' }).click();
  }

  clipPicker() {
    return this.page.getByLabel('Choose clips to upload');
  }

  uploadProgress(name: string) {
    return this.page.getByRole('progressbar', { name: `Upload progress for ${name}` });
  }
}
