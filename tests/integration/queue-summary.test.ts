/** The group overview's counts: per status, and what waits on the caller, with the queue's own rules. */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { closeOrm, getEm } from '@/lib/db/orm';
import { AppError } from '@/lib/errors';
import { queueSummary } from '@/lib/services/spectra';
import { makeLab, sessionCaller } from './helpers';
import { screenedSpectrum, unscreenedSpectrum } from './review-fixtures';

let lab: Awaited<ReturnType<typeof makeLab>>;
let other: Awaited<ReturnType<typeof makeLab>>;

beforeAll(async () => {
  lab = await makeLab('summary');
  other = await makeLab('summary-other');
  await screenedSpectrum(lab.group, lab.submitter);
  await screenedSpectrum(lab.group, lab.submitter);
  await unscreenedSpectrum(lab.group, lab.submitter, 'pending');
  await unscreenedSpectrum(lab.group, lab.submitter, 'error');
  await screenedSpectrum(other.group, other.submitter);
});
afterAll(closeOrm);

describe('queueSummary', () => {
  it('counts the spectra of the group per status, and those waiting on a reviewer', async () => {
    const s = await queueSummary(await getEm(), sessionCaller(lab.reviewer), lab.group.slug);
    expect(s.total).toBe(4);
    expect(s.byStatus).toMatchObject({ 'in-review': 2, screening: 2, approved: 0 });
    // One of the two in screening has a file that did not parse: it waits for a new revision.
    expect(s.fileNotRead).toBe(1);
    expect(s.waitingOnMe).toBe(2);
  });

  it('has no "waiting on me" for people who cannot decide', async () => {
    for (const who of [lab.submitter, lab.observer]) {
      expect((await queueSummary(await getEm(), sessionCaller(who), lab.group.slug)).waitingOnMe).toBeNull();
    }
  });

  it('is a 404 for someone outside the group', async () => {
    await expect(queueSummary(await getEm(), sessionCaller(other.admin), lab.group.slug)).rejects.toSatisfy((e) => e instanceof AppError && e.code === 'not_found');
  });
});
