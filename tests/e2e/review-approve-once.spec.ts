/**
 * A reviewer's approval that does not finish the review yet (a fail finding is still unwaived):
 * the form then stops offering a second approval, which the server would refuse, and says why.
 */
import { expect, test } from '@playwright/test';
import { closeLab, seedLab, type Lab } from './support/lab';
import { createScreenedSpectrum, signInAs } from './support/spectra';
import { modelBandFile } from './pages/spectra-files';
import { ReviewWorkspacePage } from './pages/review-workspace-page';

let lab: Lab;

test.beforeAll(async () => {
  lab = await seedLab('approve-once');
});
test.afterAll(async () => {
  await closeLab();
});

test('after approving, the reviewer is not offered a second approval of the same revision', async ({ page }) => {
  test.setTimeout(120_000);
  await signInAs(page, lab.people.submitter);
  const id = await createScreenedSpectrum(page, lab.group.slug, { title: `Invented fcc crystal, soft mode ${Date.now().toString(36)}`, material: 'Invented fcc metal (test model)' }, { name: 'soft.txt', contents: modelBandFile('fcc', { defect: 'soft-mode' }) });

  await signInAs(page, lab.people.reviewer);
  const ws = new ReviewWorkspacePage(page);
  await ws.goto(lab.group.slug, id);
  await expect(ws.findings.getByTestId('finding-imaginary-modes').first()).toBeVisible({ timeout: 60_000 });
  await ws.decide('approve', 'The soft mode is the point of this calculation.');
  await expect(ws.decision.getByTestId('decision')).toHaveCount(1);
  // Still in review: the fail finding is unwaived.
  await expect(ws.status('in-review')).toBeVisible();
  await expect(ws.decision.getByTestId('verdict-approve')).toBeDisabled();
  await expect(ws.decision.getByTestId('approved-by-me')).toHaveText('You approved this revision; your approval counts.');
  await expect(ws.decision.getByTestId('verdict-return')).toBeEnabled();
});
