/**
 * The whole review story in a browser: a submitter uploads, screening flags, a reviewer opens a
 * blocking thread on a point of the plot and returns the spectrum, the submitter uploads a fix,
 * the reviewer resolves the thread and approves, the admin exports the review record, and the
 * e-mails reached the SMTP fake.
 */
import { expect, test, type Page } from '@playwright/test';
import { waitForMailWithSubject } from './support/mail';
import { closeLab, seedLab, type Lab, type Person } from './support/lab';
import { SignInPage } from './pages/sign-in-page';
import { Shell } from './pages/shell';
import { SpectraNewPage } from './pages/spectra-new-page';
import { modelBandFile } from './pages/spectra-files';
import { ReviewWorkspacePage } from './pages/review-workspace-page';

let lab: Lab;

test.beforeAll(async () => {
  lab = await seedLab('review');
});
test.afterAll(async () => {
  await closeLab();
});

async function as(page: Page, who: Person) {
  await page.context().clearCookies();
  await new SignInPage(page).signIn(who.email, who.password);
}


test('upload, flag, thread on a point, return, fix, resolve, approve, export, e-mails', async ({ page }) => {
  test.setTimeout(300_000);
  const since = new Date(Date.now() - 1000);
  const title = `Invented fcc crystal, sum-rule probe ${Date.now().toString(36)}`;
  const { submitter, reviewer, admin } = lab.people;

  // The submitter creates the spectrum with a file whose acoustic branches miss zero at Γ.
  await as(page, submitter);
  const form = new SpectraNewPage(page);
  await form.goto(lab.group.slug);
  await form.fill({ title, material: 'Invented fcc solid (test model)', formula: 'X', code: 'in-house model 1.0' });
  await form.chooseFile('fcc-sum-rule.txt', modelBandFile('fcc', { defect: 'sum-rule' }));
  await form.submit.click();
  await expect(page).toHaveURL(/\/spectra\/[0-9a-f-]{36}$/, { timeout: 60_000 });
  const id = /\/spectra\/([0-9a-f-]{36})$/.exec(page.url())![1];
  const ws = new ReviewWorkspacePage(page);

  // Screening flags it: the acoustic check fails; the submitter cannot decide or waive.
  await expect(ws.findings.getByTestId('finding-acoustic-gamma').first()).toBeVisible({ timeout: 60_000 });
  await expect(ws.status('in-review')).toBeVisible();
  await expect(ws.findings.getByTestId('finding-waive')).toHaveCount(0);
  await expect(ws.main.getByTestId('decision-form')).toHaveCount(0);

  // The reviewer clicks a line of the plot: a composer opens anchored at that point.
  await as(page, reviewer);
  await ws.goto(lab.group.slug, id);
  await expect(ws.plotCanvas).toBeVisible();
  await ws.clickLineNear(0.14, 0.8);
  await expect(ws.composer.getByTestId('composer-anchor')).toContainText(/q-point \d+, branch \d+ at -?[\d.]+ THz \(revision 1\)/);
  const anchorText = (await ws.composer.getByTestId('composer-anchor').textContent())!;
  await ws.composer.getByTestId('thread-body').fill(`The acoustic branch does not reach zero here, @${submitter.email}: impose the sum rule.`);
  await ws.composer.getByTestId('thread-blocking').check();
  await ws.composer.getByTestId('thread-submit').click();
  await expect(ws.composer).toHaveCount(0);
  const thread = ws.thread('impose the sum rule');
  await expect(thread).toHaveAttribute('data-blocking', 'yes');
  await expect(thread.getByTestId('thread-revision')).toContainText('opened on revision 1');
  const qpoint = /q-point (\d+), branch (\d+)/.exec(anchorText)!;
  await expect(thread.getByTestId('thread-anchor')).toContainText(`q-point ${qpoint[1]}, branch ${qpoint[2]}`);

  // The approval rule names what is missing; the reviewer returns the spectrum.
  await expect(ws.decision.getByTestId('approval-rule')).toContainText('1 approval');
  await expect(ws.decision.getByTestId('approval-progress')).toContainText('1 open blocking thread');
  await ws.decide('return', 'Please impose the acoustic sum rule and upload again.');
  await expect(ws.status('returned')).toBeVisible();
  await waitForMailWithSubject(submitter.email, `Decision on ${title}: returned for fixes`, since);
  const mention = await waitForMailWithSubject(submitter.email, `${reviewer.name} mentioned you on ${title}`, since);
  expect(mention.text).toContain('impose the sum rule');

  // The submitter uploads a fix.
  await as(page, submitter);
  await ws.goto(lab.group.slug, id);
  await ws.revisionUpload.getByTestId('band-file-input').setInputFiles({ name: 'fcc-fixed.txt', mimeType: 'text/plain', buffer: modelBandFile('fcc') });
  await ws.revisionUpload.getByTestId('revision-note').fill('Acoustic sum rule imposed');
  await ws.revisionUpload.getByTestId('upload-revision').click();
  await expect(ws.main.getByTestId('current-revision')).toHaveText('· revision 2', { timeout: 60_000 });
  await expect(ws.status('in-review')).toBeVisible({ timeout: 60_000 });

  // The reviewer finds it under "waiting on me" in the queue, with its open thread counted.
  await as(page, reviewer);
  await page.goto(`/groups/${lab.group.slug}/spectra`);
  await page.locator('main').getByTestId('queue-mine').selectOption('waiting');
  await expect(page).toHaveURL(/mine=waiting/);
  const row = page.getByTestId(`spectrum-row-${id}`);
  await expect(row.getByTestId('open-threads')).toHaveText('1 open');

  // On the page: the thread carried over; the reviewer resolves it and approves.
  await row.getByTestId('spectrum-link').click();
  await expect(ws.main.getByTestId('current-revision')).toHaveText('· revision 2');
  await expect(thread.getByTestId('thread-revision')).toContainText('opened on revision 1');
  await expect(thread.getByTestId('thread-moved')).toBeVisible();
  await expect(ws.main.getByTestId('revision-2')).toContainText('Acoustic sum rule imposed');
  await thread.getByTestId('thread-toggle-resolved').click();
  await expect(thread).toHaveAttribute('data-resolved', 'yes');
  await ws.decide('approve', 'Sum rule holds now; fine for the database.');
  await expect(ws.status('approved')).toBeVisible();
  await waitForMailWithSubject(submitter.email, `Approved: ${title}`, since);
  // Decided: no longer waiting on this reviewer.
  await page.goto(`/groups/${lab.group.slug}/spectra?mine=waiting`);
  await expect(page.locator('main').getByTestId('spectra-queue')).toBeVisible();
  await expect(page.getByTestId(`spectrum-row-${id}`)).toHaveCount(0);

  // The admin exports the approved spectrum's review record.
  await as(page, admin);
  await ws.goto(lab.group.slug, id);
  await expect(ws.exportPanel.getByTestId('export-record')).toBeVisible();
  const href = (await ws.exportPanel.getByTestId('export-record').getAttribute('href'))!;
  const record = await page.request.get(href);
  expect(record.status()).toBe(200);
  const html = await record.text();
  expect(html).toContain(title);
  expect(html).toContain('impose the sum rule');
  expect(html).toContain('Please impose the acoustic sum rule and upload again.');
  expect(html).toContain('Sum rule holds now; fine for the database.');
  expect(html).toMatch(/screening is an aid/i);
  const yaml = await page.request.get((await ws.exportPanel.getByTestId('export-yaml').getAttribute('href'))!);
  expect(yaml.status()).toBe(200);
  const yamlText = await yaml.text();
  expect(yamlText).toContain(`title: ${title}`);
  expect(yamlText).toContain('status: approved');
  expect(yamlText).toContain('revision: 2');
  // The plot as drawn, named like the other exports of this revision.
  const [png] = await Promise.all([page.waitForEvent('download'), ws.exportPanel.getByTestId('export-png').click()]);
  expect(png.suggestedFilename()).toMatch(/^Invented-fcc-crystal-sum-rule-probe-\w+-r2-plot\.png$/);

  await new Shell(page).signOut();
});
