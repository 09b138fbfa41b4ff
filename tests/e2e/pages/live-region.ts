import { expect, type Page } from '@playwright/test';

const LIVE_REGION = '[id^="DndLiveRegion-"]';

/**
 * Waits until dnd-kit's live region announces `text`. Each drag step (pick up, move, drop) is
 * announced once the app has handled it, so a test waits for that instead of a fixed pause.
 * Source: @dnd-kit/core 6 renders its announcements in an element with id `DndLiveRegion-*`.
 */
export async function expectAnnounced(page: Page, text: string | RegExp, options?: { timeout?: number }) {
  await expect(page.locator(LIVE_REGION)).toContainText(text, options);
}

/**
 * Presses an arrow `key` during a keyboard drag and waits until `text` is announced. The pick-up is
 * announced before dnd-kit has measured where the items are, and an arrow pressed in between moves
 * nothing and announces nothing (seen in a CI trace: ArrowUp 34 ms after "Picked up" on a loaded
 * machine). So the key is pressed again, but only while the live region still reads what it read
 * before the press: a key that moved the item always changes the announcement, so an item is never
 * moved twice.
 * Source: @dnd-kit/sortable 10 `sortableKeyboardCoordinates` returns no coordinates while
 * `collisionRect` is unmeasured, and then the keyboard sensor ignores the key.
 */
export async function pressUntilAnnounced(page: Page, key: string, text: string | RegExp) {
  const region = page.locator(LIVE_REGION);
  const before = await region.textContent();
  await expect(async () => {
    if ((await region.textContent()) === before) await page.keyboard.press(key);
    await expectAnnounced(page, text, { timeout: 2_000 });
  }).toPass({ timeout: 15_000 });
}
