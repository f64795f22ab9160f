/**
 * Threads in the review workspace beyond points of the plot: @-mention suggestions in the thread
 * composer and the reply box (keyboard and mouse, the mention e-mail reaching the member), waivers
 * read from the screening JSON without a request per finding, and threads on the spectrum as a
 * whole while its file is still being screened or could not be read.
 */
import AxeBuilder from '@axe-core/playwright';
import { expect, test, type Page } from '@playwright/test';
import { Group, Revision, Spectrum, User } from '@/entities';
import { getEm } from '@/lib/db/orm';
import { waitForMailWithSubject } from './support/mail';
import { closeLab, seedLab, type Lab, type Person } from './support/lab';
import { SignInPage } from './pages/sign-in-page';
import { SpectraNewPage } from './pages/spectra-new-page';
import { modelBandFile } from './pages/spectra-files';
import { ReviewWorkspacePage } from './pages/review-workspace-page';

let lab: Lab;

test.beforeAll(async () => {
  lab = await seedLab('mentions');
});
test.afterAll(async () => {
  await closeLab();
});

async function as(page: Page, who: Person) {
  await page.context().clearCookies();
  await new SignInPage(page).signIn(who.email, who.password);
}

/** Uploads a band file as `who` through the new-spectrum form; returns the spectrum's id. */
async function upload(page: Page, who: Person, title: string, name: string, contents: Buffer | string): Promise<string> {
  await as(page, who);
  const form = new SpectraNewPage(page);
  await form.goto(lab.group.slug);
  await form.fill({ title, material: 'Invented rock-salt crystal (test)' });
  await form.chooseFile(name, contents);
  await form.submit.click();
  await expect(page).toHaveURL(/\/spectra\/[0-9a-f-]{36}$/, { timeout: 60_000 });
  return /\/spectra\/([0-9a-f-]{36})$/.exec(page.url())![1];
}


async function seriousViolations(page: Page) {
  const results = await new AxeBuilder({ page }).withTags(['wcag2a', 'wcag2aa', 'wcag21a', 'wcag21aa']).analyze();
  return results.violations
    .filter((v) => v.impact === 'serious' || v.impact === 'critical')
    .map((v) => ({ id: v.id, impact: v.impact, help: v.help, targets: v.nodes.map((n) => n.target.join(' ')) }));
}

/** Requests to the API that answered 404, and console errors, from now on. */
function watchNoise(page: Page) {
  const noise: string[] = [];
  page.on('response', (r) => {
    if (r.status() === 404 && new URL(r.url()).pathname.startsWith('/api/')) noise.push(`404 ${r.url()}`);
  });
  page.on('console', (m) => {
    if (m.type() === 'error') noise.push(`console: ${m.text()}`);
  });
  return noise;
}

test('a reviewer picks members after @ in a new thread and in a reply; both get the mention e-mail', async ({ page }) => {
  test.setTimeout(240_000);
  const since = new Date(Date.now() - 1000);
  const { submitter, reviewer, admin } = lab.people;
  const title = `Invented soft-mode crystal, mentions ${Date.now().toString(36)}`;
  const id = await upload(page, submitter, title, 'soft.txt', modelBandFile('cubic2', { defect: 'soft-mode' }));

  await as(page, reviewer);
  const noise = watchNoise(page);
  const waiverRequests: string[] = [];
  page.on('request', (r) => {
    if (r.method() === 'GET' && /\/api\/v1\/findings\/[^/]+\/waiver$/.test(new URL(r.url()).pathname)) waiverRequests.push(r.url());
  });
  const ws = new ReviewWorkspacePage(page);
  await ws.goto(lab.group.slug, id);
  await expect(ws.findings.getByTestId('findings-table')).toBeVisible({ timeout: 60_000 });

  // A waiver: its reason, author and time come with the screening JSON, after a reload too.
  const first = ws.findings.locator('[data-finding]').first();
  await first.getByTestId('finding-waive').click();
  await first.getByTestId('waive-reason').fill('A real soft mode of this invented crystal; kept on purpose.');
  await first.getByTestId('waive-submit').click();
  await expect(first).toHaveAttribute('data-waived', 'yes');
  await expect(first.getByTestId('waiver-reason')).toContainText(`Waived by ${reviewer.name}`);
  await page.reload();
  await expect(ws.findings.locator('[data-finding]').first().getByTestId('waiver-reason')).toContainText('kept on purpose');

  // A thread on the spectrum; "@" offers the other members (not the writer), by name and e-mail.
  await ws.threads.getByTestId('thread-new-spectrum').click();
  const composer = ws.threads.getByTestId('thread-composer');
  const body = composer.getByTestId('thread-body');
  await expect(body).toBeFocused();
  await body.pressSequentially('Which q-mesh was used, @');
  const options = composer.getByRole('listbox', { name: 'Members to mention' }).getByRole('option');
  await expect(options).toHaveCount(3);
  await expect(options.filter({ hasText: reviewer.name })).toHaveCount(0);
  await expect(options.filter({ hasText: submitter.name })).toContainText(submitter.email);

  // Axe with the suggestions open.
  expect.soft(await seriousViolations(page)).toEqual([]);

  // Arrow keys move through them (wrapping), the text keeps the focus and points at the active one.
  await expect(options).toHaveText([new RegExp(admin.name), new RegExp(submitter.name), new RegExp(lab.people.observer.name)]);
  const activeIs = async (i: number) => {
    await expect(options.nth(i)).toHaveAttribute('aria-selected', 'true');
    await expect(body).toHaveAttribute('aria-activedescendant', (await options.nth(i).getAttribute('id'))!);
  };
  await activeIs(0);
  await body.press('ArrowUp');
  await activeIs(2);
  await body.press('ArrowDown');
  await body.press('ArrowDown');
  await activeIs(1);
  await expect(body).toBeFocused();

  // Escape closes them for this @; a new @ filters as one types.
  await body.press('Escape');
  await expect(composer.getByTestId('mention-popup')).toHaveCount(0);
  await body.press('Backspace');
  await body.pressSequentially('@okon');
  await expect(options).toHaveText([new RegExp(submitter.name)]);
  await body.press('Enter');
  await expect(composer.getByTestId('mention-popup')).toHaveCount(0);
  const handle = submitter.email.split('@')[0];
  await expect(body).toHaveValue(`Which q-mesh was used, @${handle} `);
  await body.pressSequentially('and which supercell?');
  await composer.getByTestId('thread-submit').click();
  await expect(composer).toHaveCount(0);
  const thread = ws.thread('which supercell?');
  await expect(thread.getByTestId('thread-text')).toHaveText(`Which q-mesh was used, @${handle} and which supercell?`);
  await expect(thread.getByTestId('thread-anchor')).toContainText('On the spectrum');

  // The reply box: Tab picks, with the mouse pointer never used.
  const reply = thread.getByTestId('reply-body');
  await reply.click();
  await reply.pressSequentially('Asking @ilse');
  const replyOptions = thread.getByRole('option');
  await expect(replyOptions).toHaveText([new RegExp(admin.name)]);
  await reply.press('Tab');
  await expect(reply).toBeFocused();
  await reply.pressSequentially('too.');
  await expect(reply).toHaveValue(`Asking @${admin.email.split('@')[0]} too.`);
  await thread.getByTestId('reply-submit').click();
  await expect(thread.getByTestId('thread-replies')).toContainText(`@${admin.email.split('@')[0]} too.`);
  await expect(reply).toHaveValue('');

  // A click picks as well.
  await reply.pressSequentially('@okon');
  await replyOptions.filter({ hasText: submitter.name }).click();
  await expect(reply).toHaveValue(`@${handle} `);
  await expect(reply).toBeFocused();

  const m = await waitForMailWithSubject(submitter.email, `${reviewer.name} mentioned you on ${title}`, since);
  expect(m.text).toContain('which supercell?');
  const r = await waitForMailWithSubject(admin.email, `${reviewer.name} mentioned you on ${title}`, since);
  expect(r.text).toContain('too.');

  expect(waiverRequests).toEqual([]);
  expect(noise).toEqual([]);
});

test('a thread on the spectrum while its file could not be read; the submitter answers', async ({ page }) => {
  test.setTimeout(180_000);
  const since = new Date(Date.now() - 1000);
  const { submitter, reviewer } = lab.people;
  const title = `Invented crystal, unreadable file ${Date.now().toString(36)}`;
  const id = await upload(page, submitter, title, 'broken.txt', '# distance  freq\n0.0 1.0 2.0 3.0\n0.1 1.1 2.1\n');
  const ws = new ReviewWorkspacePage(page);
  await expect(ws.main.getByTestId('screening-error')).toBeVisible({ timeout: 60_000 });
  // The submitter cannot open threads.
  await expect(ws.main.getByTestId('thread-ask-file')).toHaveCount(0);
  await expect(ws.threads.getByTestId('thread-new-spectrum')).toHaveCount(0);

  await as(page, reviewer);
  const noise = watchNoise(page);
  await ws.goto(lab.group.slug, id);
  await expect(ws.main.getByTestId('screening-error')).toContainText('line 3');
  await ws.main.getByTestId('thread-ask-file').click();
  const composer = ws.threads.getByTestId('thread-composer');
  await expect(composer.getByTestId('composer-anchor')).toHaveText('On the spectrum as a whole');
  expect.soft(await seriousViolations(page)).toEqual([]);
  const body = composer.getByTestId('thread-body');
  await body.pressSequentially('Line 3 has one column too few. Which code wrote this file, @okon');
  await expect(composer.getByRole('option')).toHaveText([new RegExp(submitter.name)]);
  await body.press('Enter');
  await body.pressSequentially('?');
  await composer.getByTestId('thread-submit').click();
  const thread = ws.thread('Which code wrote this file');
  await expect(thread.getByTestId('thread-anchor')).toContainText('On the spectrum');
  await expect(thread.getByTestId('thread-revision')).toContainText('opened on revision 1');
  await waitForMailWithSubject(submitter.email, `${reviewer.name} mentioned you on ${title}`, since);
  expect(noise).toEqual([]);

  // The submitter answers in the thread on their own spectrum.
  await as(page, submitter);
  await ws.goto(lab.group.slug, id);
  await thread.getByTestId('reply-body').fill('An in-house script; a fixed file follows.');
  await thread.getByTestId('reply-submit').click();
  await expect(thread.getByTestId('thread-replies')).toContainText('a fixed file follows');
});

test('a thread on the spectrum while its file is still being screened', async ({ page }) => {
  // A screening that has not finished: the revision is pending and no worker has it yet.
  const em = await getEm();
  const group = await em.findOneOrFail(Group, { slug: lab.group.slug });
  const spectrum = em.create(Spectrum, {
    group,
    submitter: em.getReference(User, lab.people.submitter.userId),
    title: `Invented crystal, still screening ${Date.now().toString(36)}`,
    material: 'Invented rock-salt crystal (test)',
    status: 'screening',
    reviewerIds: [],
    revisionCount: 1,
    verdict: null,
  });
  const revision = em.create(Revision, {
    spectrum,
    number: 1,
    fileKey: `e2e-pending-${Date.now().toString(36)}`,
    ufsUrl: 'http://127.0.0.1:1/none',
    originalName: 'large-mesh.yaml',
    size: 1000,
    format: 'yaml',
    note: null,
    uploader: em.getReference(User, lab.people.submitter.userId),
    screeningStatus: 'pending',
    screeningError: null,
    verdict: null,
    summary: null,
    screenedAt: null,
  });
  await em.flush();
  spectrum.currentRevisionId = revision.id;
  await em.flush();

  await as(page, lab.people.reviewer);
  const ws = new ReviewWorkspacePage(page);
  await ws.goto(lab.group.slug, spectrum.id);
  await expect(ws.main.getByTestId('screening-pending')).toBeVisible();
  await expect(ws.threads).toContainText('Until screening has read the file');
  await ws.threads.getByTestId('thread-new-spectrum').click();
  const composer = ws.threads.getByTestId('thread-composer');
  await composer.getByTestId('thread-body').fill('This mesh is large; is the job still running?');
  await composer.getByTestId('thread-submit').click();
  await expect(ws.thread('is the job still running?').getByTestId('thread-anchor')).toContainText('On the spectrum');
  await expect(ws.main.getByTestId('screening-pending')).toBeVisible();
});
