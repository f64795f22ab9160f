import { z } from 'zod';
import { linkTokenField, nameField, newPasswordField } from '@/lib/http/fields';

/** A new person: name and password (with an optional confirmation field). */
export const acceptNewSchema = z
  .object({
    token: linkTokenField,
    name: nameField,
    password: newPasswordField,
    confirm: z.string().optional(),
  })
  .refine((v) => v.confirm === undefined || v.confirm === v.password, {
    path: ['confirm'],
    message: 'The two passwords differ.',
  });

/** Someone who already has an account: the token only (they are signed in). */
export const acceptExistingSchema = z.object({ token: linkTokenField });

/** Which of the two the form sent: the new-person form always has a password field. */
export const acceptInvitationSchema = z.union([acceptNewSchema, acceptExistingSchema]);

export type AcceptNewInput = z.infer<typeof acceptNewSchema>;
