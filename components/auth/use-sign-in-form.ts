'use client';

import { useState, type FormEvent } from 'react';
import type { z } from 'zod';
import { fieldErrorsOf, type FieldErrors } from './sign-in-schema';

const UNREACHABLE = 'Could not reach the server. Check your connection and try again.';

/**
 * What the password and link sign-in forms share: read `fields`, check them with `schema` (field
 * errors under the inputs), then `send`. `send` answers null when it is navigating away (the
 * button stays busy until the page changes) or the message to show under the form.
 */
export function useSignInForm<S extends z.ZodType>(schema: S, fields: readonly string[], send: (data: z.output<S>) => Promise<string | null>) {
  const [errors, setErrors] = useState<FieldErrors>({});
  const [message, setMessage] = useState<string | null>(null);
  const [pending, setPending] = useState(false);

  async function onSubmit(event: FormEvent<HTMLFormElement>) {
    event.preventDefault();
    const form = new FormData(event.currentTarget);
    const parsed = schema.safeParse(Object.fromEntries(fields.map((f) => [f, form.get(f)])));
    setMessage(null);
    if (!parsed.success) {
      setErrors(fieldErrorsOf(parsed.error));
      return;
    }
    setErrors({});
    setPending(true);
    try {
      const problem = await send(parsed.data);
      if (problem === null) return;
      setMessage(problem);
    } catch {
      setMessage(UNREACHABLE);
    }
    setPending(false);
  }

  return { errors, message, pending, onSubmit };
}
