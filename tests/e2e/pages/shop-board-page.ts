import type { Page } from '@playwright/test';
import { DEMO_SLUG } from '../fixtures';
import { expectAnnounced, pressUntilAnnounced } from './live-region';

/** The shop board: shots laid out by shot state (columns on a desktop, one list on a phone). */
export class ShopBoardPage {
  constructor(readonly page: Page) {}

  async goto(episodeId?: string) {
    await this.page.goto(`/c/${DEMO_SLUG}/shots${episodeId ? `?episodeId=${episodeId}` : ''}`);
  }

  column(state: 'Planned' | 'Captured' | 'Retake') {
    return this.page.getByRole('region', { name: state });
  }

  phoneList() {
    return this.page.getByRole('region', { name: 'Shots in board order' });
  }

  markCaptured(description: string) {
    return this.page.getByRole('button', { name: `Mark captured: ${description}` });
  }

  markRetake(description: string) {
    return this.page.getByRole('button', { name: `Mark retake: ${description}` });
  }

  /** Picks a card up with Space, moves it one column right into `to`, drops it; resolves with the state PUT's status. */
  async moveRightWithKeyboard(description: string, to: 'Captured' | 'Retake'): Promise<number> {
    const { keyboard } = this.page;
    await this.page.getByRole('button', { name: `Move: ${description}` }).focus();
    await keyboard.press('Space');
    // The pick-up is announced, then at once where the card is over (its own column).
    await expectAnnounced(this.page, /Picked up|is over/);
    await pressUntilAnnounced(this.page, 'ArrowRight', `is over ${to}`);
    const saved = this.page.waitForResponse((r) => r.url().includes('/state') && r.request().method() === 'PUT');
    await keyboard.press('Space');
    return (await saved).status();
  }
}
