import { describe, expect, it } from 'vitest';
import { actions, allowedActions, assertCan, can, roles, type Action, type Role } from './permissions';
import { AppError } from '@/lib/errors';

// The role table of product.md ("People and roles"), written out action by action.
const expected: Record<Role, Action[]> = {
  admin: [...actions],
  reviewer: [
    'group.read', 'members.read', 'spectrum.read', 'spectrum.export', 'spectrum.decide', 'finding.waive',
    'thread.open', 'thread.reply', 'thread.reply-own', 'thread.mark-blocking', 'thread.resolve', 'tokens.create',
  ],
  submitter: [
    'group.read', 'members.read', 'spectrum.read', 'spectrum.export', 'spectrum.create', 'spectrum.revise-own',
    'spectrum.withdraw-own', 'thread.reply-own', 'tokens.create',
  ],
  observer: ['group.read', 'members.read', 'spectrum.read', 'spectrum.export', 'tokens.create'],
};

describe('permissions', () => {
  for (const role of roles) {
    for (const action of actions) {
      const allowed = expected[role].includes(action);
      it(`${role} ${allowed ? 'may' : 'may not'} ${action}`, () => {
        expect(can(role, action)).toBe(allowed);
        if (allowed) expect(() => assertCan(role, action)).not.toThrow();
        else expect(() => assertCan(role, action)).toThrow(AppError);
      });
    }
  }

  it('assertCan throws a 403', () => {
    try {
      assertCan('observer', 'members.manage');
      expect.unreachable();
    } catch (e) {
      expect((e as AppError).status).toBe(403);
      expect((e as AppError).code).toBe('forbidden');
    }
  });

  it('no role (not a member) may do nothing', () => {
    for (const action of actions) expect(can(null, action)).toBe(false);
  });

  it('only admins manage members, invitations, policy, the audit log and reopening', () => {
    for (const a of ['members.manage', 'invitations.manage', 'policy.edit', 'audit.read', 'spectrum.reopen'] as const) {
      expect(roles.filter((r) => can(r, a))).toEqual(['admin']);
    }
  });

  it('allowedActions lists exactly the table', () => {
    for (const role of roles) expect(allowedActions(role).sort()).toEqual([...expected[role]].sort());
  });
});
