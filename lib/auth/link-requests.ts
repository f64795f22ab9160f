/**
 * The e-mail sign-in link limit, kept in PostgreSQL so it holds across app processes: a link
 * is sent only while its address and its client are both under LINK_LIMITS in the sliding
 * window; a refused request is not counted (else a steady stream would lock an address out for
 * good). Keys are hashed: the table holds neither e-mail nor IP addresses.
 */
import { createHash } from 'node:crypto';
import { SignInLinkRequest } from '@/entities';
import type { Em } from '@/lib/db/orm';
import { normalizeEmail } from './email';
import { LINK_LIMITS, windowVerdict } from './link-limits';

export type LinkRequestVerdict = { allowed: true } | { allowed: false; limitedBy: 'email' | 'client'; retryAt: Date };

// The first half of every two-key advisory lock taken here, so they never meet another's.
const LOCK_SPACE = 0x6c6e6b31;

const keyOf = (kind: 'email' | 'client', value: string) => `${kind}:${createHash('sha256').update(value).digest('hex')}`;

/**
 * Counts one link request for `email` from `client` (null: not known, only the e-mail limit
 * applies) at `now`, or refuses it. Requests for the same keys are serialized, so parallel
 * requests cannot all slip under the limit.
 */
export async function takeLinkRequest(em: Em, who: { email: string; client: string | null }, now: Date = new Date()): Promise<LinkRequestVerdict> {
  const windowMs = LINK_LIMITS.windowMinutes * 60_000;
  const since = new Date(now.getTime() - windowMs);
  const limits: { by: 'email' | 'client'; key: string; max: number }[] = [{ by: 'email', key: keyOf('email', normalizeEmail(who.email)), max: LINK_LIMITS.perEmail }];
  if (who.client) limits.push({ by: 'client', key: keyOf('client', who.client), max: LINK_LIMITS.perClient });

  const verdict = await em.transactional(async (tx): Promise<LinkRequestVerdict> => {
    // In one order, so two requests sharing both keys cannot wait on each other.
    for (const { key } of [...limits].sort((a, b) => a.key.localeCompare(b.key))) {
      await tx.getConnection().execute('select pg_advisory_xact_lock(?, hashtext(?))', [LOCK_SPACE, key], 'all', tx.getTransactionContext());
    }
    const earlier = await tx.find(SignInLinkRequest, { key: { $in: limits.map((l) => l.key) }, at: { $gt: since } }, { fields: ['key', 'at'] });
    for (const l of limits) {
      const v = windowVerdict(earlier.filter((r) => r.key === l.key).map((r) => r.at), now, l.max, windowMs);
      if (!v.allowed) return { allowed: false, limitedBy: l.by, retryAt: v.retryAt };
    }
    for (const { key } of limits) tx.create(SignInLinkRequest, { key, at: now });
    return { allowed: true };
  });
  // Whatever has left the window counts for no one any more.
  await em.nativeDelete(SignInLinkRequest, { at: { $lte: since } });
  return verdict;
}
