import { describe, expect, it } from 'vitest';
import type { Action } from '@/lib/auth/permissions';
import { can, type Role } from '@/lib/auth/permissions';
import { checkTransition, nextStatuses, reviewStatuses, type ReviewEvent, type ReviewStatus } from './status-machine';

const as = (role: Role, isSubmitter = false) => ({ allowed: (a: Action) => can(role, a), isSubmitter });

describe('the status machine of product.md', () => {
  it('reachable statuses from each status', () => {
    expect(nextStatuses('screening').sort()).toEqual(['in-review', 'withdrawn']);
    expect(nextStatuses('in-review').sort()).toEqual(['approved', 'rejected', 'returned', 'screening', 'withdrawn']);
    expect(nextStatuses('returned').sort()).toEqual(['screening', 'withdrawn']);
    expect(nextStatuses('rejected')).toEqual(['in-review']);
    expect(nextStatuses('approved')).toEqual([]);
    expect(nextStatuses('withdrawn')).toEqual([]);
  });

  it('decisions: reviewers and admins, in review, not on their own submission', () => {
    for (const event of ['approve', 'return', 'reject'] as ReviewEvent[]) {
      expect(checkTransition({ from: 'in-review', event, actor: as('reviewer') }).ok).toBe(true);
      expect(checkTransition({ from: 'in-review', event, actor: as('admin') }).ok).toBe(true);
      expect(checkTransition({ from: 'in-review', event, actor: as('submitter') })).toMatchObject({ ok: false, code: 'forbidden' });
      expect(checkTransition({ from: 'in-review', event, actor: as('observer') })).toMatchObject({ ok: false, code: 'forbidden' });
      expect(checkTransition({ from: 'in-review', event, actor: as('admin', true) })).toMatchObject({ ok: false, code: 'conflict' });
      for (const from of reviewStatuses.filter((s) => s !== 'in-review')) {
        expect(checkTransition({ from, event, actor: as('reviewer') })).toMatchObject({ ok: false, code: 'conflict' });
      }
    }
    expect(checkTransition({ from: 'in-review', event: 'return', actor: as('reviewer') })).toEqual({ ok: true, to: 'returned' });
    expect(checkTransition({ from: 'in-review', event: 'reject', actor: as('reviewer') })).toEqual({ ok: true, to: 'rejected' });
    // One approval keeps it in review; the approval rule moves it on.
    expect(checkTransition({ from: 'in-review', event: 'approve', actor: as('reviewer') })).toEqual({ ok: true, to: 'in-review' });
  });

  it('approval and screening are the application\'s, never a person\'s', () => {
    expect(checkTransition({ from: 'in-review', event: 'auto-approve', actor: null })).toEqual({ ok: true, to: 'approved' });
    expect(checkTransition({ from: 'in-review', event: 'auto-approve', actor: as('admin') }).ok).toBe(false);
    expect(checkTransition({ from: 'returned', event: 'auto-approve', actor: null }).ok).toBe(false);
    expect(checkTransition({ from: 'screening', event: 'screened', actor: null })).toEqual({ ok: true, to: 'in-review' });
  });

  it('only an admin reopens, and only a rejected spectrum', () => {
    expect(checkTransition({ from: 'rejected', event: 'reopen', actor: as('admin') })).toEqual({ ok: true, to: 'in-review' });
    expect(checkTransition({ from: 'rejected', event: 'reopen', actor: as('reviewer') })).toMatchObject({ code: 'forbidden' });
    expect(checkTransition({ from: 'approved', event: 'reopen', actor: as('admin') })).toMatchObject({ code: 'conflict' });
  });

  it('the submitter withdraws from any open state', () => {
    const open: ReviewStatus[] = ['screening', 'in-review', 'returned'];
    for (const from of reviewStatuses) {
      const r = checkTransition({ from, event: 'withdraw', actor: as('submitter', true) });
      expect(r.ok).toBe(open.includes(from));
    }
    expect(checkTransition({ from: 'in-review', event: 'withdraw', actor: as('submitter', false) })).toMatchObject({ code: 'forbidden' });
    expect(checkTransition({ from: 'in-review', event: 'withdraw', actor: as('reviewer', true) })).toMatchObject({ code: 'forbidden' });
    expect(checkTransition({ from: 'in-review', event: 'withdraw', actor: as('admin', true) }).ok).toBe(true);
  });

  it('a new revision returns an open spectrum to screening', () => {
    expect(checkTransition({ from: 'returned', event: 'revise', actor: as('submitter', true) })).toEqual({ ok: true, to: 'screening' });
    expect(checkTransition({ from: 'approved', event: 'revise', actor: as('submitter', true) })).toMatchObject({ code: 'conflict' });
  });
});
