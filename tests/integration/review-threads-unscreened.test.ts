/**
 * Threads on the spectrum as a whole while its file is still being screened or did not parse:
 * reviewers ask the submitter about the file before there is anything to plot. Threads on a
 * point still need screened data.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { OutboxMessage } from '@/entities';
import * as threads from '@/app/api/v1/spectra/[id]/threads/route';
import * as replies from '@/app/api/v1/threads/[id]/replies/route';
import { closeOrm, getEm } from '@/lib/db/orm';
import { makeLab } from './helpers';
import { call, unscreenedSpectrum } from './review-fixtures';

let lab: Awaited<ReturnType<typeof makeLab>>;
beforeAll(async () => {
  lab = await makeLab('unscreened');
});
afterAll(closeOrm);

describe.each(['pending', 'error'] as const)('screening %s', (state) => {
  it('a reviewer opens a thread on the spectrum; it sits on the current revision and never "moved"', async () => {
    const s = await unscreenedSpectrum(lab.group, lab.submitter, state);
    const local = lab.submitter.email.split('@')[0];
    const r = await call(threads.POST, lab.reviewer, { params: { id: s.id }, body: { anchor: null, body: `Which code wrote this file, @${local}?` } });
    expect(r.status, JSON.stringify(r.body)).toBe(201);
    expect(r.body).toMatchObject({ anchor: { kind: 'spectrum' }, revision: { id: s.revisionId, number: 1 }, moved: null, blocking: false });

    const list = await call(threads.GET, lab.observer, { params: { id: s.id } });
    expect(list.status).toBe(200);
    expect(list.body.items.map((t: { id: string }) => t.id)).toEqual([r.body.id]);

    // The submitter is told (mention) and answers in the thread.
    const em = await getEm();
    const events = await em.find(OutboxMessage, { group: lab.group.id, type: 'mention' });
    expect(events.some((e) => (e.payload as { threadId?: string; mentionedIds?: string[] }).threadId === r.body.id
      && (e.payload as { mentionedIds: string[] }).mentionedIds.includes(lab.submitter.id))).toBe(true);
    const answer = await call(replies.POST, lab.submitter, { params: { id: r.body.id }, body: { body: 'An in-house script; fixed columns coming.' } });
    expect(answer.status).toBe(201);
  });

  it('a point on the unscreened revision is refused (409); submitters and observers cannot open threads', async () => {
    const s = await unscreenedSpectrum(lab.group, lab.submitter, state);
    const point = await call(threads.POST, lab.reviewer, { params: { id: s.id }, body: { anchor: { revision: s.revisionId, index: 0, branch: 0 }, body: 'Here?' } });
    expect(point.status).toBe(409);
    for (const who of [lab.submitter, lab.observer]) {
      expect((await call(threads.POST, who, { params: { id: s.id }, body: { anchor: null, body: 'Hello?' } })).status).toBe(403);
    }
  });
});
