/**
 * A spectrum's life (product.md): which transitions exist from which status, and who may cause
 * each. Pure: the services look up the caller's role and ownership and ask this table.
 *
 *   screening → in-review (screening finished) → approved (automatic) | returned | rejected
 *   returned or in-review → screening (a new revision)
 *   rejected → in-review (an admin reopens)
 *   screening | in-review | returned → withdrawn (the submitter)
 */
import type { Action } from '../auth/permissions';

export const reviewStatuses = ['screening', 'in-review', 'returned', 'approved', 'rejected', 'withdrawn'] as const;
export type ReviewStatus = (typeof reviewStatuses)[number];

export const reviewEvents = ['screened', 'revise', 'approve', 'return', 'reject', 'auto-approve', 'reopen', 'withdraw'] as const;
export type ReviewEvent = (typeof reviewEvents)[number];

/**
 * Who causes an event. `permission` is an action of lib/auth/permissions.ts (the role rule);
 * `ownership` says whether the caller must be, or must not be, the spectrum's submitter.
 * 'system' events come from the screening worker or the approval rule, never from a request.
 */
export type Actor =
  | { kind: 'system' }
  | { kind: 'person'; permission: Action; ownership: 'submitter' | 'not-submitter' | 'any' };

export interface TransitionRule {
  from: readonly ReviewStatus[];
  to: ReviewStatus;
  by: Actor;
}

/** States in which the spectrum is still open (not approved, rejected or withdrawn). */
export const openStatuses: readonly ReviewStatus[] = ['screening', 'in-review', 'returned'];

export const transitions: Record<ReviewEvent, TransitionRule> = {
  screened: { from: ['screening'], to: 'in-review', by: { kind: 'system' } },
  // A new revision: also from `screening` when the current file did not parse (the services
  // decide that detail, which needs the revision's screening status).
  revise: { from: ['in-review', 'returned', 'screening'], to: 'screening', by: { kind: 'person', permission: 'spectrum.revise-own', ownership: 'submitter' } },
  // An approval keeps the spectrum in review until the policy is met (then `auto-approve`).
  approve: { from: ['in-review'], to: 'in-review', by: { kind: 'person', permission: 'spectrum.decide', ownership: 'not-submitter' } },
  return: { from: ['in-review'], to: 'returned', by: { kind: 'person', permission: 'spectrum.decide', ownership: 'not-submitter' } },
  reject: { from: ['in-review'], to: 'rejected', by: { kind: 'person', permission: 'spectrum.decide', ownership: 'not-submitter' } },
  'auto-approve': { from: ['in-review'], to: 'approved', by: { kind: 'system' } },
  reopen: { from: ['rejected'], to: 'in-review', by: { kind: 'person', permission: 'spectrum.reopen', ownership: 'any' } },
  withdraw: { from: openStatuses, to: 'withdrawn', by: { kind: 'person', permission: 'spectrum.withdraw-own', ownership: 'submitter' } },
};

export type TransitionCheck =
  | { ok: true; to: ReviewStatus }
  | { ok: false; code: 'forbidden' | 'conflict'; message: string };

export interface TransitionInput {
  from: ReviewStatus;
  event: ReviewEvent;
  /** Null for the system (worker, approval rule). */
  actor: null | { allowed: (permission: Action) => boolean; isSubmitter: boolean };
}

const verbs: Record<ReviewEvent, string> = {
  screened: 'finish screening',
  revise: 'take a new revision',
  approve: 'be approved',
  return: 'be returned',
  reject: 'be rejected',
  'auto-approve': 'be approved',
  reopen: 'be reopened',
  withdraw: 'be withdrawn',
};

/**
 * Whether `event` may happen now, and the status it leads to. Role first (403), then who the
 * caller is to this spectrum (409: nobody decides on their own submission), then the state (409).
 */
export function checkTransition({ from, event, actor }: TransitionInput): TransitionCheck {
  const rule = transitions[event];
  if (rule.by.kind === 'system') {
    if (actor) return { ok: false, code: 'forbidden', message: `Only the application can make a spectrum ${verbs[event]}.` };
  } else {
    if (!actor || !actor.allowed(rule.by.permission)) {
      return { ok: false, code: 'forbidden', message: `Your role does not allow ${rule.by.permission}.` };
    }
    if (rule.by.ownership === 'not-submitter' && actor.isSubmitter) {
      return { ok: false, code: 'conflict', message: 'Nobody decides on their own submission.' };
    }
    if (rule.by.ownership === 'submitter' && !actor.isSubmitter) {
      return { ok: false, code: 'forbidden', message: 'Only the person who submitted this spectrum can do this.' };
    }
  }
  if (!rule.from.includes(from)) {
    return { ok: false, code: 'conflict', message: `A spectrum that is ${from} cannot ${verbs[event]}.` };
  }
  return { ok: true, to: rule.to };
}

/** The statuses reachable from `from` by any event (for tests and docs). */
export function nextStatuses(from: ReviewStatus): ReviewStatus[] {
  const out = new Set<ReviewStatus>();
  for (const e of reviewEvents) if (transitions[e].from.includes(from) && transitions[e].to !== from) out.add(transitions[e].to);
  return [...out];
}
