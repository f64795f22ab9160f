import type { Locator, Page } from '@playwright/test';

/** One spectrum at /groups/[slug]/spectra/[id]. */
export class SpectraSpectrumPage {
  readonly screening: Locator;
  readonly findings: Locator;
  readonly caution: Locator;
  readonly plot: Locator;
  readonly revisionUpload: Locator;

  constructor(private readonly page: Page) {
    const main = page.locator('main');
    this.screening = main.getByTestId('screening-panel');
    this.findings = main.getByTestId('findings-table');
    this.caution = main.getByTestId('screening-caution');
    this.plot = main.getByTestId('dispersion');
    this.revisionUpload = main.getByTestId('revision-upload');
  }

  status(name: string) {
    return this.page.locator('main').getByTestId('page-title').locator('..').getByTestId(`status-${name}`);
  }

  verdict(name: string) {
    return this.page.locator('main').getByTestId('screening-verdict').getByTestId(`verdict-${name}`);
  }

  finding(check: string) {
    return this.findings.getByTestId(`finding-${check}`);
  }

  /** The id in the page's URL. */
  id(): string {
    const m = /\/spectra\/([0-9a-f-]{36})$/.exec(new URL(this.page.url()).pathname);
    if (!m) throw new Error(`not a spectrum page: ${this.page.url()}`);
    return m[1];
  }
}
