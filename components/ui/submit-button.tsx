'use client';

import { useFormStatus } from 'react-dom';
import { Button, type ButtonProps } from './button';

/** A submit button that disables itself and says so while its form is being sent. */
export function SubmitButton({
  children,
  pendingLabel,
  disabled,
  pending: pendingProp,
  ...rest
}: ButtonProps & { pendingLabel?: string; /** For forms submitted through onSubmit (useFormAction). */ pending?: boolean }) {
  const status = useFormStatus();
  const pending = pendingProp || status.pending;
  return (
    <Button type="submit" disabled={pending || disabled} aria-disabled={pending || disabled} {...rest}>
      {pending && (
        <svg viewBox="0 0 16 16" className="h-3.5 w-3.5 animate-spin" aria-hidden="true">
          <circle cx="8" cy="8" r="6" fill="none" stroke="currentColor" strokeOpacity="0.3" strokeWidth="2" />
          <path d="M8 2 A6 6 0 0 1 14 8" fill="none" stroke="currentColor" strokeWidth="2" strokeLinecap="round" />
        </svg>
      )}
      {pending && pendingLabel ? pendingLabel : children}
    </Button>
  );
}
