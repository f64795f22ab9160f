/**
 * Withdrawing is final, so the submitter confirms it: the first click only asks, "Don't
 * withdraw" changes nothing, and the confirmation withdraws.
 */
import { expect, test } from '@playwright/test';
import { closeLab, seedLab, type Lab } from './support/lab';
import { createScreenedSpectrum, signInAs } from './support/spectra';
import { modelBandFile } from './pages/spectra-files';
import { ReviewWorkspacePage } from './pages/review-workspace-page';

let lab: Lab;

test.beforeAll(async () => {
  lab = await seedLab('withdraw');
});
test.afterAll(async () => {
  await closeLab();
});

test('the submitter confirms before a spectrum is withdrawn', async ({ page }) => {
  test.setTimeout(120_000);
  await signInAs(page, lab.people.submitter);
  await createScreenedSpectrum(page, lab.group.slug, { title: `Invented fcc crystal, withdrawn ${Date.now().toString(36)}`, material: 'Invented fcc metal (test model)' }, { name: 'fcc.txt', contents: modelBandFile('fcc') });
  const ws = new ReviewWorkspacePage(page);
  const panel = ws.decision;

  await panel.getByTestId('withdraw').click();
  await expect(panel.getByTestId('withdraw-confirm')).toContainText('nobody can reopen');
  await expect(panel.getByTestId('withdraw-confirm-yes')).toBeFocused();
  await panel.getByTestId('withdraw-confirm-no').click();
  await expect(panel.getByTestId('withdraw-confirm')).toHaveCount(0);
  await expect(ws.status('in-review')).toBeVisible();

  await panel.getByTestId('close-note').fill('Superseded by a larger supercell.');
  await panel.getByTestId('withdraw').click();
  await panel.getByTestId('withdraw-confirm-yes').click();
  await expect(ws.status('withdrawn')).toBeVisible();
  await expect(panel.getByTestId('withdraw')).toHaveCount(0);
});
