import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { AuditEvent, Invitation, Membership, User } from '@/entities';
import { sessionCaller, ensureSmtpFake, makeLab, makeUser, uniq } from './helpers';
import { checkPassword } from '@/lib/auth/options';
import { closeOrm, getEm } from '@/lib/db/orm';
import { AppError } from '@/lib/errors';
import { firstLink, latestTo } from '@/lib/mail/mailbox';
import {
  acceptInvitationAsMember,
  acceptInvitationAsNewUser,
  getInvitation,
  inviteMember,
  listInvitations,
  revokeInvitation,
} from '@/lib/services/invitations';
import type { SmtpFake } from '@/fakes/smtp/server';

let lab: Awaited<ReturnType<typeof makeLab>>;
let fake: SmtpFake | null;

beforeAll(async () => {
  fake = await ensureSmtpFake();
  lab = await makeLab('inv');
});
afterAll(async () => {
  await fake?.close();
  await closeOrm();
});

async function rejection(p: Promise<unknown>): Promise<AppError> {
  try {
    await p;
  } catch (e) {
    if (e instanceof AppError) return e;
    throw e;
  }
  throw new Error('expected a refusal');
}

describe('invitations', () => {
  it('an admin invites; the mail carries the accept link; the new person accepts and can sign in', async () => {
    const email = `newcomer-${uniq()}@lab.test`;
    const em = await getEm();
    const sent = await inviteMember(em, sessionCaller(lab.admin), { group: lab.group.slug, email: email.toUpperCase(), role: 'reviewer' });
    expect(sent.email).toBe(email);

    const mail = await latestTo(email);
    expect(mail?.subject).toContain(lab.group.name);
    const link = firstLink(mail!);
    expect(link).toBe(`${process.env.APP_URL}/invitations/${sent.token}`);
    const token = link!.split('/').pop()!;

    // Stored hashed: the token from the mail is not in the table.
    const rows = await em.getConnection().execute('select * from invitation where email = ?', [email]);
    expect(JSON.stringify(rows)).not.toContain(token);

    expect(await getInvitation(em, token)).toMatchObject({ status: 'valid', email, role: 'reviewer', groupName: lab.group.name, hasAccount: false });
    expect((await listInvitations(em, lab.group.id)).map((i) => i.email)).toContain(email);

    const done = await acceptInvitationAsNewUser(await getEm(), { token, name: 'Nadia Newcomer', password: 'a-long-enough-secret' });
    expect(done).toEqual({ email, groupSlug: lab.group.slug });

    const em2 = await getEm();
    const user = await em2.findOneOrFail(User, { email });
    expect(user.name).toBe('Nadia Newcomer');
    expect(await em2.findOne(Membership, { user: user.id, group: lab.group.id })).toMatchObject({ role: 'reviewer' });
    expect(await checkPassword(email, 'a-long-enough-secret')).toEqual({ id: user.id, email, name: 'Nadia Newcomer' });
    expect((await getInvitation(em2, token)).status).toBe('used');
    expect((await listInvitations(em2, lab.group.id)).map((i) => i.email)).not.toContain(email);

    const audit = await em2.find(AuditEvent, { group: lab.group.id, action: { $in: ['invitation.created', 'invitation.accepted'] }, data: { email } });
    expect(audit.map((a) => a.action).sort()).toEqual(['invitation.accepted', 'invitation.created']);
    expect(audit.find((a) => a.action === 'invitation.created')).toMatchObject({ target: `invitation:${sent.id}`, data: { role: 'reviewer' } });
    expect(audit.find((a) => a.action === 'invitation.created')?.actor?.id).toBe(lab.admin.id);
    expect(audit.find((a) => a.action === 'invitation.accepted')?.actor?.id).toBe(user.id);
  });

  it('a used link is refused, and a second account is not made', async () => {
    const email = `twice-${uniq()}@lab.test`;
    const { token } = await inviteMember(await getEm(), sessionCaller(lab.admin), { group: lab.group.slug, email, role: 'observer' });
    await acceptInvitationAsNewUser(await getEm(), { token, name: 'First', password: 'a-long-enough-secret' });
    const err = await rejection(acceptInvitationAsNewUser(await getEm(), { token, name: 'Second', password: 'another-long-secret' }));
    expect(err.code).toBe('conflict');
    expect(err.message).toMatch(/already been used/);
    expect(await (await getEm()).count(User, { email })).toBe(1);
  });

  it('two concurrent accepts: exactly one wins', async () => {
    const email = `race-${uniq()}@lab.test`;
    const { token } = await inviteMember(await getEm(), sessionCaller(lab.admin), { group: lab.group.slug, email, role: 'observer' });
    const results = await Promise.allSettled([
      acceptInvitationAsNewUser(await getEm(), { token, name: 'A', password: 'a-long-enough-secret' }),
      acceptInvitationAsNewUser(await getEm(), { token, name: 'B', password: 'a-long-enough-secret' }),
    ]);
    expect(results.filter((r) => r.status === 'fulfilled')).toHaveLength(1);
    expect(await (await getEm()).count(User, { email })).toBe(1);
  });

  it('an expired link is refused clearly', async () => {
    const email = `late-${uniq()}@lab.test`;
    const em = await getEm();
    const { id, token } = await inviteMember(em, sessionCaller(lab.admin), { group: lab.group.slug, email, role: 'submitter' });
    await em.nativeUpdate(Invitation, { id }, { expiresAt: new Date(Date.now() - 1000) });
    expect((await getInvitation(await getEm(), token)).status).toBe('expired');
    const err = await rejection(acceptInvitationAsNewUser(await getEm(), { token, name: 'Late', password: 'a-long-enough-secret' }));
    expect(err.message).toMatch(/expired/);
    expect(await (await getEm()).count(User, { email })).toBe(0);
  });

  it('a revoked link is refused; revoking is audited; only admins revoke', async () => {
    const email = `revoked-${uniq()}@lab.test`;
    const { id, token } = await inviteMember(await getEm(), sessionCaller(lab.admin), { group: lab.group.slug, email, role: 'submitter' });
    const denied = await rejection(revokeInvitation(await getEm(), sessionCaller(lab.reviewer), { group: lab.group.slug, invitationId: id }));
    expect(denied.code).toBe('forbidden');
    await revokeInvitation(await getEm(), sessionCaller(lab.admin), { group: lab.group.slug, invitationId: id });
    expect((await getInvitation(await getEm(), token)).status).toBe('revoked');
    const err = await rejection(acceptInvitationAsNewUser(await getEm(), { token, name: 'Too late', password: 'a-long-enough-secret' }));
    expect(err.message).toMatch(/withdrawn/);
    expect(await (await getEm()).count(AuditEvent, { action: 'invitation.revoked', target: `invitation:${id}` })).toBe(1);
  });

  it('an unknown token is "unknown" and refused as not found', async () => {
    expect((await getInvitation(await getEm(), 'x'.repeat(43))).status).toBe('unknown');
    const err = await rejection(acceptInvitationAsNewUser(await getEm(), { token: 'x'.repeat(43), name: 'N', password: 'a-long-enough-secret' }));
    expect(err.code).toBe('not_found');
  });

  it('re-inviting the same address replaces the open invitation', async () => {
    const email = `again-${uniq()}@lab.test`;
    const first = await inviteMember(await getEm(), sessionCaller(lab.admin), { group: lab.group.slug, email, role: 'observer' });
    const second = await inviteMember(await getEm(), sessionCaller(lab.admin), { group: lab.group.slug, email, role: 'submitter' });
    const em = await getEm();
    expect((await getInvitation(em, first.token)).status).toBe('revoked');
    expect((await getInvitation(em, second.token)).status).toBe('valid');
    expect((await listInvitations(em, lab.group.id)).filter((i) => i.email === email)).toHaveLength(1);
  });

  it('only admins invite; members already in the group are refused', async () => {
    for (const role of ['reviewer', 'submitter', 'observer'] as const) {
      const err = await rejection(inviteMember(await getEm(), sessionCaller(lab[role]), { group: lab.group.slug, email: `x-${uniq()}@lab.test`, role: 'observer' }));
      expect(err.code).toBe('forbidden');
    }
    const dup = await rejection(inviteMember(await getEm(), sessionCaller(lab.admin), { group: lab.group.slug, email: lab.observer.email, role: 'observer' }));
    expect(dup.code).toBe('conflict');
  });

  it('someone with an account accepts while signed in as that address, not as another', async () => {
    const em = await getEm();
    const existing = await makeUser(em, 'existing');
    const { token } = await inviteMember(em, sessionCaller(lab.admin), { group: lab.group.slug, email: existing.email, role: 'submitter' });
    expect((await getInvitation(await getEm(), token)).hasAccount).toBe(true);

    const asNew = await rejection(acceptInvitationAsNewUser(await getEm(), { token, name: 'Dup', password: 'a-long-enough-secret' }));
    expect(asNew.message).toMatch(/already has an account/);

    const wrong = await rejection(acceptInvitationAsMember(await getEm(), { id: lab.observer.id, email: lab.observer.email, name: null }, { token }));
    expect(wrong.code).toBe('forbidden');

    const ok = await acceptInvitationAsMember(await getEm(), { id: existing.id, email: existing.email, name: existing.name }, { token });
    expect(ok).toEqual({ groupSlug: lab.group.slug });
    expect(await (await getEm()).findOne(Membership, { user: existing.id, group: lab.group.id })).toMatchObject({ role: 'submitter' });
  });
});
