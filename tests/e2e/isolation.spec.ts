import { expect, test } from '@playwright/test';
import { closeLab, seedLab, type Lab } from './support/lab';
import { SignInPage } from './pages/sign-in-page';
import { Shell } from './pages/shell';

let lab: Lab;

test.beforeAll(async () => {
  lab = await seedLab('isolation');
});
test.afterAll(async () => {
  await closeLab();
});

test("a member of another group gets 404 for this group's pages and API", async ({ page }) => {
  const shell = new Shell(page);
  await new SignInPage(page).signIn(lab.outsider.email, lab.outsider.password);

  for (const path of [`/groups/${lab.group.slug}`, `/groups/${lab.group.slug}/members`]) {
    const response = await page.goto(path);
    expect(response?.status(), path).toBe(404);
    await shell.expectNotFound();
    await expect(page.getByText(lab.group.name)).toHaveCount(0);
  }

  // The same answer as for a group that does not exist at all.
  const missing = await page.goto('/groups/no-such-group-anywhere');
  expect(missing?.status()).toBe(404);

  // The API (session cookie of this browser): the group is not listed and cannot be used.
  const groups = await page.request.get('/api/v1/groups');
  expect(groups.status()).toBe(200);
  expect(JSON.stringify(await groups.json())).not.toContain(lab.group.slug);

  const token = await page.request.post('/api/v1/tokens', {
    data: { group: lab.group.slug, name: 'should not exist' },
    headers: { origin: new URL(page.url()).origin },
  });
  expect(token.status()).toBe(404);
  const body = await token.json();
  expect(body.error.code).toBeTruthy();

  // Their own group still works.
  const own = await page.goto(`/groups/${lab.otherGroup.slug}`);
  expect(own?.status()).toBe(200);
});
