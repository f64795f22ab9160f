import { expect, type Locator, type Page } from '@playwright/test';

export class MembersPage {
  readonly table: Locator;
  readonly inviteEmail: Locator;
  readonly inviteRole: Locator;
  readonly inviteSubmit: Locator;
  readonly inviteResult: Locator;

  constructor(private readonly page: Page) {
    this.table = page.getByTestId('members-table');
    this.inviteEmail = page.getByTestId('invite-email');
    this.inviteRole = page.getByTestId('invite-role');
    this.inviteSubmit = page.getByTestId('invite-submit');
    this.inviteResult = page.locator('main').getByTestId('invite-result');
  }

  async goto(slug: string) {
    await this.page.goto(`/groups/${slug}/members`);
    await expect(this.table).toBeVisible();
  }

  row(email: string) {
    return this.page.getByTestId(`member-${email}`);
  }

  async changeRole(email: string, role: string) {
    const row = this.row(email);
    await row.getByTestId('role-select').selectOption(role);
    await row.getByTestId('role-save').click();
    await expect(row.getByTestId('role-result')).toContainText(`is now ${role}`);
  }

  async remove(email: string) {
    const row = this.row(email);
    await row.getByTestId('remove-member').click();
    await row.getByTestId('confirm-remove').click();
    await expect(row).toHaveCount(0);
  }

  async invite(email: string, role: string) {
    await this.inviteEmail.fill(email);
    await this.inviteRole.selectOption(role);
    await this.inviteSubmit.click();
    await expect(this.inviteResult).toContainText(email);
  }
}
