import { z } from 'zod';
import { nameField, newPasswordField, slugField, uuidField } from '@/lib/http/fields';

export const updateProfileSchema = z.object({ name: nameField });

export const changePasswordSchema = z.object({
  // Empty for an account that has never had a password (e-mail links only).
  current: z.string().max(200).default(''),
  password: newPasswordField,
});

export const createApiTokenSchema = z.object({
  group: slugField,
  name: z.string({ error: 'Name the token.' }).trim().min(1, 'Name the token, e.g. after the script or machine.').max(80, 'At most 80 characters.'),
});

export const revokeApiTokenSchema = z.object({ id: uuidField });
