import { User } from '@/entities';
import type { SessionUser } from '@/lib/auth/caller';
import { hashPassword, verifyPassword } from '@/lib/auth/password';
import type { Em } from '@/lib/db/orm';
import { AppError } from '@/lib/errors';
import { recordAudit } from './audit';

export async function getProfile(em: Em, userId: string): Promise<{ id: string; email: string; name: string | null; hasPassword: boolean }> {
  const u = await em.findOne(User, { id: userId }, { populate: ['passwordHash'] });
  if (!u) throw new AppError('unauthenticated');
  return { id: u.id, email: u.email, name: u.name ?? null, hasPassword: Boolean(u.passwordHash) };
}

export async function updateProfile(em: Em, user: SessionUser, input: { name: string }): Promise<{ name: string }> {
  const u = await em.findOneOrFail(User, { id: user.id });
  u.name = input.name.trim();
  await em.flush();
  return { name: u.name };
}

/**
 * Changes the password after checking the current one. An account made for e-mail links only
 * (no password yet) sets its first password with an empty `current`.
 */
export async function changePassword(em: Em, user: SessionUser, input: { current: string; password: string }): Promise<void> {
  const u = await em.findOneOrFail(User, { id: user.id }, { populate: ['passwordHash'] });
  if (u.passwordHash && !(await verifyPassword(u.passwordHash, input.current))) {
    throw new AppError('invalid_input', 'The current password is not right.', { fieldErrors: { current: ['The current password is not right.'] } });
  }
  u.passwordHash = await hashPassword(input.password);
  recordAudit(em, { actorId: u.id, action: 'auth.password-changed', target: `user:${u.id}` });
  await em.flush();
}
