import { expect, test } from '@playwright/test';
import { seriousViolations } from './support/axe';
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

test('keyboard focus is drawn: the focused control gets the copper outline', async ({ page }) => {
  const signIn = new SignInPage(page);
  await signIn.goto();
  await signIn.email.focus();
  await page.keyboard.press('Tab');
  await expect(signIn.password).toBeFocused();
  const outline = await signIn.password.evaluate((e) => {
    const cs = getComputedStyle(e);
    return { style: cs.outlineStyle, width: cs.outlineWidth, color: cs.outlineColor };
  });
  expect(outline.style).toBe('solid');
  expect(outline.width).toBe('2px');
  // The ember tone, not the browser's default ring.
  expect(outline.color).toMatch(/^rgb\(192, 97, 44\)$/);
});
