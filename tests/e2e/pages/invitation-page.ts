import { expect, type Page } from '@playwright/test';

export class InvitationPage {
  constructor(private readonly page: Page) {}

  async open(link: string) {
    await this.page.goto(link);
  }

  async expectInvited(groupName: string, email: string) {
    await expect(this.page.getByTestId('invitation-group')).toHaveText(groupName);
    await expect(this.page.getByTestId('invitation-email')).toHaveText(email);
  }

  async accept(name: string, password: string) {
    await this.page.getByTestId('accept-name').fill(name);
    await this.page.getByTestId('accept-password').fill(password);
    await this.page.getByTestId('accept-confirm').fill(password);
    await this.page.getByTestId('accept-submit').click();
  }

  refusal() {
    return this.page.getByTestId('invitation-refused');
  }
}
