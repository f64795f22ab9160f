/** Axe on the review screens: the spectrum workspace, the queue, the policy settings and the audit log. */
import { expect, test } from '@playwright/test';
import { seriousViolations } from './support/axe';
import { closeLab, seedLab, type Lab } from './support/lab';
import { SignInPage } from './pages/sign-in-page';
import { SpectraNewPage } from './pages/spectra-new-page';
import { modelBandFile } from './pages/spectra-files';
import { ReviewWorkspacePage } from './pages/review-workspace-page';

let lab: Lab;

test.beforeAll(async () => {
  lab = await seedLab('review-a11y');
});
test.afterAll(async () => {
  await closeLab();
});

test('spectrum workspace, queue, settings and audit log have no serious or critical violations', async ({ page }) => {
  test.setTimeout(240_000);
  const { submitter, admin } = lab.people;

  await new SignInPage(page).signIn(submitter.email, submitter.password);
  const form = new SpectraNewPage(page);
  await form.goto(lab.group.slug);
  await form.fill({ title: 'Invented soft-mode crystal (a11y)', material: 'Invented rock-salt crystal (test)' });
  await form.chooseFile('soft.txt', modelBandFile('cubic2', { defect: 'soft-mode' }));
  await form.submit.click();
  await expect(page).toHaveURL(/\/spectra\/[0-9a-f-]{36}$/, { timeout: 60_000 });
  const id = /\/spectra\/([0-9a-f-]{36})$/.exec(page.url())![1];

  await page.context().clearCookies();
  await new SignInPage(page).signIn(admin.email, admin.password);
  const ws = new ReviewWorkspacePage(page);
  await ws.goto(lab.group.slug, id);
  await expect(ws.findings.getByTestId('findings-table')).toBeVisible({ timeout: 60_000 });
  await expect(ws.threads.getByTestId('no-threads')).toBeVisible();
  // With the waiver form, the thread composer and the decision form open.
  await ws.findings.getByTestId('finding-waive').first().click();
  await ws.clickLineNear(0.5, 0.5);
  await expect(ws.main.getByTestId('decision-form')).toBeVisible();
  expect.soft(await seriousViolations(page)).toEqual([]);

  await page.goto(`/groups/${lab.group.slug}/spectra`);
  await expect(page.locator('main').getByTestId('spectra-table')).toBeVisible();
  expect.soft(await seriousViolations(page)).toEqual([]);

  await page.goto(`/groups/${lab.group.slug}/settings`);
  await expect(page.getByTestId('policy-form')).toBeVisible();
  expect.soft(await seriousViolations(page)).toEqual([]);

  await page.goto(`/groups/${lab.group.slug}/audit`);
  await expect(page.getByTestId('audit-log').locator('table')).toBeVisible();
  expect.soft(await seriousViolations(page)).toEqual([]);

  // An observer cannot open threads: the plot does not offer clicking or Enter to them.
  await page.context().clearCookies();
  await new SignInPage(page).signIn(lab.people.observer.email, lab.people.observer.password);
  await ws.goto(lab.group.slug, id);
  await expect(ws.plotCanvas).toBeVisible();
  await expect(ws.plotCanvas).not.toHaveAttribute('aria-label', /Enter/);
  await expect(ws.main.getByTestId('dispersion-plot')).not.toContainText('click a line');
  await expect(ws.main.getByTestId('dispersion-plot')).toContainText('drag pans');
  await expect(ws.threads).not.toContainText('Click a line of the plot');
});
