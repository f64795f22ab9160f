import type { ActionState, FormAction as ServerFormAction } from '@/lib/http/action';

export type { ActionState };

/** A server action as forms receive it (through useActionState). */
export type FormAction<T = unknown> = ServerFormAction<T>;

/** The state before the first submit: nothing to show. */
export const idle: ActionState<never> = { ok: false };
