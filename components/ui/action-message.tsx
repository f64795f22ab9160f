import { Alert } from './alert';

type ResultLike = { ok: boolean; message?: string } | null | undefined;

/**
 * The live region under a form: always in the DOM so screen readers hear what appears in it.
 * Shows the action's message as success or error.
 */
export function ActionMessage({ state, className, testId }: { state: ResultLike; className?: string; testId?: string }) {
  return (
    <div aria-live="polite" className={className}>
      {state?.message && (
        <Alert tone={state.ok ? 'success' : 'error'} data-testid={testId}>
          {state.message}
        </Alert>
      )}
    </div>
  );
}
