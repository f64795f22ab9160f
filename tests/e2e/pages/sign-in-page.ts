import { expect, type Locator, type Page } from '@playwright/test';

export class SignInPage {
  readonly email: Locator;
  readonly password: Locator;
  readonly submit: Locator;
  readonly error: Locator;
  readonly notice: Locator;
  readonly linkEmail: Locator;
  readonly linkSubmit: Locator;
  readonly linkError: Locator;

  constructor(private readonly page: Page) {
    this.email = page.getByTestId('signin-email');
    this.password = page.getByTestId('signin-password');
    this.submit = page.getByTestId('signin-submit');
    // Scoped to main: Next's route announcer is also role=alert.
    this.error = page.locator('main').getByTestId('signin-error');
    this.notice = page.locator('main').getByTestId('signin-notice');
    this.linkEmail = page.getByTestId('link-email');
    this.linkSubmit = page.getByTestId('link-submit');
    this.linkError = page.locator('main').getByTestId('link-error');
  }

  async goto(query = '') {
    await this.page.goto(`/sign-in${query}`);
    await expect(this.submit).toBeVisible();
  }

  async signInWithPassword(email: string, password: string) {
    await this.email.fill(email);
    await this.password.fill(password);
    await this.submit.click();
  }

  /** Signs in and waits until the board is shown. */
  async signIn(email: string, password: string) {
    await this.goto();
    await this.signInWithPassword(email, password);
    await expect(this.page.getByTestId('sign-out')).toBeVisible();
  }

  async askForLink(email: string) {
    await this.linkEmail.fill(email);
    await this.linkSubmit.click();
    await expect(this.page.getByTestId('check-email')).toBeVisible();
  }
}
