/** The account page's notification settings: a choice per event, kept after a reload. */
import { expect, test } from '@playwright/test';
import { closeLab, seedLab, type Lab } from './support/lab';
import { SignInPage } from './pages/sign-in-page';

let lab: Lab;

test.beforeAll(async () => {
  lab = await seedLab('review-notify');
});
test.afterAll(async () => {
  await closeLab();
});

test('a reviewer turns decision e-mails off and mentions to the digest; the choice stays', async ({ page }) => {
  await new SignInPage(page).signIn(lab.people.reviewer.email, lab.people.reviewer.password);
  await page.goto('/account');
  const prefs = page.getByTestId('notification-preferences');
  // Defaults first: mentions at once.
  await expect(prefs.getByTestId('notify-mention-immediate')).toBeChecked();
  await prefs.getByTestId('notify-decision-off').check();
  await prefs.getByTestId('notify-mention-digest').check();
  await prefs.getByTestId('notification-save').click();
  await expect(prefs.getByTestId('notification-message')).toContainText('saved');

  await page.reload();
  await expect(prefs.getByTestId('notify-decision-off')).toBeChecked();
  await expect(prefs.getByTestId('notify-mention-digest')).toBeChecked();
  await expect(prefs.getByTestId('notify-thread-digest')).toBeChecked();
});
