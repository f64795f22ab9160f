/**
 * Reviewer assignment: an admin assigns a reviewer on one of two spectra; the reviewer gets the
 * review request by e-mail, follows its link, and finds that spectrum (and only that one) under
 * "Assigned to me" in the queue.
 */
import { expect, test } from '@playwright/test';
import { closeLab, seedLab, type Lab } from './support/lab';
import { waitForMailWithSubject } from './support/mail';
import { createScreenedSpectrum, signInAs } from './support/spectra';
import { modelBandFile } from './pages/spectra-files';
import { ReviewWorkspacePage } from './pages/review-workspace-page';
import { ReviewersPanel } from './pages/review-panels';
import { SpectraQueuePage } from './pages/spectra-queue-page';

let lab: Lab;

test.beforeAll(async () => {
  lab = await seedLab('assign');
});
test.afterAll(async () => {
  await closeLab();
});

test('an admin assigns a reviewer: the review request e-mail, and the spectrum under "Assigned to me"', async ({ page }) => {
  test.setTimeout(240_000);
  const { submitter, reviewer, admin } = lab.people;
  const tag = Date.now().toString(36);
  const assignedTitle = `Invented layer, assigned ${tag}`;
  const otherTitle = `Invented fcc crystal, left unassigned ${tag}`;

  await signInAs(page, submitter);
  const assignedId = await createScreenedSpectrum(page, lab.group.slug, { title: assignedTitle, material: 'Invented layered solid (test model)' }, { name: 'layer.txt', contents: modelBandFile('layer') });
  const otherId = await createScreenedSpectrum(page, lab.group.slug, { title: otherTitle, material: 'Invented fcc metal (test model)' }, { name: 'fcc.txt', contents: modelBandFile('fcc') });
  // The submitter sees who reviews, but may not change it.
  const reviewers = new ReviewersPanel(page);
  await expect(reviewers.root.getByText('Nobody assigned; any reviewer of the group may decide.')).toBeVisible();
  await expect(reviewers.assign).toHaveCount(0);

  // The admin assigns the group's reviewer. The submitter is never offered as their own reviewer.
  await signInAs(page, admin);
  const ws = new ReviewWorkspacePage(page);
  await ws.goto(lab.group.slug, assignedId);
  await expect(reviewers.root.getByText('Nobody assigned; any reviewer of the group may decide.')).toBeVisible();
  const since = new Date(Date.now() - 1000);
  await reviewers.assign.click();
  await expect(reviewers.candidate(reviewer.name)).toBeVisible();
  await expect(reviewers.candidate(admin.name)).toBeVisible();
  await expect(reviewers.candidate(submitter.name)).toHaveCount(0);
  await reviewers.candidate(reviewer.name).check();
  await reviewers.save.click();
  await expect(reviewers.save).toHaveCount(0);
  await expect(reviewers.assigned).toHaveCount(1);
  await expect(reviewers.assigned).toContainText(`${reviewer.name} ${reviewer.email}`);
  // Kept on the server, not only in the page.
  await page.reload();
  await expect(reviewers.assigned).toHaveText(`${reviewer.name} ${reviewer.email}`);

  // The review request reached the reviewer through the SMTP fake, with a link to the spectrum.
  const mail = await waitForMailWithSubject(reviewer.email, `Review requested: ${assignedTitle}`, since);
  expect(mail.text).toContain(`${admin.name} asked you to review “${assignedTitle}” (Invented layered solid (test model)) in ${lab.group.name}.`);
  const link = mail.text.match(/https?:\/\/\S+/)?.[0];
  expect(link).toBeDefined();
  expect(new URL(link!).pathname).toBe(`/groups/${lab.group.slug}/spectra/${assignedId}`);

  // The reviewer follows the link and finds themself assigned.
  await signInAs(page, reviewer);
  await page.goto(new URL(link!).pathname);
  await expect(ws.main.getByTestId('page-title')).toHaveText(assignedTitle);
  await expect(reviewers.assigned).toHaveText(`${reviewer.name} ${reviewer.email}`);
  await expect(reviewers.assign).toHaveCount(0);

  // In the queue, "Assigned to me" lists the assigned spectrum and not the other one.
  const queue = new SpectraQueuePage(page);
  await queue.goto(lab.group.slug);
  await expect(queue.row(assignedId)).toBeVisible();
  await expect(queue.row(otherId)).toBeVisible();
  await page.locator('main').getByLabel('Mine').selectOption({ label: 'Assigned to me' });
  await expect(page).toHaveURL(/[?&]mine=assigned(&|$)/);
  await expect(queue.row(otherId)).toHaveCount(0);
  await expect(queue.row(assignedId)).toBeVisible();
  await expect(queue.table.getByTestId('spectrum-link')).toHaveText([assignedTitle]);
  await expect(queue.row(assignedId).getByRole('cell', { name: reviewer.name, exact: true })).toBeVisible();

  // The filter is in the URL: a fresh visit shows the same list.
  await page.reload();
  await expect(queue.table.getByTestId('spectrum-link')).toHaveText([assignedTitle]);

  // The group overview counts the queue and leads to what waits on this reviewer.
  await page.goto(`/groups/${lab.group.slug}`);
  const overview = page.locator('main').getByTestId('spectra-panel');
  await expect(overview.getByTestId('summary-in-review')).toContainText('2');
  await overview.getByTestId('waiting-on-me').getByRole('link', { name: '2 spectra wait on your decision' }).click();
  await expect(page).toHaveURL(/[?&]mine=waiting(&|$)/);
  await expect(queue.row(assignedId)).toBeVisible();
  await expect(queue.row(otherId)).toBeVisible();
});
