/** The screening worker reads the group's policy: a change applies to screenings that start afterwards. */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { Finding, Group, Revision, Spectrum, User } from '@/entities';
import * as policy from '@/app/api/v1/groups/[slug]/policy/route';
import { closeOrm, getEm } from '@/lib/db/orm';
import { runScreening } from '@/lib/services/screening-job';
import { rememberStored } from '@/lib/storage/handoff';
import { writeYaml } from '@/lib/writers/yaml';
import { makeLab, uniq } from './helpers';
import { call, model } from './review-fixtures';

let lab: Awaited<ReturnType<typeof makeLab>>;
beforeAll(async () => {
  lab = await makeLab('policy-screening');
});
afterAll(closeOrm);

/** A pending revision whose file the worker finds in this process's hand-off (no upload service needed). */
async function pendingSoftMode(): Promise<string> {
  const bytes = new TextEncoder().encode(writeYaml(model({ defect: 'soft-mode' })));
  const key = `policy-${uniq()}-${uniq()}`;
  rememberStored(key, bytes);
  const em = await getEm();
  const s = em.create(Spectrum, {
    group: em.getReference(Group, lab.group.id),
    submitter: em.getReference(User, lab.submitter.id),
    title: 'Invented soft-mode crystal',
    material: 'Invented fcc solid (demo model)',
    status: 'screening',
    reviewerIds: [],
    revisionCount: 1,
    verdict: null,
  });
  const r = em.create(Revision, {
    spectrum: s,
    number: 1,
    fileKey: key,
    ufsUrl: 'http://127.0.0.1:1/none',
    originalName: 'soft.yaml',
    size: bytes.byteLength,
    format: 'yaml',
    uploader: em.getReference(User, lab.submitter.id),
  });
  await em.flush();
  s.currentRevisionId = r.id;
  await em.flush();
  return r.id;
}

const checksOf = async (revisionId: string) => (await (await getEm()).find(Finding, { revision: revisionId })).map((f) => f.check);

describe('screening under the group policy', () => {
  it('with the defaults the soft mode fails; with imaginary-modes switched off the next screening has no such finding', async () => {
    const before = await pendingSoftMode();
    expect(await runScreening(before)).toBe('done');
    expect(await checksOf(before)).toContain('imaginary-modes');

    const put = await call(policy.PUT, lab.admin, { method: 'PUT', params: { slug: lab.group.slug }, body: { checks: { imaginaryModes: { enabled: false } } } });
    expect(put.status).toBe(200);
    const after = await pendingSoftMode();
    expect(await runScreening(after)).toBe('done');
    expect(await checksOf(after)).not.toContain('imaginary-modes');
    // The earlier screening keeps its findings: a policy applies to new screenings only.
    expect(await checksOf(before)).toContain('imaginary-modes');
  });
});
