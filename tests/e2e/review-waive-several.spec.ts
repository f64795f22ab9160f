/**
 * A real soft pocket: one imaginary-modes fail and ten continuity fails on branch 0 around it.
 * The reviewer selects them (the run shortcut, then one checkbox by keyboard), waives all with
 * one reason, and the verdict after waivers turns to pass; with the reviewer's approval already
 * given, the policy then approves the spectrum.
 */
import { expect, test } from '@playwright/test';
import { injectSoftMode, modelSpectrum } from '@/lib/models';
import { seriousViolations } from './support/axe';
import { closeLab, seedLab, type Lab } from './support/lab';
import { createScreenedSpectrum, signInAs } from './support/spectra';
import { bandFileOf } from './pages/spectra-files';
import { ReviewWorkspacePage } from './pages/review-workspace-page';

let lab: Lab;

test.beforeAll(async () => {
  lab = await seedLab('waive-several');
});
test.afterAll(async () => {
  await closeLab();
});

const REASON = 'The pocket is a real instability of the strained invented cell; the jumps around it are the pocket itself.';

test('a reviewer waives the soft pocket and its continuity run with one reason', async ({ page }) => {
  test.setTimeout(120_000);
  await signInAs(page, lab.people.submitter);
  const pocket = injectSoftMode(modelSpectrum('fcc', { points: 41 }), { index: 60, depthTHz: 1.4, widthPoints: 4 });
  const id = await createScreenedSpectrum(
    page,
    lab.group.slug,
    { title: `Invented fcc metal, strained ${Date.now().toString(36)}`, material: 'Invented fcc metal (test model)' },
    { name: 'pocket.txt', contents: bandFileOf(pocket) },
  );

  await signInAs(page, lab.people.reviewer);
  const ws = new ReviewWorkspacePage(page);
  await ws.goto(lab.group.slug, id);
  const continuity = ws.findings.getByTestId('finding-continuity');
  await expect(continuity).toHaveCount(10, { timeout: 60_000 });
  await expect(ws.findings.getByTestId('finding-imaginary-modes')).toHaveCount(1);
  const after = ws.findings.getByTestId('verdict-after-waivers');
  await expect(after.getByTestId('verdict-fail')).toBeVisible();

  await ws.decide('approve', 'The soft mode is the point of this calculation.');
  await expect(ws.decision.getByTestId('decision')).toHaveCount(1);
  await expect(ws.status('in-review')).toBeVisible();

  const selection = ws.findings.getByTestId('findings-selection');
  await expect(selection.getByTestId('waive-selected')).toBeDisabled();
  const run = selection.getByRole('button', { name: 'Select all 10 continuity on branch 0' });
  await run.click();
  await expect(run).toHaveAttribute('aria-pressed', 'true');
  await expect(selection.getByTestId('selected-count')).toHaveText('10 of 11 open findings selected');

  // The imaginary-modes finding by keyboard: focus its checkbox and press Space.
  const box = ws.findings.getByTestId('finding-imaginary-modes').getByRole('checkbox', { name: /Select imaginary-modes at .*branch 0/ });
  await box.focus();
  await page.keyboard.press('Space');
  await expect(box).toBeChecked();
  await expect(selection.getByTestId('selected-count')).toHaveText('11 of 11 open findings selected');

  await selection.getByRole('button', { name: 'Waive 11 selected…' }).click();
  const form = selection.getByTestId('waive-form');
  await expect(form.getByText('Why these 11 findings can be kept')).toBeVisible();
  expect(await seriousViolations(page)).toEqual([]);
  await form.getByTestId('waive-reason').fill(REASON);
  await form.getByRole('button', { name: 'Waive 11 findings' }).click();

  await expect(ws.findings.locator('[data-waived="yes"]')).toHaveCount(11);
  await expect(ws.findings.getByTestId('waiver-reason').filter({ hasText: REASON })).toHaveCount(11);
  await expect(after.getByTestId('verdict-pass')).toBeVisible();
  await expect(ws.findings.getByTestId('verdict-after-waivers').getByTestId('verdict-fail')).toHaveCount(0);
  // Nothing left to select; the policy approved the spectrum once nothing blocked it.
  await expect(ws.findings.getByTestId('findings-selection')).toHaveCount(0);
  await expect(ws.status('approved')).toBeVisible();
});
