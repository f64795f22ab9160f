/**
 * The one place that decides who may do what in a group. Ownership ("own spectrum") and
 * "nobody decides on their own submission" are checked by the services that know the record;
 * here only the role counts.
 */
import { AppError } from '@/lib/errors';
import { roles, type Role } from '@/entities/common';

export { roles, type Role };

export const actions = [
  'group.read',
  'members.read',
  'members.manage',
  'invitations.manage',
  'policy.edit',
  'audit.read',
  'reviewers.assign',
  'spectrum.read',
  'spectrum.export',
  'spectrum.create',
  'spectrum.revise-own',
  'spectrum.withdraw-own',
  'spectrum.decide',
  'spectrum.reopen',
  'finding.waive',
  'thread.open',
  'thread.reply',
  'thread.reply-own',
  'thread.mark-blocking',
  'thread.resolve',
  'tokens.create',
] as const;
export type Action = (typeof actions)[number];

const everyone: readonly Role[] = roles;
const reviewers: readonly Role[] = ['admin', 'reviewer'];
const submitters: readonly Role[] = ['admin', 'submitter'];
const admins: readonly Role[] = ['admin'];

/** product.md: admin can everything below; reviewer reviews; submitter submits; observer reads. */
const allowed: Record<Action, readonly Role[]> = {
  'group.read': everyone,
  'members.read': everyone,
  'members.manage': admins,
  'invitations.manage': admins,
  'policy.edit': admins,
  'audit.read': admins,
  'reviewers.assign': admins,
  'spectrum.read': everyone,
  'spectrum.export': everyone,
  'spectrum.create': submitters,
  'spectrum.revise-own': submitters,
  'spectrum.withdraw-own': submitters,
  'spectrum.decide': reviewers,
  'spectrum.reopen': admins,
  'finding.waive': reviewers,
  // Reviewers open and reply anywhere; a submitter only on their own spectra.
  'thread.open': reviewers,
  'thread.reply': reviewers,
  'thread.reply-own': ['admin', 'reviewer', 'submitter'],
  'thread.mark-blocking': reviewers,
  'thread.resolve': reviewers,
  // A token acts with its holder's role, so an observer's token can only read.
  'tokens.create': everyone,
};

export function can(role: Role | null | undefined, action: Action): boolean {
  return role != null && allowed[action].includes(role);
}

export function assertCan(role: Role | null | undefined, action: Action): void {
  if (!can(role, action)) {
    throw new AppError('forbidden', `Your role (${role ?? 'none'}) does not allow ${action}.`);
  }
}

/** Every action a role may take, e.g. for a page to decide which buttons to show. */
export function allowedActions(role: Role): Action[] {
  return actions.filter((a) => allowed[a].includes(role));
}

export function isRole(value: unknown): value is Role {
  return typeof value === 'string' && (roles as readonly string[]).includes(value);
}
