import { expect, type Locator, type Page } from '@playwright/test';

export interface SpectrumMetadata {
  title: string;
  material: string;
  formula?: string;
  method?: string;
  code?: string;
  supercell?: string;
  qmesh?: string;
  notes?: string;
}

/** The new-spectrum form at /groups/[slug]/spectra/new. */
export class SpectraNewPage {
  readonly form: Locator;
  readonly fileInput: Locator;
  readonly submit: Locator;
  readonly progressbar: Locator;
  readonly uploadError: Locator;
  readonly fileError: Locator;

  constructor(private readonly page: Page) {
    const main = page.locator('main');
    this.form = main.getByTestId('new-spectrum-form');
    this.fileInput = main.getByTestId('band-file-input');
    this.submit = main.getByTestId('create-spectrum');
    this.progressbar = main.getByRole('progressbar');
    this.uploadError = main.getByTestId('upload-error');
    this.fileError = main.getByTestId('band-file-error');
  }

  async goto(slug: string) {
    await this.page.goto(`/groups/${slug}/spectra/new`);
    await expect(this.form).toBeVisible();
  }

  async fill(meta: SpectrumMetadata) {
    for (const [key, value] of Object.entries(meta)) {
      if (value !== undefined) await this.page.getByTestId(`meta-${key}`).fill(value);
    }
  }

  /** Chooses a file through the drop zone's own input, as a drop or the file dialog would. */
  async chooseFile(name: string, contents: Buffer | string) {
    await this.fileInput.setInputFiles({ name, mimeType: 'text/plain', buffer: Buffer.from(contents) });
    await expect(this.page.getByTestId('band-file-drop')).toContainText(name);
  }

  /**
   * Records every aria-valuenow the progress bar takes, from before the upload starts; read
   * them back with `progressSeen()`.
   */
  async watchProgress() {
    await this.page.evaluate(() => {
      const w = window as unknown as { __progressSeen: number[] };
      w.__progressSeen = [];
      const note = (el: Element | null) => {
        const v = el?.getAttribute('aria-valuenow');
        if (v !== null && v !== undefined && w.__progressSeen.at(-1) !== Number(v)) w.__progressSeen.push(Number(v));
      };
      new MutationObserver(() => note(document.querySelector('main [role="progressbar"]'))).observe(document.body, {
        subtree: true,
        childList: true,
        attributes: true,
        attributeFilter: ['aria-valuenow'],
      });
    });
  }

  progressSeen(): Promise<number[]> {
    return this.page.evaluate(() => (window as unknown as { __progressSeen: number[] }).__progressSeen);
  }
}
