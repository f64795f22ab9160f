/**
 * Steps the review browser tests share: sign in as someone, create a spectrum through the
 * new-spectrum form, upload a further revision in the workspace, each waiting until screening
 * has put the spectrum in review (what a person would wait for before looking further).
 */
import { expect, type Page } from '@playwright/test';
import type { Person } from './lab';
import { SignInPage } from '../pages/sign-in-page';
import { SpectraNewPage } from '../pages/spectra-new-page';
import { ReviewWorkspacePage } from '../pages/review-workspace-page';

export interface BandFile {
  name: string;
  contents: Buffer;
}

export async function signInAs(page: Page, who: Person) {
  await page.context().clearCookies();
  await new SignInPage(page).signIn(who.email, who.password);
}

/** Creates the spectrum in the form and waits for its screening; returns its id. */
export async function createScreenedSpectrum(page: Page, slug: string, meta: { title: string; material: string }, file: BandFile): Promise<string> {
  const form = new SpectraNewPage(page);
  await form.goto(slug);
  await form.fill(meta);
  await form.chooseFile(file.name, file.contents);
  await form.submit.click();
  await expect(page).toHaveURL(/\/spectra\/[0-9a-f-]{36}$/, { timeout: 60_000 });
  await expect(new ReviewWorkspacePage(page).status('in-review')).toBeVisible({ timeout: 60_000 });
  return /\/spectra\/([0-9a-f-]{36})$/.exec(page.url())![1];
}

/** On the open workspace: uploads revision `number` and waits until it is screened and in review. */
export async function uploadScreenedRevision(page: Page, number: number, file: BandFile, note: string) {
  const ws = new ReviewWorkspacePage(page);
  await ws.revisionUpload.getByTestId('band-file-input').setInputFiles({ name: file.name, mimeType: 'text/plain', buffer: file.contents });
  await ws.revisionUpload.getByTestId('revision-note').fill(note);
  await ws.revisionUpload.getByTestId('upload-revision').click();
  await expect(ws.main.getByTestId('current-revision')).toHaveText(`· revision ${number}`, { timeout: 60_000 });
  await expect(ws.status('in-review')).toBeVisible({ timeout: 60_000 });
  // The revisions panel has the new verdict too (compare offers only screened revisions).
  await expect(ws.main.getByTestId(`revision-${number}`).getByTestId(/^verdict-(pass|warn|fail)$/)).toBeVisible({ timeout: 60_000 });
}
