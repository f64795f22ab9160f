/**
 * Personal API tokens: `bw_` + 32 random bytes (base64url). Shown once; stored as sha256;
 * scoped to one group; revocable. Sent as `Authorization: Bearer <token>`.
 */
import { ApiToken } from '@/entities';
import type { Em } from '@/lib/db/orm';
import { AppError } from '@/lib/errors';
import type { Caller } from './caller';
import { newSecret, sha256Hex } from './secret-token';

export const TOKEN_PREFIX = 'bw_';

export function generateApiToken(): { token: string; hash: string; prefix: string } {
  const token = TOKEN_PREFIX + newSecret(32);
  return { token, hash: sha256Hex(token), prefix: token.slice(0, TOKEN_PREFIX.length + 6) };
}

export function bearerFrom(req: Request): string | null {
  const header = req.headers.get('authorization');
  if (!header) return null;
  const match = /^Bearer\s+(\S+)\s*$/i.exec(header);
  if (!match) throw new AppError('unauthenticated', 'The Authorization header must be "Bearer <token>".');
  return match[1]!;
}

// lastUsedAt is a hint for the owner, not an audit record: write it at most once a minute.
const LAST_USED_RESOLUTION_MS = 60_000;

/** The caller a token stands for, or 401 for an unknown or revoked token. */
export async function authenticateApiToken(em: Em, token: string): Promise<Caller> {
  const row = token.startsWith(TOKEN_PREFIX)
    ? await em.findOne(ApiToken, { hash: sha256Hex(token) }, { populate: ['user'] })
    : null;
  if (!row || row.revokedAt) throw new AppError('unauthenticated', 'The API token is unknown or revoked.');
  const now = new Date();
  if (!row.lastUsedAt || now.getTime() - row.lastUsedAt.getTime() > LAST_USED_RESOLUTION_MS) {
    await em.nativeUpdate(ApiToken, { id: row.id }, { lastUsedAt: now });
  }
  return {
    userId: row.user.id,
    email: row.user.email,
    name: row.user.name ?? null,
    via: 'token',
    tokenId: row.id,
    tokenGroupId: row.group.id,
  };
}
