/**
 * The derived-quantities panel in the workspace, on spectra whose answers are known:
 * - a monatomic chain (band path Γ–X): the sound velocities of its acoustic branches against the
 *   long-wave limit of the chain, and measured points laid over the plot with their RMS deviation;
 * - an fcc mesh: the DOS and the harmonic thermodynamics, with the zero-point energy and the heat
 *   capacity at 300 K summed here over the same model data.
 */
import { expect, test } from '@playwright/test';
import { buildModelSpectrum } from '@/lib/models/cli';
import { monatomicChain } from '@/lib/models/chain';
import { pathDispersion } from '@/lib/models/model';
import { closeLab, seedLab, type Lab } from './support/lab';
import { createScreenedSpectrum, signInAs } from './support/spectra';
import { bandFileOf } from './pages/spectra-files';
import { ReviewWorkspacePage } from './pages/review-workspace-page';
import { DerivedPanel, WorkspacePlot } from './pages/review-panels';

let lab: Lab;

test.beforeAll(async () => {
  lab = await seedLab('derived');
});
test.afterAll(async () => {
  await closeLab();
});

// Exact SI constants (2019 SI), typed in rather than taken from the app's own units module.
const EV = 1.602176634e-19; // J
const AMU = 1.6605390666e-27; // kg (CODATA 2018)
const ANGSTROM = 1e-10; // m
const H = 6.62607015e-34; // J s
const KB = 1.380649e-23; // J/K
const NA = 6.02214076e23; // 1/mol
const CM1_PER_THZ = 1e12 / (100 * 299792458); // 10¹² Hz / (100 c): 33.356 cm⁻¹ per THz

const metresPerSecond = (text: string) => Number(text.replace(/,/g, ''));

test('chain along Γ–X: sound velocities of the acoustic branches, and measured points with their RMS deviation', async ({ page }) => {
  test.setTimeout(180_000);
  const model = monatomicChain();
  const chain = pathDispersion(model); // 41 q-points from Γ to X, as `npm run model -- chain` writes
  const { C, M, a, transverse: CT } = model.parameters as { C: number; M: number; a: number; transverse: number };
  // Long-wave limit of the monatomic chain with nearest-neighbour springs, ω = 2√(C/M)|sin(qa/2)|:
  // v = a√(C/M) (Kittel, Introduction to Solid State Physics, 8th ed., ch. 4). The chain's two
  // transverse branches follow the same law with the transverse spring C_T.
  const vL = a * ANGSTROM * Math.sqrt((C * EV) / (ANGSTROM * ANGSTROM) / (M * AMU));
  const vT = a * ANGSTROM * Math.sqrt((CT * EV) / (ANGSTROM * ANGSTROM) / (M * AMU));
  expect(vL).toBeCloseTo(9822.6948, 3); // physics-ref §2.1 (C = 1 eV/Å², M = 1 amu, a = 1 Å)

  await signInAs(page, lab.people.submitter);
  const id = await createScreenedSpectrum(page, lab.group.slug, { title: `Invented chain ${Date.now().toString(36)}`, material: 'Invented chain (test model)' }, { name: 'chain.txt', contents: bandFileOf(chain) });
  await signInAs(page, lab.people.reviewer);
  const ws = new ReviewWorkspacePage(page);
  await ws.goto(lab.group.slug, id);
  const derived = new DerivedPanel(page);

  // One row (Γ toward X), one column per acoustic branch: "fit / first point" in m/s.
  await expect(derived.soundTable).toBeVisible({ timeout: 30_000 });
  await expect(derived.soundTable.getByRole('columnheader')).toHaveText(['From Γ toward', /^Branch 0/, /^Branch 1/, /^Branch 2/]);
  const rows = derived.soundTable.locator('tbody tr');
  await expect(rows).toHaveCount(1);
  await expect(rows.first().getByRole('rowheader')).toHaveText('X');
  const cells = await rows.first().getByRole('cell').allInnerTexts();
  const velocities = cells.map((c) => {
    const m = /^([\d,]+) \/ ([\d,]+)$/.exec(c.trim());
    if (!m) throw new Error(`not "fit / first point" in m/s: "${c}"`);
    return { fit: metresPerSecond(m[1]), first: metresPerSecond(m[2]) };
  });
  // Branches are sorted by frequency: two transverse, then the longitudinal one. The fit over the
  // first 5 % of Γ–X and the central difference at the first point off Γ both span the first two
  // steps (qa up to π/20), where the sine law lies below its tangent at Γ by about
  // (qa)²/24 ≈ 0.1 %: within 0.5 % of the long-wave limit.
  const analytic = [vT, vT, vL];
  velocities.forEach((v, k) => {
    expect(Math.abs(v.fit - analytic[k]) / analytic[k], `branch ${k} fit ${v.fit} m/s vs ${analytic[k].toFixed(1)}`).toBeLessThan(0.005);
    expect(Math.abs(v.first - analytic[k]) / analytic[k], `branch ${k} first point ${v.first} m/s vs ${analytic[k].toFixed(1)}`).toBeLessThan(0.005);
  });
  // A band path has no DOS; the panel says why instead of drawing one.
  await expect(derived.dosChart).toHaveCount(0);
  await expect(derived.root.getByText('The DOS and thermodynamics need a q-point mesh; this revision is a band path.')).toBeVisible();

  // Measured points (by q-point index, in THz) near the longitudinal branch, off by known amounts;
  // one index beyond the path is not counted.
  const offsets = [
    { index: 10, delta: 0.1 },
    { index: 20, delta: -0.2 },
    { index: 30, delta: 0.2 },
  ];
  const top = chain.nb - 1;
  const points = offsets.map(({ index, delta }) => ({ index, f: chain.frequencies[index * chain.nb + top] + delta }));
  // RMS of the distance to the nearest branch at each point (here the longitudinal one).
  const nearest = points.map(({ index, f }) => Math.min(...Array.from({ length: chain.nb }, (_, k) => Math.abs(f - chain.frequencies[index * chain.nb + k]))));
  const rms = Math.sqrt(nearest.reduce((s, x) => s + x * x, 0) / nearest.length);
  expect(rms).toBeCloseTo(Math.sqrt((0.01 + 0.04 + 0.04) / 3), 9);

  // A bad line is named first, and nothing is laid over the plot.
  await derived.measuredFile.setInputFiles({ name: 'bad.csv', mimeType: 'text/csv', buffer: Buffer.from('index, frequency\n10, 12.5\n20, twelve\n') });
  await expect(derived.measuredError).toContainText('bad.csv, Line 3: "twelve" in column 2 is not a number.');
  await expect(derived.measuredRms).toHaveCount(0);
  const plot = new WorkspacePlot(page);
  await expect(plot.legend.getByRole('listitem').filter({ hasText: 'Measured' })).toHaveCount(0);

  const csv = ['index, frequency (THz)', ...points.map((p) => `${p.index}, ${p.f}`), `${chain.nq + 5}, 10`].join('\n');
  await derived.measuredUnit.selectOption('THz');
  await derived.measuredFile.setInputFiles({ name: 'measured.csv', mimeType: 'text/csv', buffer: Buffer.from(csv) });
  await expect(derived.measuredError).toHaveCount(0);
  await expect(derived.measuredRms).toContainText(`measured.csv: 3 points on the path, RMS deviation from the nearest branch ${rms.toFixed(3)} THz (1 outside the path, not counted).`);
  await expect(plot.legend.getByRole('listitem').filter({ hasText: 'Measured' })).toBeVisible();

  // The same numbers declared as cm⁻¹ are 33 times lower frequencies: the deviation follows the
  // unit chosen for the file (and is shown in the page's unit, THz).
  const nearestAsCm = points.map(({ index, f }) => Math.min(...Array.from({ length: chain.nb }, (_, k) => Math.abs(f / CM1_PER_THZ - chain.frequencies[index * chain.nb + k]))));
  const rmsAsCm = Math.sqrt(nearestAsCm.reduce((s, x) => s + x * x, 0) / nearestAsCm.length);
  await derived.measuredUnit.selectOption('cm-1');
  await derived.measuredFile.setInputFiles({ name: 'measured-cm.csv', mimeType: 'text/csv', buffer: Buffer.from(csv) });
  await expect(derived.measuredRms).toContainText(`measured-cm.csv: 3 points on the path, RMS deviation from the nearest branch ${rmsAsCm.toFixed(3)} THz`);

  await derived.root.getByRole('button', { name: 'Remove overlay' }).click();
  await expect(derived.measuredRms).toHaveCount(0);
  await expect(plot.legend.getByRole('listitem').filter({ hasText: 'Measured' })).toHaveCount(0);
});

test('fcc mesh: DOS, heat capacity, entropy and free energy plots, with the zero-point energy and C_V at 300 K', async ({ page }) => {
  test.setTimeout(180_000);
  const mesh = buildModelSpectrum({ model: 'fcc-mesh', points: 8, polar: false }); // 8×8×8 Γ-centred mesh
  expect(mesh.kind).toBe('mesh');

  // Harmonic crystal, per mode of frequency ν with x = hν/k_BT: zero-point energy hν/2 and
  // C_V = k_B x² eˣ/(eˣ − 1)² (Ashcroft & Mermin, Solid State Physics, ch. 23), averaged over the
  // mesh with its weights, per mole of cells. Modes at |ν| ≤ 10⁻³ THz (the acoustic ones at Γ) give
  // no zero-point energy and their classical limit k_B to C_V.
  const T = 300;
  let wsum = 0;
  let zpe = 0;
  let cv = 0;
  for (let i = 0; i < mesh.nq; i++) {
    const w = mesh.weights ? mesh.weights[i] : 1;
    wsum += w;
    for (let k = 0; k < mesh.nb; k++) {
      const nu = mesh.frequencies[i * mesh.nb + k] * 1e12;
      if (Math.abs(nu) <= 1e9) {
        cv += w * KB;
        continue;
      }
      const x = (H * nu) / (KB * T);
      zpe += w * ((H * nu) / 2);
      cv += w * KB * ((x * x * Math.exp(x)) / Math.expm1(x) ** 2);
    }
  }
  const zpeKJ = ((zpe / wsum) * NA) / 1000;
  const cv300 = (cv / wsum) * NA;
  // Plausible for an fcc metal at 300 K: a little under the Dulong–Petit 3R of one atom per cell.
  expect(cv300 / (3 * KB * NA)).toBeGreaterThan(0.9);
  expect(cv300 / (3 * KB * NA)).toBeLessThan(1);

  await signInAs(page, lab.people.submitter);
  const id = await createScreenedSpectrum(page, lab.group.slug, { title: `Invented fcc mesh ${Date.now().toString(36)}`, material: 'Invented fcc metal (test model)' }, { name: 'fcc-mesh.txt', contents: bandFileOf(mesh) });
  await signInAs(page, lab.people.reviewer);
  const ws = new ReviewWorkspacePage(page);
  await ws.goto(lab.group.slug, id);
  const derived = new DerivedPanel(page);

  // The three plots are drawn (each a chart with a canvas), and the facts beside them.
  for (const chart of [derived.dosChart, derived.heatChart, derived.freeEnergyChart]) {
    await expect(chart).toBeVisible({ timeout: 30_000 });
    await expect(chart.locator('canvas').first()).toBeVisible();
  }
  await expect(derived.root.getByRole('heading', { name: /^Density of states \(Gaussian σ = [\d.]+ THz\)$/ })).toBeVisible();
  await expect(derived.root.getByRole('heading', { name: 'Heat capacity C_V and entropy S, J/(mol·K) per mole of cells' })).toBeVisible();
  await expect(derived.root.getByRole('heading', { name: 'Helmholtz free energy F, kJ/mol per mole of cells' })).toBeVisible();
  await expect(derived.fact('Atoms per cell')).toHaveText('1');

  // Shown to 0.001 kJ/mol and 0.01 J/(mol·K): the shown values are the sums above, rounded
  // (|shown − computed| ≤ half the last digit).
  const shownZpe = Number(/^([\d.]+) kJ\/mol per mole of cells$/.exec((await derived.zeroPoint.innerText()).trim())![1]);
  expect(Math.abs(shownZpe - zpeKJ), `zero-point energy shown ${shownZpe}, computed ${zpeKJ} kJ/mol`).toBeLessThanOrEqual(0.0005);
  const shownCv = Number(/^([\d.]+) J\/\(mol·K\)$/.exec((await derived.fact('C_V at 300 K').innerText()).trim())![1]);
  expect(Math.abs(shownCv - cv300), `C_V(300 K) shown ${shownCv}, computed ${cv300} J/(mol·K)`).toBeLessThanOrEqual(0.005);

  // A mesh has no path through Γ to fit sound velocities on; the panel says so.
  await expect(derived.soundTable).toHaveCount(0);
  await expect(derived.root.getByText('Sound velocities need a band path through Γ; this revision is a mesh.')).toBeVisible();
});
