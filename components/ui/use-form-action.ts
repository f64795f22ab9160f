'use client';

import { startTransition, useActionState, type FormEvent } from 'react';
import type { ActionState } from '@/lib/http/action';
import { idle, type FormAction } from './action-types';

/**
 * useActionState for a form that keeps what the person typed when the server refuses it.
 * React resets a form after its `action` runs; submitting through onSubmit instead avoids that,
 * while `action` stays on the form so it still posts without JavaScript.
 */
export function useFormAction<T = unknown>(action: FormAction<T>) {
  const [state, dispatch, pending] = useActionState<ActionState<T>, FormData>(action, idle as ActionState<T>);
  function onSubmit(event: FormEvent<HTMLFormElement>) {
    if (event.defaultPrevented) return;
    event.preventDefault();
    const data = new FormData(event.currentTarget);
    startTransition(() => dispatch(data));
  }
  return { state, formAction: dispatch, onSubmit, pending };
}
