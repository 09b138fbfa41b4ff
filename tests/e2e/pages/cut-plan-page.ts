import { expect, type Page } from '@playwright/test';
import { DEMO_SLUG } from '../fixtures';

/** A build segment's parts list with the cut plan for that build. */
export class PartsPage {
  constructor(readonly page: Page) {}

  /** Opens a build segment of an episode through the episode list and its running order. */
  async open(episodeTitle: string, segmentTitle: string) {
    await this.page.goto(`/c/${DEMO_SLUG}/episodes`);
    await this.page.getByRole('link', { name: episodeTitle }).first().click();
    await this.page.getByRole('link', { name: segmentTitle }).click();
    await expect(this.page.getByRole('heading', { name: 'Parts list' })).toBeVisible();
  }

  addForm() {
    return this.page.getByRole('region', { name: 'Add a part' });
  }

  /** Fills the add-part form and submits it; the caller checks the outcome. */
  async addPart({ name, quantity, length, width, stock }: { name: string; quantity: string; length: string; width?: string; stock?: string }) {
    const form = this.addForm();
    await form.getByLabel('Part').fill(name);
    await form.getByLabel('Qty').fill(quantity);
    await form.getByLabel('Length').fill(length);
    if (width) await form.getByLabel('Width').fill(width);
    if (stock) await form.getByLabel('Stock').selectOption({ label: stock });
    await form.getByRole('button', { name: 'Add part' }).click();
  }

  part(name: string) {
    return this.page.getByRole('cell', { name, exact: true });
  }

  /** The cut plan's group for one stock item: its boards, prices and diagrams. */
  stockGroup(stockName: string) {
    return this.page.getByRole('region', { name: stockName });
  }

  async openEpisodePlan() {
    await this.page.getByRole('link', { name: 'Whole episode, shopping and cut lists' }).click();
    const plan = new CutPlanPage(this.page);
    await plan.expectLoaded();
    return plan;
  }
}

/** An episode's cut plan: shopping list and cut lists per stock item, whole episode or per level. */
export class CutPlanPage {
  constructor(readonly page: Page) {}

  async expectLoaded() {
    await expect(this.page.getByRole('heading', { level: 1, name: /Cut plan/ })).toBeVisible();
  }

  stockGroup(stockName: string) {
    return this.page.getByRole('region', { name: stockName });
  }

  boughtBox(stockName: string, label: string) {
    return this.stockGroup(stockName).getByRole('checkbox', { name: `Bought ${label}` });
  }

  firstCutOnBoard(stockName: string, board: number) {
    return this.stockGroup(stockName).getByRole('list', { name: `Cuts on board ${board}` }).getByRole('checkbox').first();
  }

  /** Ticks a shopping line and waits for the server to store it. */
  async markBought(stockName: string, label: string) {
    const saved = this.page.waitForResponse((r) => r.request().method() === 'PUT' && r.url().endsWith('/shopping'));
    await this.boughtBox(stockName, label).click();
    expect((await saved).status()).toBe(200);
  }

  /** Ticks the first cut on a board and waits for the server to store the part's cut count. */
  async markFirstCut(stockName: string, board: number) {
    const saved = this.page.waitForResponse((r) => r.request().method() === 'PATCH' && r.url().includes('/parts/'));
    await this.firstCutOnBoard(stockName, board).click();
    expect((await saved).status()).toBe(200);
  }

  /** "Mark these cuts done" for a stock item, confirmed, waiting for the server to record it. */
  async markCutsDone(stockName: string) {
    const group = this.stockGroup(stockName);
    await group.getByRole('button', { name: 'Mark these cuts done' }).click();
    const saved = this.page.waitForResponse((r) => r.request().method() === 'POST' && r.url().endsWith('/cut-plan/done'));
    await group.getByRole('button', { name: 'Yes, cuts done' }).click();
    expect((await saved).status()).toBe(200);
  }

  /** The "Cuts done" list of the episode's cut records. */
  cutsDone() {
    return this.page.getByRole('region', { name: 'Cuts done' });
  }

  /** "Take back" on the newest cuts done of a stock item: opens the confirmation and returns it. */
  async askTakeBack(stockName: string) {
    await this.cutsDone().getByRole('button', { name: `Take back the cuts of ${stockName}` }).click();
    return this.cutsDone().getByRole('group', { name: `Take back the cuts of ${stockName}` });
  }

  /** Confirms an open "Take back" and waits for the server's answer; returns its status. */
  async confirmTakeBack(stockName: string) {
    const answered = this.page.waitForResponse((r) => r.request().method() === 'DELETE' && r.url().includes('/cut-plan/done/'));
    await this.cutsDone().getByRole('group', { name: `Take back the cuts of ${stockName}` }).getByRole('button', { name: 'Yes, take back' }).click();
    return (await answered).status();
  }

  async showLevel(level: number) {
    await this.page.getByRole('button', { name: new RegExp(`Level ${level}`) }).click();
  }
}
