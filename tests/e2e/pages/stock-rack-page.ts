import { expect, type Page } from '@playwright/test';
import { DEMO_SLUG } from '../fixtures';

/** The stock rack: the channel's lumber and sheet goods, the shop settings, and the add-stock form. */
export class StockRackPage {
  constructor(readonly page: Page) {}

  async goto() {
    await this.page.goto(`/c/${DEMO_SLUG}/stock`);
  }

  /** Reaches the rack the way a person does, through the main navigation. */
  async openFromNav() {
    await this.page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Stock rack' }).click();
    await expect(this.page.getByRole('heading', { level: 1, name: 'Stock rack' })).toBeVisible();
  }

  addForm() {
    return this.page.getByRole('region', { name: 'Add stock' });
  }

  addButton() {
    return this.page.getByRole('button', { name: 'Add to rack' });
  }

  /** Fills the add form for softwood (the default kind) and submits it. */
  async addSoftwood({ species, profile, sizes }: { species: string; profile: string; sizes: string }) {
    const form = this.addForm();
    await form.getByLabel('Species').fill(species);
    await form.getByLabel('Profile').fill(profile);
    await form.getByLabel('Sizes on sale').fill(sizes);
    await form.getByRole('button', { name: 'Add to rack' }).click();
  }

  /** Fills the add form for hardwood boards (sizes as width x length) and submits it. */
  async addHardwood({ species, quarters, pricePerBoardFoot, sizes }: { species: string; quarters: string; pricePerBoardFoot: string; sizes: string }) {
    const form = this.addForm();
    await form.getByLabel('Kind').selectOption({ label: 'Hardwood boards' });
    await form.getByLabel('Species').fill(species);
    await form.getByLabel('Thickness (quarters)').fill(quarters);
    await form.getByLabel('Price per board foot').fill(pricePerBoardFoot);
    await form.getByLabel('Sizes on sale').fill(sizes);
    await form.getByRole('button', { name: 'Add to rack' }).click();
  }

  /** The rack's On hand section: pieces already in the shop. */
  onHand() {
    return this.page.getByRole('region', { name: 'On hand' });
  }

  /** Adds a piece on hand through the section's form and waits for the server to store it. */
  async addOnHand({ stock, length, count }: { stock: string; length: string; count: string }) {
    const form = this.page.getByRole('form', { name: 'Add a piece on hand' });
    await form.getByLabel('Stock').selectOption({ label: stock });
    await form.getByLabel('Length').fill(length);
    await form.getByLabel('How many').fill(count);
    const saved = this.page.waitForResponse((r) => r.request().method() === 'POST' && r.url().endsWith('/on-hand'));
    await form.getByRole('button', { name: 'Add on hand' }).click();
    expect((await saved).status()).toBe(201);
  }

  /** Changes the count of one on-hand line (`2x4 SPF`, `108"`) with Edit count, and waits for the server. */
  async setOnHandCount(stockName: string, size: string, count: string) {
    const line = this.onHandPiece(`${stockName}, ${size}`);
    await line.getByRole('button', { name: `Change count of ${stockName} ${size}` }).click();
    await line.getByLabel('How many').fill(count);
    const saved = this.page.waitForResponse((r) => r.request().method() === 'PATCH' && r.url().includes('/on-hand/'));
    await line.getByRole('button', { name: 'Save count' }).click();
    expect((await saved).status()).toBe(200);
  }

  /** One on-hand line by what it says, e.g. `1 × 2x4 SPF, 108"`. */
  onHandPiece(text: string | RegExp) {
    return this.onHand().getByRole('listitem').filter({ hasText: text });
  }

  /** A rack item's name as its card shows it, e.g. "2x4 SPF" (not the On hand form's choice of stock). */
  item(name: string) {
    return this.page.getByText(name, { exact: true }).and(this.page.locator(':not(option)'));
  }
}
