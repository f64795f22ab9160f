import { Group, Invitation, Membership, newId, User } from '@/entities';
import type { Caller, SessionUser } from '@/lib/auth/caller';
import { normalizeEmail } from '@/lib/auth/email';
import { hashPassword } from '@/lib/auth/password';
import type { Role } from '@/lib/auth/permissions';
import { newSecret, sha256Hex } from '@/lib/auth/secret-token';
import { env } from '@/lib/config/env';
import type { Em } from '@/lib/db/orm';
import { AppError } from '@/lib/errors';
import { invitationMail } from '@/lib/mail/templates';
import { sendMail } from '@/lib/mail/transport';
import { groupAccess } from './access';
import { recordAudit } from './audit';

export const INVITATION_DAYS = 7;

export type InvitationStatus = 'valid' | 'expired' | 'used' | 'revoked' | 'unknown';

export interface InvitationView {
  status: InvitationStatus;
  /** null only when the status is 'unknown' */
  groupName: string | null;
  groupSlug: string | null;
  email: string | null;
  role: Role | null;
  expiresAt: string | null;
  /** Whether the invited address already has an account (then accepting needs signing in). */
  hasAccount: boolean;
}

export interface PendingInvitationDto {
  id: string;
  email: string;
  role: Role;
  invitedBy: string | null;
  createdAt: string;
  expiresAt: string;
  status: 'pending' | 'expired';
}

export function invitationUrl(token: string): string {
  return `${env().APP_URL}/invitations/${encodeURIComponent(token)}`;
}

function statusOf(inv: Invitation, now = new Date()): InvitationStatus {
  if (inv.revokedAt) return 'revoked';
  if (inv.acceptedAt) return 'used';
  if (inv.expiresAt.getTime() <= now.getTime()) return 'expired';
  return 'valid';
}

const refusalText: Record<Exclude<InvitationStatus, 'valid'>, string> = {
  unknown: 'This invitation link is not valid. Check that the whole link was copied.',
  expired: 'This invitation has expired. Ask an admin of the group to invite you again.',
  used: 'This invitation has already been used. Sign in instead.',
  revoked: 'This invitation was withdrawn by an admin of the group.',
};

function refusal(status: Exclude<InvitationStatus, 'valid'>): AppError {
  return new AppError(status === 'unknown' ? 'not_found' : 'conflict', refusalText[status], { status });
}

async function findByToken(em: Em, token: string): Promise<Invitation | null> {
  return em.findOne(Invitation, { tokenHash: sha256Hex(token) }, { populate: ['group'] });
}

/** What the accept page shows for a link. Never throws for a bad token: 'unknown'. */
export async function getInvitation(em: Em, token: string): Promise<InvitationView> {
  const inv = await findByToken(em, token);
  if (!inv) {
    return { status: 'unknown', groupName: null, groupSlug: null, email: null, role: null, expiresAt: null, hasAccount: false };
  }
  const hasAccount = (await em.count(User, { email: inv.email })) > 0;
  return {
    status: statusOf(inv),
    groupName: inv.group.name,
    groupSlug: inv.group.slug,
    email: inv.email,
    role: inv.role,
    expiresAt: inv.expiresAt.toISOString(),
    hasAccount,
  };
}

/** Invitations neither accepted nor revoked, newest first (expired ones marked). */
export async function listInvitations(em: Em, groupId: string): Promise<PendingInvitationDto[]> {
  const rows = await em.find(
    Invitation,
    { group: groupId, acceptedAt: null, revokedAt: null },
    { populate: ['invitedBy'], orderBy: { createdAt: 'desc' } },
  );
  const now = new Date();
  return rows.map((i) => ({
    id: i.id,
    email: i.email,
    role: i.role,
    invitedBy: i.invitedBy ? (i.invitedBy.name ?? i.invitedBy.email) : null,
    createdAt: i.createdAt.toISOString(),
    expiresAt: i.expiresAt.toISOString(),
    status: i.expiresAt.getTime() <= now.getTime() ? 'expired' : 'pending',
  }));
}

/**
 * Invites an address to the group and mails the accept link. An earlier open invitation of the
 * same address to the same group is replaced. The token is returned for the server's own use
 * (tests); actions never pass it to the browser.
 */
export async function inviteMember(
  em: Em,
  caller: Caller,
  input: { group: string; email: string; role: Role },
): Promise<{ id: string; email: string; role: Role; expiresAt: string; token: string }> {
  const { group } = await groupAccess(em, caller, { slug: input.group }, 'invitations.manage');
  const email = normalizeEmail(input.email);
  const already = await em.count(Membership, { group: group.id, user: { email } });
  if (already) throw new AppError('conflict', `${email} is already a member of this group.`, { fieldErrors: { email: ['Already a member of this group.'] } });

  const token = newSecret(32);
  const expiresAt = new Date(Date.now() + INVITATION_DAYS * 24 * 3600 * 1000);
  return em.transactional(async (tem) => {
    const now = new Date();
    await tem.nativeUpdate(Invitation, { group: group.id, email, acceptedAt: null, revokedAt: null }, { revokedAt: now });
    const inv = tem.create(Invitation, {
      id: newId(),
      group: tem.getReference(Group, group.id),
      email,
      role: input.role,
      tokenHash: sha256Hex(token),
      invitedBy: tem.getReference(User, caller.userId),
      expiresAt,
      acceptedAt: null,
      revokedAt: null,
    });
    recordAudit(tem, {
      groupId: group.id,
      actorId: caller.userId,
      action: 'invitation.created',
      target: `invitation:${inv.id}`,
      data: { email, role: input.role },
    });
    await tem.flush();
    // Inside the transaction: if the mail cannot be sent, no invitation is left behind.
    await sendMail(
      invitationMail({
        to: email,
        url: invitationUrl(token),
        groupName: group.name,
        role: input.role,
        invitedBy: caller.name ?? caller.email,
        expiresAt,
      }),
    );
    return { id: inv.id, email, role: input.role, expiresAt: expiresAt.toISOString(), token };
  });
}

export async function revokeInvitation(em: Em, caller: Caller, input: { group: string; invitationId: string }): Promise<void> {
  const { group } = await groupAccess(em, caller, { slug: input.group }, 'invitations.manage');
  const inv = /^[0-9a-f-]{36}$/i.test(input.invitationId)
    ? await em.findOne(Invitation, { id: input.invitationId, group: group.id })
    : null;
  if (!inv) throw new AppError('not_found', 'No such invitation.');
  if (inv.acceptedAt) throw new AppError('conflict', 'This invitation has already been accepted.');
  if (inv.revokedAt) return;
  inv.revokedAt = new Date();
  recordAudit(em, {
    groupId: group.id,
    actorId: caller.userId,
    action: 'invitation.revoked',
    target: `invitation:${inv.id}`,
    data: { email: inv.email, role: inv.role },
  });
  await em.flush();
}

/** Marks the invitation used, once: of two concurrent accepts only one gets true. */
async function claim(em: Em, inv: Invitation, now: Date): Promise<void> {
  const claimed = await em.nativeUpdate(
    Invitation,
    { id: inv.id, acceptedAt: null, revokedAt: null, expiresAt: { $gt: now } },
    { acceptedAt: now },
  );
  if (claimed !== 1) throw refusal('used');
}

async function validInvitation(em: Em, token: string): Promise<Invitation> {
  const inv = await findByToken(em, token);
  const status = inv ? statusOf(inv) : 'unknown';
  if (status !== 'valid') throw refusal(status);
  return inv!;
}

/** A new person accepts: their account and membership are created; they sign in afterwards. */
export async function acceptInvitationAsNewUser(
  em: Em,
  input: { token: string; name: string; password: string },
): Promise<{ email: string; groupSlug: string }> {
  const inv = await validInvitation(em, input.token);
  if (await em.count(User, { email: inv.email })) {
    throw new AppError('conflict', `${inv.email} already has an account: sign in as ${inv.email}, then open the invitation link again.`);
  }
  const passwordHash = await hashPassword(input.password);
  return em.transactional(async (tem) => {
    const now = new Date();
    await claim(tem, inv, now);
    // Opening the mailed link proves the address.
    const user = tem.create(User, { id: newId(), email: inv.email, name: input.name.trim(), passwordHash, emailVerified: now });
    tem.create(Membership, { user, group: tem.getReference(Group, inv.group.id), role: inv.role, joinedAt: now });
    recordAudit(tem, {
      groupId: inv.group.id,
      actorId: user.id,
      action: 'invitation.accepted',
      target: `invitation:${inv.id}`,
      data: { email: inv.email, role: inv.role, newAccount: true },
    });
    return { email: inv.email, groupSlug: inv.group.slug };
  });
}

/** A signed-in person accepts an invitation sent to their own address. */
export async function acceptInvitationAsMember(em: Em, user: SessionUser, input: { token: string }): Promise<{ groupSlug: string }> {
  const inv = await validInvitation(em, input.token);
  if (normalizeEmail(user.email) !== inv.email) {
    throw new AppError('forbidden', `This invitation is for ${inv.email}, but you are signed in as ${user.email}. Sign out and sign in as ${inv.email}.`);
  }
  return em.transactional(async (tem) => {
    const now = new Date();
    await claim(tem, inv, now);
    const existing = await tem.findOne(Membership, { user: user.id, group: inv.group.id });
    // Already a member (e.g. added twice): keep the role they have.
    if (!existing) {
      tem.create(Membership, { user: tem.getReference(User, user.id), group: tem.getReference(Group, inv.group.id), role: inv.role, joinedAt: now });
    }
    recordAudit(tem, {
      groupId: inv.group.id,
      actorId: user.id,
      action: 'invitation.accepted',
      target: `invitation:${inv.id}`,
      data: { email: inv.email, role: existing ? existing.role : inv.role, newAccount: false },
    });
    return { groupSlug: inv.group.slug };
  });
}
