import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { z } from 'zod';
import { ApiToken, AuditEvent, Membership } from '@/entities';
import { GET as listGroups } from '@/app/api/v1/groups/route';
import { closeOrm, getEm } from '@/lib/db/orm';
import { AppError } from '@/lib/errors';
import { route } from '@/lib/http/route';
import { groupAccess } from '@/lib/services/access';
import { createApiToken, listMyTokens, revokeApiToken } from '@/lib/services/api-tokens';
import { listMyGroups } from '@/lib/services/groups';
import { changeRole, listMembers, removeMember } from '@/lib/services/members';
import { addMember, makeGroup, makeLab, makeUser, request, routeArgs, sessionCaller } from './helpers';

let lab: Awaited<ReturnType<typeof makeLab>>;
let labB: Awaited<ReturnType<typeof makeLab>>;

beforeAll(async () => {
  lab = await makeLab('mem');
  labB = await makeLab('memb');
  // The admin of lab A is also in lab B, so a token of A could name B.
  await addMember(await getEm(), lab.admin, labB.group, 'reviewer');
});
afterAll(closeOrm);

async function rejection(p: Promise<unknown>): Promise<AppError> {
  try {
    await p;
  } catch (e) {
    if (e instanceof AppError) return e;
    throw e;
  }
  throw new Error('expected a refusal');
}

describe('members', () => {
  it('lists members with role and join date', async () => {
    const members = await listMembers(await getEm(), lab.group.id);
    expect(members).toHaveLength(4);
    expect(members.find((m) => m.userId === lab.observer.id)).toMatchObject({ email: lab.observer.email, role: 'observer', joinedAt: expect.any(String) });
  });

  it('an admin changes a role, and the change is audited with from and to', async () => {
    const member = await changeRole(await getEm(), sessionCaller(lab.admin), { group: lab.group.slug, userId: lab.observer.id, role: 'submitter' });
    expect(member.role).toBe('submitter');
    const em = await getEm();
    expect((await em.findOneOrFail(Membership, { user: lab.observer.id, group: lab.group.id })).role).toBe('submitter');
    const events = await em.find(AuditEvent, { group: lab.group.id, action: 'member.role-changed', target: `user:${lab.observer.id}` });
    expect(events).toHaveLength(1);
    expect(events[0]!.actor?.id).toBe(lab.admin.id);
    expect(events[0]!.data).toMatchObject({ from: 'observer', to: 'submitter' });
    await changeRole(await getEm(), sessionCaller(lab.admin), { group: lab.group.slug, userId: lab.observer.id, role: 'observer' });
  });

  it('non-admins may not change roles (403); non-members get 404', async () => {
    const err = await rejection(changeRole(await getEm(), sessionCaller(lab.reviewer), { group: lab.group.slug, userId: lab.observer.id, role: 'admin' }));
    expect(err.status).toBe(403);
    const outsider = await rejection(changeRole(await getEm(), sessionCaller(labB.admin), { group: lab.group.slug, userId: lab.observer.id, role: 'admin' }));
    expect(outsider.status).toBe(404);
  });

  it('the last admin cannot be demoted or removed', async () => {
    const demote = await rejection(changeRole(await getEm(), sessionCaller(lab.admin), { group: lab.group.slug, userId: lab.admin.id, role: 'reviewer' }));
    expect(demote.code).toBe('conflict');
    expect(demote.message).toMatch(/last admin/);
    const remove = await rejection(removeMember(await getEm(), sessionCaller(lab.admin), { group: lab.group.slug, userId: lab.admin.id }));
    expect(remove.code).toBe('conflict');
  });

  it('with a second admin, the first may step down', async () => {
    const em = await getEm();
    const group = await makeGroup(em, 'two-admins');
    const a = await makeUser(em, 'admin');
    const b = await makeUser(em, 'admin');
    await addMember(em, a, group, 'admin');
    await addMember(em, b, group, 'admin');
    await changeRole(await getEm(), sessionCaller(a), { group: group.slug, userId: a.id, role: 'observer' });
    // a is no longer admin: b is the last one now.
    const err = await rejection(changeRole(await getEm(), sessionCaller(b), { group: group.slug, userId: b.id, role: 'observer' }));
    expect(err.code).toBe('conflict');
  });

  it('removing a member deletes the membership, revokes their tokens for the group, and is audited', async () => {
    const em = await getEm();
    const leaver = await makeUser(em, 'leaver');
    await addMember(em, leaver, lab.group, 'submitter');
    const { id: tokenId } = await createApiToken(await getEm(), sessionCaller(leaver), { group: lab.group.slug, name: 'old laptop' });
    await removeMember(await getEm(), sessionCaller(lab.admin), { group: lab.group.slug, userId: leaver.id });
    const em2 = await getEm();
    expect(await em2.count(Membership, { user: leaver.id, group: lab.group.id })).toBe(0);
    expect((await em2.findOneOrFail(ApiToken, { id: tokenId })).revokedAt).toBeInstanceOf(Date);
    expect(await em2.count(AuditEvent, { action: 'member.removed', target: `user:${leaver.id}` })).toBe(1);
    expect(await listMyGroups(em2, leaver.id)).toEqual([]);
  });
});

describe('personal API tokens', () => {
  const probe = route({ params: z.object({ slug: z.string() }) }, async ({ em, caller, params }) => groupAccess(em, caller, { slug: params.slug }));

  it('shown once: the list has the prefix, never the token; creation is audited', async () => {
    const created = await createApiToken(await getEm(), sessionCaller(lab.submitter), { group: lab.group.slug, name: 'cluster job' });
    const list = await listMyTokens(await getEm(), lab.submitter.id);
    const row = list.find((t) => t.id === created.id)!;
    expect(row).toMatchObject({ name: 'cluster job', group: { slug: lab.group.slug }, prefix: created.token.slice(0, 9), revokedAt: null, lastUsedAt: null });
    expect(JSON.stringify(list)).not.toContain(created.token);
    const events = await (await getEm()).find(AuditEvent, { action: 'token.created', target: `token:${created.id}` });
    expect(events).toHaveLength(1);
    expect(events[0]!.actor?.id).toBe(lab.submitter.id);
  });

  it('a token reaches its own group, records lastUsedAt, and a token of group A gets 404 on group B', async () => {
    const { token, id } = await createApiToken(await getEm(), sessionCaller(lab.admin), { group: lab.group.slug, name: 'scoped' });
    const own = await probe(request(`/p/${lab.group.slug}`, { bearer: token }), routeArgs({ slug: lab.group.slug }));
    expect(own.status).toBe(200);
    expect((await own.json()).role).toBe('admin');
    expect((await (await getEm()).findOneOrFail(ApiToken, { id })).lastUsedAt).toBeInstanceOf(Date);

    // The admin is a member of B, but this token is for A only.
    const cross = await probe(request(`/p/${labB.group.slug}`, { bearer: token }), routeArgs({ slug: labB.group.slug }));
    expect(cross.status).toBe(404);
  });

  it('a revoked token is refused with 401; only its owner can revoke it', async () => {
    const { token, id } = await createApiToken(await getEm(), sessionCaller(lab.reviewer), { group: lab.group.slug, name: 'short-lived' });
    const notMine = await rejection(revokeApiToken(await getEm(), sessionCaller(lab.admin), { id }));
    expect(notMine.status).toBe(404);
    await revokeApiToken(await getEm(), sessionCaller(lab.reviewer), { id });
    const res = await listGroups(request('/api/v1/groups', { bearer: token }), routeArgs());
    expect(res.status).toBe(401);
    expect((await res.json()).error.code).toBe('unauthenticated');
    expect(await (await getEm()).count(AuditEvent, { action: 'token.revoked', target: `token:${id}` })).toBe(1);
  });

  it('an unknown or malformed token is 401', async () => {
    for (const bearer of ['bw_' + 'A'.repeat(43), 'not-ours']) {
      const res = await listGroups(request('/api/v1/groups', { bearer }), routeArgs());
      expect(res.status).toBe(401);
    }
  });

  it('a token cannot be made for a group one is not in', async () => {
    const err = await rejection(createApiToken(await getEm(), sessionCaller(labB.observer), { group: lab.group.slug, name: 'x' }));
    expect(err.status).toBe(404);
  });
});
