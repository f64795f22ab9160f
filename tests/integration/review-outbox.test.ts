/** The outbox contract notifications build on: written with the change, claimed once, retried. */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { OutboxMessage } from '@/entities';
import * as decisions from '@/app/api/v1/spectra/[id]/decisions/route';
import { closeOrm, getEm } from '@/lib/db/orm';
import { claimOutbox, markOutbox } from '@/lib/services/outbox';
import { makeLab } from './helpers';
import { call, screenedSpectrum } from './review-fixtures';

let lab: Awaited<ReturnType<typeof makeLab>>;
beforeAll(async () => {
  lab = await makeLab('outbox');
});
afterAll(closeOrm);

describe('outbox', () => {
  it('a refused change leaves no event; an accepted one leaves its events', async () => {
    const s = await screenedSpectrum(lab.group, lab.submitter);
    expect((await call(decisions.POST, lab.submitter, { params: { id: s.id }, body: { verdict: 'approve', note: 'x', revision: s.revisionId } })).status).toBe(403);
    const em = await getEm();
    expect(await em.count(OutboxMessage, { group: lab.group.id })).toBe(0);
    await call(decisions.POST, lab.reviewer, { params: { id: s.id }, body: { verdict: 'return', note: 'Fix it.', revision: s.revisionId } });
    const rows = await em.find(OutboxMessage, { group: lab.group.id }, { orderBy: { type: 'asc' } });
    expect(rows.map((r) => r.type)).toEqual(['decision.made', 'spectrum.status']);
    expect(rows[0]!.payload).toMatchObject({ type: 'decision.made', verdict: 'return', spectrumId: s.id, actorId: lab.reviewer.id, groupId: lab.group.id });
  });

  it('two workers never take the same event; a failed one is kept with its attempt counted', async () => {
    const em = await getEm();
    let second: unknown[] | undefined;
    await em.transactional(async (tx) => {
      const mine = await claimOutbox(tx, { groupId: lab.group.id });
      expect(mine.map((m) => m.event.type).sort()).toEqual(['decision.made', 'spectrum.status']);
      // Another worker at the same time: the rows are locked, so it gets none of them.
      const other = await getEm();
      await other.transactional(async (tx2) => {
        second = await claimOutbox(tx2, { groupId: lab.group.id });
      });
      const ok = mine.find((m) => m.event.type === 'decision.made')!;
      const bad = mine.find((m) => m.event.type === 'spectrum.status')!;
      await markOutbox(tx, ok.id, { ok: true });
      await markOutbox(tx, bad.id, { ok: false, error: 'SMTP 421 try later' });
    });
    expect(second).toEqual([]);
    const left = await (await getEm()).transactional((tx) => claimOutbox(tx, { groupId: lab.group.id }));
    expect(left).toHaveLength(1);
    expect(left[0]).toMatchObject({ attempts: 1, event: { type: 'spectrum.status' } });
    const row = await (await getEm()).findOneOrFail(OutboxMessage, { id: left[0]!.id });
    expect(row.lastError).toBe('SMTP 421 try later');
  });
});
