/**
 * The few next-auth adapter methods used with JWT sessions and e-mail links, on our entities.
 * Each method forks its own EntityManager and returns plain objects (never the entity, so a
 * password hash cannot leave).
 */
import type { Adapter, AdapterUser, VerificationToken as NextAuthVerificationToken } from 'next-auth/adapters';
import { User, VerificationToken } from '@/entities';
import { getEm } from '@/lib/db/orm';
import { AppError } from '@/lib/errors';
import { normalizeEmail } from './email';

const uuidPattern = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

function toAdapterUser(u: User): AdapterUser {
  return { id: u.id, email: u.email, name: u.name ?? null, emailVerified: u.emailVerified ?? null };
}

export function branchwiseAdapter(): Adapter {
  return {
    async getUser(id) {
      if (!uuidPattern.test(id)) return null;
      const em = await getEm();
      const u = await em.findOne(User, { id });
      return u ? toAdapterUser(u) : null;
    },

    async getUserByEmail(email) {
      const em = await getEm();
      const u = await em.findOne(User, { email: normalizeEmail(email) });
      return u ? toAdapterUser(u) : null;
    },

    // Sign-up is by invitation only: an e-mail link never creates an account.
    async createUser() {
      throw new AppError('forbidden', 'Accounts are created by invitation only.');
    },

    async updateUser(data) {
      const em = await getEm();
      const u = await em.findOneOrFail(User, { id: data.id });
      if (data.name !== undefined) u.name = data.name;
      if (data.emailVerified !== undefined) u.emailVerified = data.emailVerified;
      await em.flush();
      return toAdapterUser(u);
    },

    async createVerificationToken(token) {
      const em = await getEm();
      // A failed send still leaves a row; clear rows that expired a day ago while we are here.
      await em.nativeDelete(VerificationToken, { expires: { $lt: new Date(Date.now() - 24 * 3600 * 1000) } });
      em.create(VerificationToken, { token: token.token, identifier: normalizeEmail(token.identifier), expires: token.expires });
      await em.flush();
      return token;
    },

    // Single use even under concurrent clicks: only the request whose delete removed the row
    // gets it back. Expired rows are returned too; next-auth checks `expires` itself.
    async useVerificationToken({ identifier, token }) {
      const em = await getEm();
      const rows = await em.getConnection().execute<{ identifier: string; token: string; expires: Date }[]>(
        'delete from verification_token where identifier = ? and token = ? returning identifier, token, expires',
        [normalizeEmail(identifier), token],
      );
      if (rows.length !== 1) return null;
      const row = rows[0]!;
      const result: NextAuthVerificationToken = { identifier: row.identifier, token: row.token, expires: new Date(row.expires) };
      return result;
    },
  };
}
