import type { ActionState } from '@/lib/http/action';

export type { ActionState };

/** A server action as forms receive it (through useActionState). */
export type FormAction<T = unknown> = (prev: ActionState<T>, formData: FormData) => Promise<ActionState<T>>;

export const idle: ActionState<never> = { ok: false };
