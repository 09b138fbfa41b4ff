import { expect, type Page } from '@playwright/test';

/**
 * Waits until dnd-kit's live region announces `text`. Each drag step (pick up, move, drop) is
 * announced once the app has handled it, so a test waits for that instead of a fixed pause.
 * Source: @dnd-kit/core 6 renders its announcements in an element with id `DndLiveRegion-*`.
 */
export async function expectAnnounced(page: Page, text: string | RegExp) {
  await expect(page.locator('[id^="DndLiveRegion-"]')).toContainText(text);
}
