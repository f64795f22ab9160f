import { expect, type Locator, type Page } from '@playwright/test';

/** The review workspace on /groups/[slug]/spectra/[id]: plot, findings, threads, decision, export. */
export class ReviewWorkspacePage {
  readonly main: Locator;
  readonly plotCanvas: Locator;
  readonly composer: Locator;
  readonly threads: Locator;
  readonly findings: Locator;
  readonly decision: Locator;
  readonly exportPanel: Locator;
  readonly revisionUpload: Locator;

  constructor(private readonly page: Page) {
    this.main = page.locator('main');
    this.plotCanvas = this.main.getByTestId('dispersion-plot-canvas');
    this.composer = this.main.getByTestId('thread-composer');
    this.threads = this.main.getByTestId('threads');
    this.findings = this.main.getByTestId('findings');
    this.decision = this.main.getByTestId('decision-panel');
    this.exportPanel = this.main.getByTestId('export');
    this.revisionUpload = this.main.getByTestId('revision-upload');
  }

  async goto(slug: string, id: string) {
    await this.page.goto(`/groups/${slug}/spectra/${id}`);
    await expect(this.main.getByTestId('page-title')).toBeVisible();
  }

  status(name: string) {
    return this.main.getByTestId('page-title').locator('..').getByTestId(`status-${name}`);
  }

  /**
   * Clicks a line of the plot: hovers at a fraction of the canvas, reads where the plot's cursor
   * snapped to (the nearest point of a branch), and clicks exactly there.
   */
  async clickLineNear(fx: number, fy: number) {
    await this.plotCanvas.scrollIntoViewIfNeeded();
    await expect(this.plotCanvas.locator('canvas')).toBeVisible();
    const box = (await this.plotCanvas.boundingBox())!;
    // Two moves: the readout follows pointer movement, one animation frame behind.
    await this.page.mouse.move(box.x + box.width * fx - 5, box.y + box.height * fy);
    await this.page.mouse.move(box.x + box.width * fx, box.y + box.height * fy, { steps: 3 });
    const dot = this.plotCanvas.locator('..').locator('div.rounded-full[aria-hidden="true"]');
    await expect(dot).toBeVisible();
    const d = (await dot.boundingBox())!;
    // The painted branch lines lie where the readout says the point is. Lines are ink (#0e3434,
    // green and blue above red even when anti-aliased into white); rules and the zero line are
    // warm greys (red above green), so the teal tint under the dot is the test.
    const canvas = this.plotCanvas.locator('canvas').first();
    const c = (await canvas.boundingBox())!;
    const tint = await canvas.evaluate(
      (el, [x, y]) => {
        const cv = el as HTMLCanvasElement;
        const r = cv.width / cv.clientWidth;
        const px = cv.getContext('2d')!.getImageData(Math.round(x * r) - 2, Math.round(y * r) - 2, 5, 5).data;
        let best = -255;
        for (let i = 0; i < px.length; i += 4) best = Math.max(best, px[i + 1] - px[i]);
        return best;
      },
      [d.x + d.width / 2 - c.x, d.y + d.height / 2 - c.y],
    );

    expect(tint, 'a drawn branch line under the readout cursor').toBeGreaterThan(12);
    await this.page.mouse.click(d.x + d.width / 2, d.y + d.height / 2);
    await expect(this.composer).toBeVisible();
  }

  thread(text: string) {
    return this.threads.getByTestId('thread').filter({ hasText: text });
  }

  async decide(verdict: 'approve' | 'return' | 'reject', note: string) {
    await this.decision.getByTestId(`verdict-${verdict}`).check();
    await this.decision.getByTestId('decision-note').fill(note);
    await this.decision.getByTestId('decision-submit').click();
  }
}
