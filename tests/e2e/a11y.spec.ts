import AxeBuilder from '@axe-core/playwright';
import { expect, test, type Page } from '@playwright/test';
import { closeLab, seedLab, type Lab } from './support/lab';
import { SignInPage } from './pages/sign-in-page';
import { MembersPage } from './pages/members-page';

let lab: Lab;

test.beforeAll(async () => {
  lab = await seedLab('a11y');
});
test.afterAll(async () => {
  await closeLab();
});

async function seriousViolations(page: Page) {
  const results = await new AxeBuilder({ page }).withTags(['wcag2a', 'wcag2aa', 'wcag21a', 'wcag21aa']).analyze();
  return results.violations
    .filter((v) => v.impact === 'serious' || v.impact === 'critical')
    .map((v) => ({ id: v.id, impact: v.impact, help: v.help, targets: v.nodes.map((n) => n.target.join(' ')) }));
}

test('sign-in has no serious or critical accessibility violations', async ({ page }) => {
  const signIn = new SignInPage(page);
  await signIn.goto('?error=Verification');
  expect(await seriousViolations(page)).toEqual([]);
  // With field errors shown too.
  await signIn.submit.click();
  await expect(page.locator('#signin-email-error')).toBeVisible();
  expect(await seriousViolations(page)).toEqual([]);
});

test('home and members (admin view) have no serious or critical accessibility violations', async ({ page }) => {
  await new SignInPage(page).signIn(lab.people.admin.email, lab.people.admin.password);
  await expect(page.getByTestId(`group-${lab.group.slug}`)).toBeVisible();
  expect(await seriousViolations(page)).toEqual([]);

  await new MembersPage(page).goto(lab.group.slug);
  expect(await seriousViolations(page)).toEqual([]);
});
