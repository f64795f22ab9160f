import type { Locator, Page } from '@playwright/test';

/** The plot panel's heading and legend, which say what is drawn (e.g. a compared revision). */
export class WorkspacePlot {
  readonly legend: Locator;
  readonly caption: Locator;

  constructor(private readonly page: Page) {
    const main = page.locator('main');
    this.legend = main.getByRole('list', { name: 'Legend' });
    this.caption = main.getByTestId('dispersion-plot').locator('figcaption');
  }

  heading(name: string | RegExp, options: { exact?: boolean } = {}) {
    return this.page.locator('main').getByRole('heading', { level: 2, name, exact: options.exact });
  }
}

/** The revisions panel: history and the compare of two revisions. */
export class RevisionsPanel {
  readonly root: Locator;
  readonly compareStart: Locator;
  readonly from: Locator;
  readonly to: Locator;
  readonly summary: Locator;
  readonly table: Locator;
  readonly rows: Locator;

  constructor(page: Page) {
    this.root = page.locator('main').getByTestId('revision-history');
    this.compareStart = this.root.getByRole('button', { name: 'Compare two revisions' });
    this.from = this.root.getByLabel('From (dashed on the plot)');
    this.to = this.root.getByLabel('To', { exact: true });
    this.table = this.root.getByRole('table', { name: 'Largest deviation per branch' });
    this.summary = this.root.getByText(/^Revision \d+ → \d+:/);
    this.rows = this.table.locator('tbody tr');
  }

  /** The cells of one row of the deviation table: branch, largest |Δω|, direction, q-point. */
  async row(i: number) {
    const [branch, deviation, direction, at] = await this.rows.nth(i).locator('td').allInnerTexts();
    return { branch: Number(branch), deviation, direction, at: Number(at), over: await this.rows.nth(i).getAttribute('data-over') };
  }
}

/** The derived-quantities panel: sound velocities, mesh DOS and thermodynamics, measured points. */
export class DerivedPanel {
  readonly root: Locator;
  readonly soundTable: Locator;
  readonly dosChart: Locator;
  readonly heatChart: Locator;
  readonly freeEnergyChart: Locator;
  readonly zeroPoint: Locator;
  readonly measuredUnit: Locator;
  readonly measuredFile: Locator;
  readonly measuredRms: Locator;
  readonly measuredError: Locator;

  constructor(page: Page) {
    this.root = page.locator('main').getByTestId('derived');
    this.soundTable = this.root.getByRole('table', { name: /Acoustic branches leaving Γ/ });
    this.dosChart = this.root.getByRole('img', { name: 'Phonon density of states' });
    this.heatChart = this.root.getByRole('img', { name: 'Heat capacity and entropy against temperature' });
    this.freeEnergyChart = this.root.getByRole('img', { name: 'Free energy against temperature' });
    this.zeroPoint = this.root.getByTestId('zero-point');
    this.measuredUnit = this.root.getByLabel('Frequency unit in the file');
    this.measuredFile = this.root.getByLabel('CSV file');
    this.measuredRms = this.root.getByTestId('measured-rms');
    this.measuredError = this.root.getByTestId('measured-error');
  }

  /** The value beside a term of the mesh facts, e.g. 'C_V at 300 K'. */
  fact(term: string) {
    return this.root.getByRole('term').filter({ hasText: term }).locator('xpath=following-sibling::dd[1]');
  }
}

/** Who reviews the spectrum, and the admin's form that changes it. */
export class ReviewersPanel {
  readonly root: Locator;
  readonly assign: Locator;
  readonly save: Locator;
  readonly assigned: Locator;

  constructor(page: Page) {
    this.root = page.locator('main').getByTestId('reviewers');
    this.assign = this.root.getByRole('button', { name: 'Assign…' });
    this.save = this.root.getByRole('button', { name: 'Save reviewers' });
    this.assigned = this.root.getByRole('listitem');
  }

  candidate(name: string) {
    return this.root.getByRole('checkbox', { name });
  }
}
