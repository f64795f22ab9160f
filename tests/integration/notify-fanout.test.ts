/** The outbox fan-out on its own: a broken event is set aside without blocking the others. */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { Group, OutboxMessage } from '@/entities';
import { closeOrm, getEm } from '@/lib/db/orm';
import { fanOutOutbox, MAX_FANOUT_ATTEMPTS } from '@/lib/services/notifications';
import { makeLab } from './helpers';
import { screenedSpectrum } from './review-fixtures';

let lab: Awaited<ReturnType<typeof makeLab>>;
beforeAll(async () => {
  lab = await makeLab('fanout');
});
afterAll(closeOrm);

describe('outbox fan-out', () => {
  it('an event that cannot be fanned out is retried, then set aside; the events after it still go', async () => {
    const s = await screenedSpectrum(lab.group, lab.submitter);
    const em = await getEm();
    // A payload no service writes: the spectrum id is not a uuid, so loading it fails in SQL.
    const broken = em.create(OutboxMessage, {
      type: 'decision.made',
      group: em.getReference(Group, lab.group.id),
      payload: { type: 'decision.made', groupId: lab.group.id, spectrumId: 'not-a-uuid', actorId: null, decisionId: 'x', revisionId: 'y', verdict: 'approve' },
      attempts: 0,
      processedAt: null,
      lastError: null,
    });
    await em.flush();
    const fine = em.create(OutboxMessage, {
      type: 'thread.updated',
      group: em.getReference(Group, lab.group.id),
      payload: { type: 'thread.updated', groupId: lab.group.id, spectrumId: s.id, actorId: lab.reviewer.id, threadId: s.id, change: { resolved: true } },
      attempts: 0,
      processedAt: null,
      lastError: null,
    });
    await em.flush();

    const first = await fanOutOutbox({ groupId: lab.group.id });
    expect(first.events).toBe(2);
    const read = async (id: string) => (await getEm()).findOneOrFail(OutboxMessage, { id });
    expect((await read(fine.id)).processedAt).not.toBeNull();
    const afterOne = await read(broken.id);
    expect(afterOne.processedAt).toBeNull();
    expect(afterOne.attempts).toBe(1);
    expect(afterOne.lastError).toMatch(/uuid/i);

    for (let i = 1; i < MAX_FANOUT_ATTEMPTS; i++) await fanOutOutbox({ groupId: lab.group.id });
    const setAside = await read(broken.id);
    expect(setAside.attempts).toBe(MAX_FANOUT_ATTEMPTS);
    expect(setAside.processedAt).not.toBeNull();
    expect((await fanOutOutbox({ groupId: lab.group.id })).events).toBe(0);
  });
});
