import { ApiToken, Group, newId, User } from '@/entities';
import type { Caller } from '@/lib/auth/caller';
import { generateApiToken } from '@/lib/auth/tokens';
import type { Em } from '@/lib/db/orm';
import { AppError } from '@/lib/errors';
import { groupAccess } from './access';
import { recordAudit } from './audit';

export interface ApiTokenDto {
  id: string;
  name: string;
  group: { slug: string; name: string };
  prefix: string;
  createdAt: string;
  lastUsedAt: string | null;
  revokedAt: string | null;
}

/** Creates a token for one of the person's groups. The token is in the answer once, never again. */
export async function createApiToken(
  em: Em,
  caller: Caller,
  input: { group: string; name: string },
): Promise<{ id: string; token: string; prefix: string }> {
  // A token cannot mint tokens: only a signed-in person can.
  if (caller.via !== 'session') throw new AppError('forbidden', 'API tokens are created by a signed-in person, not by another token.');
  const { group } = await groupAccess(em, caller, { slug: input.group }, 'tokens.create');
  const { token, hash, prefix } = generateApiToken();
  const row = em.create(ApiToken, {
    id: newId(),
    user: em.getReference(User, caller.userId),
    group: em.getReference(Group, group.id),
    name: input.name.trim(),
    hash,
    prefix,
    lastUsedAt: null,
    revokedAt: null,
  });
  recordAudit(em, {
    groupId: group.id,
    actorId: caller.userId,
    action: 'token.created',
    target: `token:${row.id}`,
    data: { name: row.name, prefix },
  });
  await em.flush();
  return { id: row.id, token, prefix };
}

/** Revokes one of the person's own tokens; someone else's token is a 404. */
export async function revokeApiToken(em: Em, caller: Caller, input: { id: string }): Promise<void> {
  const row = /^[0-9a-f-]{36}$/i.test(input.id) ? await em.findOne(ApiToken, { id: input.id, user: caller.userId }) : null;
  if (!row) throw new AppError('not_found', 'No such token.');
  if (row.revokedAt) return;
  row.revokedAt = new Date();
  recordAudit(em, {
    groupId: row.group.id,
    actorId: caller.userId,
    action: 'token.revoked',
    target: `token:${row.id}`,
    data: { name: row.name, prefix: row.prefix },
  });
  await em.flush();
}

/** The person's tokens, newest first, revoked ones included (marked). */
export async function listMyTokens(em: Em, userId: string): Promise<ApiTokenDto[]> {
  const rows = await em.find(ApiToken, { user: userId }, { populate: ['group'], orderBy: { createdAt: 'desc' } });
  return rows.map((t) => ({
    id: t.id,
    name: t.name,
    group: { slug: t.group.slug, name: t.group.name },
    prefix: t.prefix,
    createdAt: t.createdAt.toISOString(),
    lastUsedAt: t.lastUsedAt?.toISOString() ?? null,
    revokedAt: t.revokedAt?.toISOString() ?? null,
  }));
}
