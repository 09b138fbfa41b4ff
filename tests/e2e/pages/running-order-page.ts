import { expect, type Page } from '@playwright/test';
import { DEMO_SLUG } from '../fixtures';
import { expectAnnounced, pressUntilAnnounced } from './live-region';

/** An episode's page: its running order of segment cards. */
export class RunningOrderPage {
  constructor(readonly page: Page) {}

  async goto(episodeId: string) {
    await this.page.goto(`/c/${DEMO_SLUG}/episodes/${episodeId}`);
  }

  card(title: string) {
    return this.page.locator(`article[aria-label="${title}"]`);
  }

  moveHandle(title: string) {
    return this.page.getByRole('button', { name: `Move ${title}` });
  }

  /** The segment titles in running order, as the cards show them. */
  titles() {
    return this.page.locator('ol > li article[aria-label]').evaluateAll((els) => els.map((e) => e.getAttribute('aria-label')));
  }

  async expectTitles(titles: readonly string[]) {
    await expect.poll(() => this.titles()).toEqual(titles);
  }

  /** Drags `title` by its handle with the mouse onto `targetTitle`'s card and drops it there. */
  async dragWithMouse(title: string, targetTitle: string) {
    const handle = this.moveHandle(title);
    const target = this.card(targetTitle);
    await target.scrollIntoViewIfNeeded();
    await handle.scrollIntoViewIfNeeded();
    const from = await handle.boundingBox();
    const to = await target.boundingBox();
    if (!from || !to) throw new Error('no boxes');
    const { mouse } = this.page;
    await mouse.move(from.x + from.width / 2, from.y + from.height / 2);
    await mouse.down();
    await mouse.move(from.x + from.width / 2, from.y + from.height / 2 - 12, { steps: 4 });
    await mouse.move(from.x + from.width / 2, to.y + 8, { steps: 20 });
    await expectAnnounced(this.page, `${title} moved to position`);
    await mouse.up();
  }

  /** Picks `title` up with Space, moves it one place with `key`, and drops it with Space. */
  async moveWithKeyboard(title: string, key: 'ArrowUp' | 'ArrowDown') {
    const { keyboard } = this.page;
    await this.moveHandle(title).focus();
    await keyboard.press('Space');
    await expectAnnounced(this.page, `Picked up ${title}`);
    await pressUntilAnnounced(this.page, key, `${title} moved to position`);
    await keyboard.press('Space');
    await expectAnnounced(this.page, `${title} dropped at position`);
  }
}
