/**
 * Revision compare in the workspace. Revision 1 is the invented fcc crystal of lib/models;
 * revision 2 is the same crystal with a stiffer spring, so that every frequency rises by 1.2 %.
 * The reviewer picks the two revisions: the plot overlays them, and the table gives one row per
 * branch with the largest |Δω|, which the test computes from the same model data.
 */
import { expect, test } from '@playwright/test';
import type { Dispersion } from '@/lib/dispersion/types';
import { fccModel } from '@/lib/models/fcc';
import { pathDispersion } from '@/lib/models/model';
import { closeLab, seedLab, type Lab } from './support/lab';
import { createScreenedSpectrum, signInAs, uploadScreenedRevision } from './support/spectra';
import { bandFileOf } from './pages/spectra-files';
import { ReviewWorkspacePage } from './pages/review-workspace-page';
import { RevisionsPanel, WorkspacePlot } from './pages/review-panels';

let lab: Lab;

test.beforeAll(async () => {
  lab = await seedLab('compare');
});
test.afterAll(async () => {
  await closeLab();
});

// Harmonic springs: ω ∝ √k, so k' = 1.012² k raises every frequency by exactly 1.2 %.
const RISE = 1.012;
const K = 1.7; // eV/Å², the fcc model's default spring
const first = pathDispersion(fccModel({ k: K }));
const second = pathDispersion(fccModel({ k: K * RISE ** 2 }));

/** Per branch: the largest |ω_to − ω_from| over the (shared) q-points, THz. */
function largestDeviation(from: Dispersion, to: Dispersion): number[] {
  return Array.from({ length: from.nb }, (_, k) => {
    let m = 0;
    for (let i = 0; i < from.nq; i++) m = Math.max(m, Math.abs(to.frequencies[i * to.nb + k] - from.frequencies[i * from.nb + k]));
    return m;
  });
}

/** The continuity tolerance compare marks against, with the default policy (minDelta 0.05 THz, 1 % of the largest |ω|). */
function tolerance(a: Dispersion, b: Dispersion): number {
  let top = 0;
  for (const d of [a, b]) for (const f of d.frequencies) top = Math.max(top, Math.abs(f));
  return Math.max(0.05, 0.01 * top);
}

const THz = (text: string) => {
  const m = /(-?\d+\.\d+) THz/.exec(text);
  if (!m) throw new Error(`no THz value in "${text}"`);
  return Number(m[1]);
};

// The table shows |Δω| to 0.001 THz; the file and the store keep doubles, so the shown value is
// the computed one rounded: |shown − computed| ≤ 0.0005 THz.
const SHOWN = 0.0005;

test('two revisions compared: overlay on the plot, one row per branch with the largest deviation', async ({ page }) => {
  test.setTimeout(240_000);
  const { submitter, reviewer } = lab.people;
  const expected = largestDeviation(first, second);
  const tol = tolerance(first, second);
  // The change is small but not uniform across branches: the lowest branch stays under the
  // tolerance, the top one goes over it (so the table has both kinds of row).
  expect(expected[0]).toBeLessThan(tol);
  expect(expected[first.nb - 1]).toBeGreaterThan(tol);
  // Uniform scaling: the largest deviation of each branch is 1.2 % of its largest frequency.
  for (let k = 0; k < first.nb; k++) {
    let top = 0;
    for (let i = 0; i < first.nq; i++) top = Math.max(top, first.frequencies[i * first.nb + k]);
    expect(expected[k]).toBeCloseTo((RISE - 1) * top, 12);
  }

  await signInAs(page, submitter);
  const title = `Invented fcc crystal, stiffer spring ${Date.now().toString(36)}`;
  const id = await createScreenedSpectrum(page, lab.group.slug, { title, material: 'Invented fcc metal (test model)' }, { name: 'fcc.txt', contents: bandFileOf(first) });
  await uploadScreenedRevision(page, 2, { name: 'fcc-stiffer.txt', contents: bandFileOf(second) }, 'Spring constant raised by 2.4 %');

  await signInAs(page, reviewer);
  const ws = new ReviewWorkspacePage(page);
  await ws.goto(lab.group.slug, id);
  const plot = new WorkspacePlot(page);
  const revisions = new RevisionsPanel(page);
  await expect(plot.heading('Revision 2', { exact: true })).toBeVisible();
  await expect(plot.legend.getByRole('listitem').filter({ hasText: /^Revision \d/ })).toHaveCount(0);

  // Compare opens on the latest two; the reviewer picks them explicitly: from 1 to 2.
  await revisions.compareStart.click();
  await revisions.from.selectOption({ label: 'Revision 1' });
  await revisions.to.selectOption({ label: 'Revision 2' });

  // The plot says what it overlays: revision 2 solid, revision 1 dashed, named in the legend.
  await expect(plot.heading('Revision 2 against revision 1 (dashed)')).toBeVisible();
  await expect(plot.legend.getByRole('listitem').filter({ hasText: 'Revision 1' })).toBeVisible();
  await expect(plot.caption).toContainText(`3 branches at ${first.nq} q-points along Γ–X–W–K–Γ–L`);

  // Same sampling: every q-point compared, one row per branch.
  await expect(revisions.summary).toContainText(`Revision 1 → 2: ${first.nq} q-points, same q-points: compared point by point.`);
  await expect(revisions.rows).toHaveCount(first.nb);
  expect(THz((await revisions.summary.textContent())!)).toBeCloseTo(tol, 3);
  for (let k = 0; k < first.nb; k++) {
    const row = await revisions.row(k);
    expect(row.branch).toBe(k);
    expect(Math.abs(THz(row.deviation) - expected[k]), `branch ${k}: shown ${row.deviation}, computed ${expected[k]} THz`).toBeLessThanOrEqual(SHOWN);
    // Stiffer spring: every branch moved up.
    expect(row.direction).toBe('up');
    // The q-point named is one where the deviation is that largest one.
    const at = row.at;
    expect(Math.abs(second.frequencies[at * second.nb + k] - first.frequencies[at * first.nb + k])).toBeCloseTo(expected[k], 9);
    expect(row.over).toBe(expected[k] > tol ? 'yes' : 'no');
    if (row.over === 'yes') expect(row.deviation).toContain('above tolerance');
  }

  // Picked the other way round (from 2 to 1): the same sizes, now downwards, and the plot
  // draws revision 1 solid with revision 2 dashed.
  await revisions.from.selectOption({ label: 'Revision 2' });
  await expect(revisions.root.getByText('Choose two different revisions.')).toBeVisible();
  // One revision against itself is no compare: the plot claims no overlay meanwhile.
  await expect(plot.heading('Revision 2', { exact: true })).toBeVisible();
  await expect(plot.legend.getByRole('listitem').filter({ hasText: /^Revision \d/ })).toHaveCount(0);
  await revisions.to.selectOption({ label: 'Revision 1' });
  await expect(plot.heading('Revision 1 against revision 2 (dashed)')).toBeVisible();
  await expect(plot.legend.getByRole('listitem').filter({ hasText: 'Revision 2' })).toBeVisible();
  await expect(revisions.summary).toContainText('Revision 2 → 1');
  await expect(revisions.rows).toHaveCount(first.nb);
  for (let k = 0; k < first.nb; k++) {
    const row = await revisions.row(k);
    expect(Math.abs(THz(row.deviation) - expected[k])).toBeLessThanOrEqual(SHOWN);
    expect(row.direction).toBe('down');
  }

  // Ending the compare takes the overlay away again.
  await revisions.root.getByRole('button', { name: 'End compare' }).click();
  await expect(plot.heading('Revision 2', { exact: true })).toBeVisible();
  await expect(plot.legend.getByRole('listitem').filter({ hasText: /^Revision \d/ })).toHaveCount(0);
});
