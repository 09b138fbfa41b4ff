import { expect, type Page } from '@playwright/test';
import { DEMO_SLUG } from '../fixtures';

export type NewDeal = { sponsorName: string; contactName: string; contactEmail: string; title: string; fee: string; currency: string };

/** Sponsor reads: the deal list and the new-deal form. */
export class SponsorsPage {
  constructor(readonly page: Page) {}

  async goto() {
    await this.page.goto(`/c/${DEMO_SLUG}/sponsors`);
  }

  newDealForm() {
    return this.page.getByRole('form', { name: 'New deal' });
  }

  /** Creates a deal for a sponsor entered on the spot and waits for the deal's page. */
  async createDealForNewSponsor(deal: NewDeal) {
    const form = this.newDealForm();
    await form.getByLabel('Sponsor', { exact: true }).selectOption({ label: 'New sponsor…' });
    await form.getByLabel('Sponsor name').fill(deal.sponsorName);
    await form.getByLabel('Contact name').fill(deal.contactName);
    await form.getByLabel('Contact e-mail').fill(deal.contactEmail);
    await form.getByLabel('Deal title').fill(deal.title);
    await form.getByLabel('Fee').fill(deal.fee);
    await form.getByLabel('Currency').fill(deal.currency);
    await form.getByRole('button', { name: 'Create deal' }).click();
    // Two requests (sponsor, deal) and a page load on a busy box.
    await expect(this.page.getByRole('heading', { level: 1, name: deal.title })).toBeVisible({ timeout: 30_000 });
  }

  sponsorLink(name: string) {
    return this.page.getByRole('link', { name });
  }
}
