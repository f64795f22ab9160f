/**
 * States a walkthrough found told wrong: a spectrum whose file did not parse stays `screening`
 * but must not claim to be checked, and a reopened spectrum's decisions list must show the
 * reopening above the rejection it undid.
 */
import AxeBuilder from '@axe-core/playwright';
import { expect, test, type Page } from '@playwright/test';
import { closeLab, seedLab, type Lab } from './support/lab';
import { createScreenedSpectrum, signInAs } from './support/spectra';
import { modelBandFile } from './pages/spectra-files';
import { ReviewWorkspacePage } from './pages/review-workspace-page';
import { SpectraNewPage } from './pages/spectra-new-page';
import { SpectraQueuePage } from './pages/spectra-queue-page';

let lab: Lab;

test.beforeAll(async () => {
  lab = await seedLab('states');
});
test.afterAll(async () => {
  await closeLab();
});

async function seriousViolations(page: Page) {
  const results = await new AxeBuilder({ page }).withTags(['wcag2a', 'wcag2aa', 'wcag21a', 'wcag21aa']).analyze();
  return results.violations.filter((v) => v.impact === 'serious' || v.impact === 'critical').map((v) => ({ id: v.id, targets: v.nodes.map((n) => n.target.join(' ')) }));
}

test('a file that did not parse: status screening with a "file not read" mark in the header, the decision panel and the queue', async ({ page }) => {
  test.setTimeout(120_000);
  const { submitter, reviewer } = lab.people;
  const title = `Invented crystal, file not read ${Date.now().toString(36)}`;
  await signInAs(page, submitter);
  const form = new SpectraNewPage(page);
  await form.goto(lab.group.slug);
  await form.fill({ title, material: 'Invented rock-salt crystal (test)' });
  await form.chooseFile('broken.txt', '# distance  freq\n0.0 1.0 2.0 3.0\n0.1 1.1 2.1\n');
  await form.submit.click();
  await expect(page).toHaveURL(/\/spectra\/[0-9a-f-]{36}$/, { timeout: 60_000 });
  const id = /\/spectra\/([0-9a-f-]{36})$/.exec(page.url())![1]!;
  const ws = new ReviewWorkspacePage(page);
  await expect(ws.main.getByTestId('screening-error')).toBeVisible({ timeout: 60_000 });

  // The header: still the status `screening`, with the mark (word and shape) and its help.
  const header = ws.main.getByTestId('page-title').locator('..');
  await expect(ws.status('screening')).toBeVisible();
  await expect(ws.status('screening')).not.toHaveAttribute('title', /being checked/);
  await expect(header.getByTestId('file-not-read')).toContainText('file not read');
  await expect(header.getByTestId('file-not-read')).toHaveAttribute('title', /upload a new revision/);
  await expect(header.getByTestId('file-not-read').locator('svg')).toHaveCount(1);
  // The decision panel says the same and what to do.
  await expect(ws.decision.getByTestId('file-not-read')).toBeVisible();
  await expect(ws.decision.getByTestId('decision-file-not-read')).toContainText('Upload a new revision');
  expect(await seriousViolations(page)).toEqual([]);

  // The queue: the row has the mark; the filter finds it and leaves out screened files.
  const other = await createScreenedSpectrum(page, lab.group.slug, { title: `Invented fcc crystal, read ${Date.now().toString(36)}`, material: 'Invented fcc metal (test)' }, { name: 'fcc.txt', contents: modelBandFile('fcc') });
  await signInAs(page, reviewer);
  const queue = new SpectraQueuePage(page);
  await queue.goto(lab.group.slug);
  await expect(queue.row(id).getByTestId('status-screening')).toBeVisible();
  await expect(queue.row(id).getByTestId('file-not-read')).toBeVisible();
  await expect(queue.row(other).getByTestId('file-not-read')).toHaveCount(0);
  await page.locator('main').getByTestId('queue-screening').selectOption('error');
  await expect(page).toHaveURL(/screening=error/);
  await expect(queue.row(id)).toBeVisible();
  await expect(queue.row(other)).toHaveCount(0);
  expect(await seriousViolations(page)).toEqual([]);

  // The group overview counts it apart from the spectra being screened, and links to the filter.
  await page.goto(`/groups/${lab.group.slug}`);
  const notRead = page.getByTestId('summary-file-not-read');
  await expect(notRead).toContainText('file not read');
  await expect(notRead).toContainText('1');
  await notRead.getByRole('link').click();
  await expect(page).toHaveURL(/status=screening/);
  await expect(page).toHaveURL(/screening=error/);
  await expect(queue.row(id)).toBeVisible();
  await expect(queue.row(other)).toHaveCount(0);

  // A new revision that reads takes the mark away.
  await signInAs(page, submitter);
  await ws.goto(lab.group.slug, id);
  await ws.revisionUpload.getByTestId('band-file-input').setInputFiles({ name: 'fcc.txt', mimeType: 'text/plain', buffer: modelBandFile('fcc') });
  await ws.revisionUpload.getByTestId('revision-note').fill('A file that reads');
  await ws.revisionUpload.getByTestId('upload-revision').click();
  await expect(ws.status('in-review')).toBeVisible({ timeout: 60_000 });
  await expect(ws.main.getByTestId('file-not-read')).toHaveCount(0);
});

test('after an admin reopens a rejected spectrum, the decisions list shows the reopening above the rejection', async ({ page }) => {
  test.setTimeout(120_000);
  const { submitter, reviewer, admin } = lab.people;
  await signInAs(page, submitter);
  const id = await createScreenedSpectrum(page, lab.group.slug, { title: `Invented fcc crystal, reopened ${Date.now().toString(36)}`, material: 'Invented fcc metal (test)' }, { name: 'fcc.txt', contents: modelBandFile('fcc') });
  const ws = new ReviewWorkspacePage(page);

  await signInAs(page, reviewer);
  await ws.goto(lab.group.slug, id);
  await ws.decide('reject', 'The structure is not the one named.');
  await expect(ws.status('rejected')).toBeVisible();

  await signInAs(page, admin);
  await ws.goto(lab.group.slug, id);
  await ws.decision.getByTestId('close-note').fill('The structure was checked again; look once more.');
  await ws.decision.getByTestId('reopen').click();
  await expect(ws.status('in-review')).toBeVisible();

  const entries = ws.decision.getByTestId('decisions').locator('li');
  await expect(entries).toHaveCount(2);
  await expect(entries.nth(0)).toHaveAttribute('data-testid', 'reopen-entry');
  await expect(entries.nth(0)).toContainText(admin.name);
  await expect(entries.nth(0)).toContainText('reopened it for review');
  await expect(entries.nth(0)).toContainText('The structure was checked again; look once more.');
  await expect(entries.nth(1)).toHaveAttribute('data-testid', 'decision');
  await expect(entries.nth(1)).toContainText('rejected');

  // Everyone reads the same history.
  await signInAs(page, submitter);
  await ws.goto(lab.group.slug, id);
  await expect(ws.decision.getByTestId('reopen-entry')).toContainText(admin.name);
});
