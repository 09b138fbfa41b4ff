import type { Page } from '@playwright/test';

/** What sticks out past the right edge of the viewport: the page's scroll width and each offending element. */
export type Overflow = { scrollWidth: number; innerWidth: number; offenders: string[] };

/**
 * Measures the page as laid out now. An element counts when its right edge passes the viewport, even a
 * visually hidden one: a 1 px "sr-only" label placed off to the right still widens the page (issue 15).
 * Elements cut off by an overflow-hidden ancestor that itself fits are not visible and do not count; a
 * sideways scroll box does not excuse them (issue 15: at 375 px a list becomes stacked cards, not a scroll).
 */
export async function measureOverflow(page: Page): Promise<Overflow> {
  return page.evaluate(() => {
    const innerWidth = window.innerWidth;
    const clippedBy = (el: Element): boolean => {
      for (let p = el.parentElement; p && p !== document.body; p = p.parentElement) {
        const ox = getComputedStyle(p).overflowX;
        if ((ox === 'hidden' || ox === 'clip') && p.getBoundingClientRect().right <= innerWidth + 0.5) return true;
      }
      return false;
    };
    const describe = (el: Element) => {
      const cls = typeof el.className === 'string' && el.className ? `.${el.className.trim().split(/\s+/).slice(0, 4).join('.')}` : '';
      const text = (el.textContent ?? '').trim().slice(0, 40);
      return `${el.tagName.toLowerCase()}${cls} "${text}" right=${Math.round(el.getBoundingClientRect().right)}`;
    };
    const offenders: string[] = [];
    for (const el of Array.from(document.body.querySelectorAll('*'))) {
      const r = el.getBoundingClientRect();
      if (r.width === 0 && r.height === 0) continue;
      if (r.right > innerWidth + 0.5 && !clippedBy(el)) offenders.push(describe(el));
    }
    return { scrollWidth: document.documentElement.scrollWidth, innerWidth, offenders: offenders.slice(0, 10) };
  });
}

/** Every same-channel page link on the page, as a path without query or hash. */
export async function channelLinks(page: Page, slug: string): Promise<string[]> {
  const hrefs = await page.locator(`a[href^="/c/${slug}"]`).evaluateAll((as) => as.map((a) => (a as HTMLAnchorElement).pathname));
  return [...new Set(hrefs)];
}

/** One route per shape: ids replaced, so the crawl visits each kind of page once, not every episode. */
export const routeShape = (path: string) => path.replace(/[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}/g, ':id').replace(/\/handoff\/\d+/, '/handoff/:v');
