/** The stored dispersion reads back bit for bit through the base64 path the plot, derived, compare and export reads use. */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { StoredDispersion } from '@/entities';
import { closeOrm, getEm } from '@/lib/db/orm';
import { loadSampled } from '@/lib/services/compare';
import { fromStoredColumns, loadStoredDispersion } from '@/lib/services/dispersion-store';
import { sampled } from '@/lib/review/sampling';
import { makeLab } from './helpers';
import { model, screenedSpectrum } from './review-fixtures';

let lab: Awaited<ReturnType<typeof makeLab>>;
beforeAll(async () => {
  lab = await makeLab('stored');
});
afterAll(closeOrm);

const same = (a: Float64Array | null, b: Float64Array | null) => {
  expect(a === null).toBe(b === null);
  if (!a || !b) return;
  expect(a.length).toBe(b.length);
  for (let i = 0; i < a.length; i++) if (!Object.is(a[i], b[i])) throw new Error(`differs at ${i}: ${a[i]} vs ${b[i]}`);
};

describe('loadStoredDispersion', () => {
  it('gives exactly the Float64 values the ORM reads, including awkward ones, and only the columns asked for', async () => {
    const d = model({ points: 30 });
    // Values whose text forms are easy to get wrong: signed zero, subnormal, extremes.
    d.frequencies.set([-0, 5e-324, 1e300, -Number.MIN_VALUE, 1 / 3], 0);
    const s = await screenedSpectrum(lab.group, lab.submitter, d);
    const em = await getEm();
    const loaded = (await loadStoredDispersion(em, s.revisionId))!;
    const row = await em.findOneOrFail(StoredDispersion, { revision: s.revisionId }, { populate: ['frequencies', 'q', 'distances', 'weights'] });
    const viaOrm = fromStoredColumns(row);
    same(loaded.frequencies, d.frequencies);
    same(loaded.frequencies, viaOrm.frequencies);
    same(loaded.q, viaOrm.q);
    same(loaded.distance, viaOrm.distance);
    same(loaded.weights, viaOrm.weights);
    expect({ ...loaded, frequencies: null, q: null, distance: null, weights: null }).toEqual({ ...viaOrm, frequencies: null, q: null, distance: null, weights: null });

    const plotOnly = (await loadStoredDispersion(em, s.revisionId, ['distances']))!;
    same(plotOnly.frequencies, d.frequencies);
    expect(plotOnly.q).toBeNull();
    same(plotOnly.distance, viaOrm.distance);
    expect(await loadStoredDispersion(em, '00000000-0000-4000-8000-000000000000')).toBeNull();
  });

  it('revision compare reads the same sampled revision as through the ORM', async () => {
    const d = model({ points: 25, defect: 'soft-mode' });
    const s = await screenedSpectrum(lab.group, lab.submitter, d);
    const em = await getEm();
    const row = await em.findOneOrFail(StoredDispersion, { revision: s.revisionId }, { populate: ['frequencies', 'q', 'distances'] });
    const viaOrm = sampled(fromStoredColumns(row));
    const loaded = (await loadSampled(em, s.revisionId))!;
    same(loaded.frequencies, viaOrm.frequencies);
    same(loaded.distance, viaOrm.distance);
    same(loaded.q, viaOrm.q);
    expect({ ...loaded, frequencies: null, distance: null, q: null }).toEqual({ ...viaOrm, frequencies: null, distance: null, q: null });
    expect(await loadSampled(em, '00000000-0000-4000-8000-000000000000')).toBeNull();
  });
});
