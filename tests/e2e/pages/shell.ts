import { expect, type Page } from '@playwright/test';

/** The signed-in frame: header, my groups on the home page, sign-out. */
export class Shell {
  constructor(private readonly page: Page) {}

  title() {
    return this.page.locator('main').getByTestId('page-title');
  }

  groupRow(slug: string) {
    return this.page.getByTestId(`group-${slug}`);
  }

  async expectHomeWithGroup(slug: string, role: string) {
    await expect(this.title()).toHaveText('My groups');
    await expect(this.groupRow(slug).getByTestId(`role-${role}`)).toBeVisible();
  }

  async signOut() {
    await this.page.getByTestId('sign-out').click();
    await expect(this.page).toHaveURL(/\/sign-in/);
  }

  async expectNotFound() {
    await expect(this.page.getByTestId('not-found')).toBeVisible();
  }
}
