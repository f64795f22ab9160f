import { expect, test } from '@playwright/test';
import { closeLab, seedLab, type Lab } from './support/lab';
import { SignInPage } from './pages/sign-in-page';
import { AccountPage } from './pages/account-page';

let lab: Lab;

test.beforeAll(async () => {
  lab = await seedLab('account');
});
test.afterAll(async () => {
  await closeLab();
});

test('a person renames themself; the header follows', async ({ page }) => {
  const account = new AccountPage(page);
  await new SignInPage(page).signIn(lab.people.submitter.email, lab.people.submitter.password);
  await account.goto();
  await account.saveName('Mira K. Okonjo');
  await expect(page.getByTestId('account-link')).toHaveText('Mira K. Okonjo');
});

test('a too-short new password is refused at the field, and nothing changes', async ({ page }) => {
  const person = lab.people.reviewer;
  const account = new AccountPage(page);
  await new SignInPage(page).signIn(person.email, person.password);
  await account.goto();
  await page.getByTestId('password-current').fill(person.password);
  await page.getByTestId('password-new').fill('short');
  await page.getByTestId('password-save').click();
  await expect(page.locator('#password-new-error')).toContainText('At least 10 characters');
  await expect(page.getByTestId('password-new')).toHaveAttribute('aria-invalid', 'true');

  // The old password still works.
  await page.context().clearCookies();
  await new SignInPage(page).signIn(person.email, person.password);
});

test('an API token is shown once, works against the API, and stops working when revoked', async ({ page, playwright, baseURL }) => {
  const account = new AccountPage(page);
  await new SignInPage(page).signIn(lab.people.observer.email, lab.people.observer.password);
  await account.goto();
  const secret = await account.createToken('e2e laptop', lab.group.slug);
  await expect(page.locator('main').getByTestId('token-created')).toContainText('only time it is shown');
  await expect(account.tokenRow('e2e laptop')).toBeVisible();

  // A fresh client with no cookies: the token alone.
  const api = await playwright.request.newContext({ baseURL, extraHTTPHeaders: { authorization: `Bearer ${secret}` } });
  const groups = await api.get('/api/v1/groups');
  expect(groups.status()).toBe(200);
  expect(JSON.stringify(await groups.json())).toContain(lab.group.slug);

  // After a reload the secret is gone for good.
  await page.reload();
  await expect(page.getByTestId('token-secret')).toHaveCount(0);
  await expect(page.getByText(secret)).toHaveCount(0);

  await account.revokeToken('e2e laptop');
  expect((await api.get('/api/v1/groups')).status()).toBe(401);
  await api.dispose();
});
