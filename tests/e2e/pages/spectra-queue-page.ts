import { expect, type Locator, type Page } from '@playwright/test';

/** The group's queue at /groups/[slug]/spectra. */
export class SpectraQueuePage {
  readonly table: Locator;
  readonly newButton: Locator;
  readonly search: Locator;
  readonly status: Locator;
  readonly verdict: Locator;

  constructor(private readonly page: Page) {
    const main = page.locator('main');
    this.table = main.getByTestId('spectra-table');
    this.newButton = main.getByTestId('new-spectrum');
    this.search = main.getByTestId('queue-search');
    this.status = main.getByTestId('queue-status');
    this.verdict = main.getByTestId('queue-verdict');
  }

  async goto(slug: string, query = '') {
    await this.page.goto(`/groups/${slug}/spectra${query}`);
    await expect(this.page.locator('main').getByTestId('spectra-queue')).toBeVisible();
  }

  row(id: string) {
    return this.page.getByTestId(`spectrum-row-${id}`);
  }

  /** The titles of the rows in table order. */
  titles() {
    return this.table.getByTestId('spectrum-link').allTextContents();
  }

  sortBy(column: 'title' | 'status' | 'verdict' | 'updated') {
    return this.table.getByTestId(`sort-${column}`).click();
  }

  header(column: string) {
    return this.table.locator('th').filter({ has: this.page.getByTestId(`sort-${column}`) });
  }
}
