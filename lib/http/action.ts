/**
 * The one wrapper for server actions used with React's useActionState. It reads the session,
 * forks the EntityManager, parses the FormData with zod (schemas use z.coerce for numbers and
 * booleans), and turns every failure into a state the form can show. Nothing is written when
 * parsing fails. `redirect()` and `notFound()` from inside an action pass through.
 */
import { unstable_rethrow } from 'next/navigation';
import type { z } from 'zod';
import { callerFromUser, type Caller, type SessionUser } from '@/lib/auth/caller';
import { getSessionUser } from '@/lib/auth/session';
import { getEm, type Em } from '@/lib/db/orm';
import { AppError } from '@/lib/errors';
import { fieldErrorsOf, toAppError } from './to-app-error';

export type ActionState<T = undefined> = {
  ok: boolean;
  message?: string;
  fieldErrors?: Record<string, string[]>;
  data?: T;
};

/** What an action body returns: nothing, a success message, or a message and data. */
export type ActionResult<T> = void | string | { message?: string; data?: T };

export interface ActionContext {
  em: Em;
  user: SessionUser;
  caller: Caller;
}

export interface PublicActionContext {
  em: Em;
  user: SessionUser | null;
}

// Declared as a method so that a form typed for FormAction<unknown> accepts an action of any T.
export type FormAction<T> = {
  bivarianceHack(prev: ActionState<T>, formData: FormData): Promise<ActionState<T>>;
}['bivarianceHack'];

/** FormData as a plain object; repeated names become arrays; React's own `$ACTION_…` keys dropped. */
export function formDataToObject(formData: FormData): Record<string, unknown> {
  const out: Record<string, unknown> = {};
  for (const [key, value] of formData.entries()) {
    if (key.startsWith('$ACTION')) continue;
    if (key in out) {
      const prev = out[key];
      out[key] = Array.isArray(prev) ? [...prev, value] : [prev, value];
    } else {
      out[key] = value;
    }
  }
  return out;
}

function toState<T>(result: ActionResult<T>): ActionState<T> {
  if (result === undefined) return { ok: true };
  if (typeof result === 'string') return { ok: true, message: result };
  return { ok: true, ...result };
}

function errorState<T>(e: unknown, where: string): ActionState<T> {
  const err = toAppError(e, where);
  const details = err.details as { fieldErrors?: Record<string, string[]> } | undefined;
  return { ok: false, message: err.message, ...(details?.fieldErrors ? { fieldErrors: details.fieldErrors } : {}) };
}

/**
 * The core, with the user given: the exported actions pass the session's user; tests call this
 * directly because they run outside a Next request.
 */
export async function runAction<S extends z.ZodType, T, U extends SessionUser | null>(
  schema: S,
  fn: (input: z.output<S>, ctx: { em: Em; user: U }) => Promise<ActionResult<T>>,
  user: U,
  input: FormData | Record<string, unknown>,
  em?: Em,
): Promise<ActionState<T>> {
  const raw = input instanceof FormData ? formDataToObject(input) : input;
  const parsed = schema.safeParse(raw);
  if (!parsed.success) {
    return { ok: false, message: 'Please correct the marked fields.', fieldErrors: fieldErrorsOf(parsed.error) };
  }
  try {
    const scoped = em ?? (await getEm());
    const result = await fn(parsed.data, { em: scoped, user });
    await scoped.flush();
    return toState(result);
  } catch (e) {
    unstable_rethrow(e);
    return errorState<T>(e, 'action');
  }
}

/** An action for signed-in people. */
export function action<S extends z.ZodType, T = undefined>(
  schema: S,
  fn: (input: z.output<S>, ctx: ActionContext) => Promise<ActionResult<T>>,
): FormAction<T> {
  return async (_prev, formData) => {
    try {
      const em = await getEm();
      const user = await getSessionUser(em);
      if (!user) throw new AppError('unauthenticated', 'Your session has ended: sign in again.');
      return await runAction<S, T, SessionUser>(schema, (input, ctx) => fn(input, { ...ctx, caller: callerFromUser(ctx.user) }), user, formData, em);
    } catch (e) {
      unstable_rethrow(e);
      return errorState<T>(e, 'action');
    }
  };
}

/** An action that signed-out visitors may use too (accepting an invitation). */
export function publicAction<S extends z.ZodType, T = undefined>(
  schema: S,
  fn: (input: z.output<S>, ctx: PublicActionContext) => Promise<ActionResult<T>>,
): FormAction<T> {
  return async (_prev, formData) => {
    try {
      const em = await getEm();
      const user = await getSessionUser(em);
      return await runAction<S, T, SessionUser | null>(schema, fn, user, formData, em);
    } catch (e) {
      unstable_rethrow(e);
      return errorState<T>(e, 'action');
    }
  };
}
