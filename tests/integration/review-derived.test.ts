/**
 * GET /api/v1/revisions/{id}/derived: sound velocities near Γ for a path, DOS and
 * thermodynamics for a mesh, and who may read it.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import * as derived from '@/app/api/v1/revisions/[id]/derived/route';
import { closeOrm, getEm } from '@/lib/db/orm';
import { buildModelSpectrum } from '@/lib/models/cli';
import { addMember, makeGroup, makeLab, makeUser, type TestUser } from './helpers';
import { call, model, screenedSpectrum } from './review-fixtures';

let lab: Awaited<ReturnType<typeof makeLab>>;
let outsider: TestUser;

beforeAll(async () => {
  lab = await makeLab('derived');
  const em = await getEm();
  outsider = await makeUser(em, 'outsider');
  await addMember(em, outsider, await makeGroup(em, 'elsewhere'), 'admin');
});
afterAll(async () => {
  await closeOrm();
});

const get = (who: TestUser | null, id: string) => call(derived.GET, who, { path: `/api/v1/revisions/${id}/derived`, params: { id } });

describe('derived quantities', () => {
  it('a band path through Γ gives one positive sound velocity per acoustic branch, and no DOS', async () => {
    const s = await screenedSpectrum(lab.group, lab.submitter, model({ points: 30 }));
    const res = await get(lab.observer, s.revisionId);
    expect(res.status).toBe(200);
    expect(res.body.kind).toBe('path');
    expect(res.body.acoustic).toBe(3);
    expect(res.body.sound.length).toBeGreaterThan(0);
    for (const s of res.body.sound) {
      expect(s.velocities).toHaveLength(3);
      for (const v of s.velocities) expect(v).toBeGreaterThan(0);
      // The slope fit and the first-point group velocity describe the same linear part near Γ.
      for (let k = 0; k < 3; k++) expect(Math.abs(s.groupNearGamma[k] - s.velocities[k]) / s.velocities[k]).toBeLessThan(0.2);
    }
    expect(res.body.dos).toBeNull();
    expect(res.body.thermo).toBeNull();
  });

  it('a mesh gives a DOS holding every branch and a heat capacity near the Dulong–Petit limit at 1000 K', async () => {
    const mesh = buildModelSpectrum({ model: 'fcc-mesh', points: 8, polar: false });
    const s = await screenedSpectrum(lab.group, lab.submitter, mesh);
    const res = await get(lab.reviewer, s.revisionId);
    expect(res.status).toBe(200);
    expect(res.body.kind).toBe('mesh');
    const { frequencies, values } = res.body.dos;
    let area = 0;
    for (let i = 1; i < frequencies.length; i++) area += ((values[i] + values[i - 1]) / 2) * (frequencies[i] - frequencies[i - 1]);
    expect(area).toBeCloseTo(mesh.nb, 1);
    const t = res.body.thermo;
    const i1000 = t.temperatures.indexOf(1000);
    // Dulong–Petit: C_V → 3R per mole of atoms at high T (Kittel, Introduction to Solid State
    // Physics, 8th ed., ch. 5); R = 8.314462618 J/(mol K) (CODATA 2018). Per cell: × atoms.
    const limit = 3 * 8.314462618 * t.atoms;
    expect(t.heatCapacity[i1000] / limit).toBeGreaterThan(0.95);
    expect(t.heatCapacity[i1000] / limit).toBeLessThanOrEqual(1.0001);
    // At 0 K only the Γ acoustic modes (counted classically by thermo.ts) are left: a sliver.
    expect(t.heatCapacity[0] / limit).toBeLessThan(0.01);
    expect(t.zeroPointEnergy).toBeGreaterThan(0);
    // F = ZPE at 0 K.
    expect(t.freeEnergy[0]).toBeCloseTo(t.zeroPointEnergy, 6);
  });

  it('signed out is 401, a member of another group gets 404, a bad id 404', async () => {
    const s = await screenedSpectrum(lab.group, lab.submitter);
    expect((await get(null, s.revisionId)).status).toBe(401);
    expect((await get(outsider, s.revisionId)).status).toBe(404);
    expect((await get(lab.admin, 'not-a-uuid')).status).toBe(404);
    expect((await get(lab.submitter, s.revisionId)).status).toBe(200);
  });
});
