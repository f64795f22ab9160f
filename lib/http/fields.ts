/** Form and body fields shared by several schemas. */
import { z } from 'zod';
import { PASSWORD_MAX, PASSWORD_MIN } from '@/lib/auth/password';
import { roles } from '@/lib/auth/permissions';

export const emailField = z
  .string({ error: 'Enter an e-mail address.' })
  .trim()
  .toLowerCase()
  .max(320, 'At most 320 characters.')
  .pipe(z.email({ error: 'Enter a valid e-mail address.' }));

export const nameField = z
  .string({ error: 'Enter a name.' })
  .trim()
  .min(1, 'Enter a name.')
  .max(200, 'At most 200 characters.');

export const newPasswordField = z
  .string({ error: 'Enter a password.' })
  .min(PASSWORD_MIN, `At least ${PASSWORD_MIN} characters.`)
  .max(PASSWORD_MAX, `At most ${PASSWORD_MAX} characters.`);

export const roleField = z.enum(roles, { error: `Choose one of: ${roles.join(', ')}.` });

export const slugField = z
  .string({ error: 'A group is required.' })
  .trim()
  .min(1, 'A group is required.')
  .max(64)
  .regex(/^[a-z0-9][a-z0-9-]*$/, 'Not a group identifier.');

export const uuidField = z.string({ error: 'An id is required.' }).trim().uuid('Not a valid id.');

/** The random part of an invitation link (base64url). */
export const linkTokenField = z
  .string({ error: 'The invitation token is missing.' })
  .trim()
  .min(20, 'The invitation token is incomplete.')
  .max(200)
  .regex(/^[A-Za-z0-9_-]+$/, 'The invitation token is not valid.');
