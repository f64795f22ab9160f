import { expect, test } from '@playwright/test';
import { LINK_LIMITS } from '@/lib/auth/link-limits';
import { listMessages } from '@/lib/mail/mailbox';
import { closeLab, freshEmail, seedLab, type Lab } from './support/lab';
import { waitForMail } from './support/mail';
import { SignInPage } from './pages/sign-in-page';
import { Shell } from './pages/shell';

let lab: Lab;

test.beforeAll(async () => {
  lab = await seedLab('auth');
});
test.afterAll(async () => {
  await closeLab();
});

test('signs in with a password and lists my groups with my role', async ({ page }) => {
  const signIn = new SignInPage(page);
  const shell = new Shell(page);
  await signIn.signIn(lab.people.reviewer.email, lab.people.reviewer.password);
  await expect(page).toHaveURL('/');
  await shell.expectHomeWithGroup(lab.group.slug, 'reviewer');
  await expect(page.getByText(lab.otherGroup.name)).toHaveCount(0);
});

test('a wrong password and an unknown e-mail get the same message', async ({ page }) => {
  const signIn = new SignInPage(page);
  await signIn.goto();
  await signIn.signInWithPassword(lab.people.admin.email, 'not-the-password-at-all');
  await expect(signIn.error).toBeVisible();
  const wrongPassword = await signIn.error.innerText();

  await signIn.goto();
  await signIn.signInWithPassword(freshEmail('nobody'), 'not-the-password-at-all');
  await expect(signIn.error).toBeVisible();
  const unknownEmail = await signIn.error.innerText();

  expect(wrongPassword).toContain('E-mail or password is not right');
  expect(unknownEmail).toBe(wrongPassword);
  await expect(page).toHaveURL(/\/sign-in/);
});

test('empty fields are named, and nothing is sent', async ({ page }) => {
  const signIn = new SignInPage(page);
  await signIn.goto();
  await signIn.submit.click();
  await expect(page.locator('#signin-email-error')).toHaveText(/Enter your e-mail address/);
  await expect(signIn.email).toHaveAttribute('aria-invalid', 'true');
  await expect(signIn.email).toHaveAttribute('aria-describedby', /signin-email-error/);
  await expect(page.locator('#signin-password-error')).toHaveText(/Enter your password/);
});

test('signed-out visitors are sent to sign-in', async ({ page }) => {
  for (const path of ['/', '/account', `/groups/${lab.group.slug}`, `/groups/${lab.group.slug}/members`]) {
    await page.goto(path);
    await expect(page, `visiting ${path}`).toHaveURL(/\/sign-in/);
    await expect(page.getByTestId('signin-submit')).toBeVisible();
  }
});

test('after sign-in, a signed-out visitor comes back to the page they asked for', async ({ page }) => {
  // As from a link in an e-mail: the queue, filtered.
  const path = `/groups/${lab.group.slug}/spectra?mine=waiting`;
  await page.goto(path);
  await expect(page).toHaveURL(/\/sign-in\?callbackUrl=/);
  const signIn = new SignInPage(page);
  await signIn.signInWithPassword(lab.people.reviewer.email, lab.people.reviewer.password);
  await expect(page).toHaveURL(new RegExp(`${path.replace(/[?]/g, '\\?')}$`));
  await expect(page.locator('main').getByTestId('spectra-queue')).toBeVisible();
});

test('signs in with an e-mail link once; the same link is refused the second time', async ({ page }) => {
  test.slow(); // waits for mail delivery
  const signIn = new SignInPage(page);
  const shell = new Shell(page);
  const person = lab.people.observer;
  const since = new Date(Date.now() - 1000);

  await signIn.goto();
  await signIn.askForLink(person.email);
  const mail = await waitForMail(person.email, since);
  expect(mail.subject.length).toBeGreaterThan(0);

  await page.goto(mail.link);
  await shell.expectHomeWithGroup(lab.group.slug, 'observer');

  await shell.signOut();
  await page.goto(mail.link);
  await expect(page).toHaveURL(/\/sign-in/);
  await expect(signIn.notice).toContainText('This sign-in link has expired or was already used');
  await expect(page.getByTestId('sign-out')).toHaveCount(0);
});

test('past the link limit the form says so and no e-mail is sent', async ({ page }) => {
  test.slow();
  const signIn = new SignInPage(page);
  const email = freshEmail('many-links');
  for (let i = 0; i < LINK_LIMITS.perEmail; i++) {
    await signIn.goto();
    await signIn.askForLink(email);
  }
  await signIn.goto();
  await signIn.linkEmail.fill(email);
  await signIn.linkSubmit.click();
  await expect(signIn.linkError).toContainText('Too many sign-in links');
  await expect(signIn.linkError).toContainText('no e-mail was sent');
  await expect(page).toHaveURL(/\/sign-in$/);
  // Each answer comes after its mail was handed over, so nothing more can still arrive.
  const received = (await listMessages()).filter((m) => m.to.includes(email));
  expect(received).toHaveLength(LINK_LIMITS.perEmail);
});
