'use client';

import { createContext, useContext, useId, type ReactNode } from 'react';
import { cx } from './cx';

type FieldControl = { id: string; describedBy?: string; invalid: boolean };

const FieldContext = createContext<FieldControl | null>(null);

/** Inside a Field, a control takes its id and its aria wiring from here. */
export function useFieldControl(): FieldControl | null {
  return useContext(FieldContext);
}

export type FieldProps = {
  label: ReactNode;
  /** Shown under the label; read out with the control. */
  hint?: ReactNode;
  /** Field errors from the server (zod); the first is shown, all are read out. */
  errors?: string[];
  /** A stable id base; generated when absent. */
  id?: string;
  className?: string;
  children: ReactNode;
};

export function Field({ label, hint, errors, id, className, children }: FieldProps) {
  const auto = useId();
  const controlId = id ?? `f${auto.replace(/[^a-zA-Z0-9_-]/g, '')}`;
  const errorId = errors?.length ? `${controlId}-error` : undefined;
  // While an error is shown it takes the hint's place (they often say the same thing).
  const hintId = hint && !errorId ? `${controlId}-hint` : undefined;
  const describedBy = [errorId, hintId].filter(Boolean).join(' ') || undefined;

  return (
    <FieldContext.Provider value={{ id: controlId, describedBy, invalid: Boolean(errorId) }}>
      <div className={cx('flex flex-col gap-1', className)}>
        <label htmlFor={controlId} className="text-xs font-semibold text-paper-800">
          {label}
        </label>
        {children}
        {hintId && (
          <p id={hintId} className="text-xs text-paper-600">
            {hint}
          </p>
        )}
        {errorId && (
          <p id={errorId} className="flex items-start gap-1 text-xs font-medium text-brick-700">
            <svg viewBox="0 0 12 12" className="mt-[3px] h-3 w-3 shrink-0" aria-hidden="true">
              <path d="M6 1 L11 10.5 H1 Z" className="fill-brick-600" />
              <path d="M6 4.5 V7.2 M6 8.6 V8.7" className="stroke-paper-0" strokeWidth="1.3" strokeLinecap="round" />
            </svg>
            <span>{errors!.join(' ')}</span>
          </p>
        )}
      </div>
    </FieldContext.Provider>
  );
}
