import { expect, type Page } from '@playwright/test';

export class AccountPage {
  constructor(private readonly page: Page) {}

  async goto() {
    await this.page.goto('/account');
    await expect(this.page.getByTestId('profile-form')).toBeVisible();
  }

  async saveName(name: string) {
    await this.page.getByTestId('profile-name').fill(name);
    await this.page.getByTestId('profile-save').click();
    await expect(this.page.locator('main').getByTestId('profile-result')).toContainText('Name saved');
  }

  async createToken(name: string, groupSlug: string): Promise<string> {
    await this.page.getByTestId('token-name').fill(name);
    await this.page.getByTestId('token-group').selectOption(groupSlug);
    await this.page.getByTestId('token-create').click();
    const secret = this.page.getByTestId('token-secret');
    await expect(secret).toBeVisible();
    return (await secret.innerText()).trim();
  }

  tokenRow(name: string) {
    return this.page.getByTestId(`token-${name}`);
  }

  async revokeToken(name: string) {
    const row = this.tokenRow(name);
    await row.getByTestId('revoke-token').click();
    await row.getByTestId('confirm-revoke-token').click();
    await expect(row.getByText('revoked')).toBeVisible();
  }
}
