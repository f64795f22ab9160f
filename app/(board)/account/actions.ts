'use server';

import { revalidatePath } from 'next/cache';
import { action } from '@/lib/http/action';
import { changePassword as setPassword, updateProfile as setProfile } from '@/lib/services/account';
import { createApiToken as mint, revokeApiToken as revoke } from '@/lib/services/api-tokens';
import { changePasswordSchema, createApiTokenSchema, revokeApiTokenSchema, updateProfileSchema } from './schema';

export const updateProfile = action(updateProfileSchema, async (input, { em, user }) => {
  await setProfile(em, user, input);
  revalidatePath('/', 'layout');
  return 'Name saved.';
});

export const changePassword = action(changePasswordSchema, async (input, { em, user }) => {
  await setPassword(em, user, input);
  return 'Password changed.';
});

/** The token is in `data.token` this once; it is stored only as a hash. */
export const createApiToken = action<typeof createApiTokenSchema, { token: string }>(createApiTokenSchema, async (input, { em, caller }) => {
  const created = await mint(em, caller, input);
  revalidatePath('/account');
  return { message: 'Token created. Copy it now: it will not be shown again.', data: { token: created.token } };
});

export const revokeApiToken = action(revokeApiTokenSchema, async (input, { em, caller }) => {
  await revoke(em, caller, input);
  revalidatePath('/account');
  return 'Token revoked.';
});
