import { expect, test } from '@playwright/test';
import { closeLab, freshEmail, seedLab, type Lab } from './support/lab';
import { waitForMail } from './support/mail';
import { SignInPage } from './pages/sign-in-page';
import { Shell } from './pages/shell';
import { MembersPage } from './pages/members-page';
import { InvitationPage } from './pages/invitation-page';

let lab: Lab;

test.beforeAll(async () => {
  lab = await seedLab('members');
});
test.afterAll(async () => {
  await closeLab();
});

test('an admin invites a new person, who accepts the link and signs in', async ({ page, browser }) => {
  test.slow(); // two browsers, mail delivery, several sign-ins
  const members = new MembersPage(page);
  const newcomer = { name: 'Aino Sorvali', email: freshEmail('aino'), password: 'a long enough passphrase' };

  await new SignInPage(page).signIn(lab.people.admin.email, lab.people.admin.password);
  await members.goto(lab.group.slug);
  const since = new Date(Date.now() - 1000);
  await members.invite(newcomer.email, 'submitter');
  await expect(page.getByTestId(`invitation-${newcomer.email}`)).toBeVisible();

  const mail = await waitForMail(newcomer.email, since);
  expect(mail.link).toContain('/invitations/');

  // The newcomer uses a browser of their own (no admin session).
  const context = await browser.newContext();
  const guest = await context.newPage();
  const invitation = new InvitationPage(guest);
  await invitation.open(mail.link);
  await invitation.expectInvited(lab.group.name, newcomer.email);
  await expect(guest.getByTestId('role-submitter')).toBeVisible();
  await invitation.accept(newcomer.name, newcomer.password);

  await expect(guest).toHaveURL(/\/sign-in\?accepted=1/);
  await expect(guest.locator('main').getByTestId('signin-accepted')).toBeVisible();
  await new SignInPage(guest).signInWithPassword(newcomer.email, newcomer.password);
  await new Shell(guest).expectHomeWithGroup(lab.group.slug, 'submitter');

  // The link works once.
  await invitation.open(mail.link);
  await expect(invitation.refusal()).toHaveAttribute('data-status', 'used');
  await context.close();

  // The admin sees the newcomer as a member and no longer as an open invitation.
  await members.goto(lab.group.slug);
  await expect(members.row(newcomer.email)).toBeVisible();
  await expect(page.getByTestId(`invitation-${newcomer.email}`)).toHaveCount(0);
});

test('an admin changes a role, and it holds after a reload', async ({ page }) => {
  const members = new MembersPage(page);
  const target = lab.people.submitter;
  await new SignInPage(page).signIn(lab.people.admin.email, lab.people.admin.password);
  await members.goto(lab.group.slug);
  await members.changeRole(target.email, 'reviewer');

  await page.reload();
  await expect(members.row(target.email).getByTestId('role-select')).toHaveValue('reviewer');
});

test('a non-admin sees the members read-only', async ({ page }) => {
  const members = new MembersPage(page);
  await new SignInPage(page).signIn(lab.people.observer.email, lab.people.observer.password);
  await members.goto(lab.group.slug);
  await expect(members.row(lab.people.admin.email).getByTestId('role-admin')).toBeVisible();
  await expect(page.getByTestId('role-select')).toHaveCount(0);
  await expect(page.getByTestId('remove-member')).toHaveCount(0);
  await expect(page.getByTestId('invite-form')).toHaveCount(0);
});

test('an unknown invitation link is refused clearly', async ({ page }) => {
  const invitation = new InvitationPage(page);
  await invitation.open('/invitations/this-token-was-never-issued-0000000000');
  await expect(invitation.refusal()).toHaveAttribute('data-status', 'unknown');
  await expect(page.locator('main [role=alert]')).toContainText('We do not recognise this invitation link');
});

test('an admin removes a member after confirming; the removed person then gets 404', async ({ page, browser }) => {
  test.slow();
  const members = new MembersPage(page);
  const leaver = lab.people.reviewer;
  await new SignInPage(page).signIn(lab.people.admin.email, lab.people.admin.password);
  await members.goto(lab.group.slug);

  // Cancelling the confirmation keeps the member.
  await members.row(leaver.email).getByTestId('remove-member').click();
  await members.row(leaver.email).getByRole('button', { name: 'Cancel' }).click();
  await expect(members.row(leaver.email)).toBeVisible();

  await members.remove(leaver.email);
  await page.reload();
  await expect(members.row(leaver.email)).toHaveCount(0);

  const context = await browser.newContext();
  const theirs = await context.newPage();
  await new SignInPage(theirs).signIn(leaver.email, leaver.password);
  const response = await theirs.goto(`/groups/${lab.group.slug}`);
  expect(response?.status()).toBe(404);
  await context.close();
});

test('on a phone-sized screen the members table scrolls inside its panel, not the whole page', async ({ page }) => {
  await page.setViewportSize({ width: 390, height: 844 });
  const members = new MembersPage(page);
  const target = lab.people.observer;
  await new SignInPage(page).signIn(lab.people.admin.email, lab.people.admin.password);
  await members.goto(lab.group.slug);
  await expect(members.row(target.email)).toBeVisible();
  expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(390);
  // The row's controls are reached by scrolling the table.
  await members.row(target.email).getByTestId('role-select').scrollIntoViewIfNeeded();
  await expect(members.row(target.email).getByTestId('role-select')).toBeInViewport();
});
