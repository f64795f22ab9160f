import { expect, test, type APIRequestContext } from '@playwright/test';
import { closeLab, seedLab, type Lab } from './support/lab';
import { SignInPage } from './pages/sign-in-page';
import { SpectraQueuePage } from './pages/spectra-queue-page';
import { modelBandFile } from './pages/spectra-files';

let lab: Lab;

test.beforeAll(async () => {
  lab = await seedLab('queue');
});
test.afterAll(async () => {
  await closeLab();
});

// Invented spectra, created through the API the way a cluster script would.
const spectra = [
  { title: 'Cedar test lattice', material: 'Invented fcc metal C', file: () => modelBandFile('fcc'), verdict: 'pass' },
  { title: 'Ash reference lattice', material: 'Invented fcc metal A', file: () => modelBandFile('fcc', { defect: 'sum-rule' }), verdict: 'fail' },
  { title: 'Birch layered sheet', material: 'Invented layer B', file: () => modelBandFile('layer'), verdict: 'pass' },
];

async function createViaApi(request: APIRequestContext, group: string, s: (typeof spectra)[number]): Promise<string> {
  const res = await request.post('/api/v1/spectra', {
    multipart: {
      group,
      title: s.title,
      material: s.material,
      file: { name: `${s.title.split(' ')[0].toLowerCase()}.txt`, mimeType: 'text/plain', buffer: s.file() },
    },
  });
  expect(res.status(), await res.text()).toBe(201);
  return ((await res.json()) as { id: string }).id;
}

test('the queue sorts, filters and searches on the server and keeps it all in the URL', async ({ page }) => {
  test.setTimeout(120_000);
  await new SignInPage(page).signIn(lab.people.submitter.email, lab.people.submitter.password);
  const ids = [];
  for (const s of spectra) ids.push(await createViaApi(page.request, lab.group.slug, s));
  for (const id of ids) {
    await expect
      .poll(async () => ((await (await page.request.get(`/api/v1/spectra/${id}`)).json()) as { status: string }).status, { timeout: 60_000 })
      .toBe('in-review');
  }

  const queue = new SpectraQueuePage(page);
  await queue.goto(lab.group.slug);
  await expect(queue.table.getByTestId('spectrum-link')).toHaveCount(3);
  // A status badge keeps its words on one line, inside its box (the column is narrow).
  const badge = queue.row(ids[0]).getByTestId('status-in-review');
  const fit = await badge.evaluate((e) => ({ content: e.scrollHeight, box: e.clientHeight }));
  expect(fit.content).toBeLessThanOrEqual(fit.box);

  await queue.sortBy('title');
  await expect(page).toHaveURL(/[?&]sort=title(&|$)/);
  await expect(queue.header('title')).toHaveAttribute('aria-sort', 'ascending');
  await expect.poll(() => queue.titles()).toEqual(['Ash reference lattice', 'Birch layered sheet', 'Cedar test lattice']);

  await queue.sortBy('title');
  await expect(page).toHaveURL(/[?&]sort=-title(&|$)/);
  await expect(queue.header('title')).toHaveAttribute('aria-sort', 'descending');
  await expect.poll(() => queue.titles()).toEqual(['Cedar test lattice', 'Birch layered sheet', 'Ash reference lattice']);

  await queue.verdict.selectOption('fail');
  await expect(page).toHaveURL(/[?&]verdict=fail(&|$)/);
  await expect.poll(() => queue.titles()).toEqual(['Ash reference lattice']);
  await expect(queue.row(ids[1]).getByTestId('verdict-fail')).toBeVisible();

  await queue.verdict.selectOption({ label: 'Any verdict' });
  await expect(page).not.toHaveURL(/verdict=/);
  await queue.search.fill('birch');
  await expect(page).toHaveURL(/[?&]q=birch(&|$)/);
  await expect.poll(() => queue.titles()).toEqual(['Birch layered sheet']);

  // The URL alone restores the list: open it afresh.
  await queue.goto(lab.group.slug, '?status=in-review&sort=title&pageSize=10');
  await expect(queue.status).toHaveValue('in-review');
  await expect.poll(() => queue.titles()).toEqual(['Ash reference lattice', 'Birch layered sheet', 'Cedar test lattice']);
  await expect(page.getByTestId('queue-range')).toHaveText('1–3 of 3 spectra');

  await queue.status.selectOption('approved');
  await expect(page).toHaveURL(/[?&]status=approved(&|$)/);
  await expect(page.locator('main').getByTestId('queue-empty')).toContainText('No spectrum matches');
});
