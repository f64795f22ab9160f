'use client';

import type { InputHTMLAttributes } from 'react';
import { useFieldControl } from './field';
import { controlClasses } from './control-classes';

export type InputProps = InputHTMLAttributes<HTMLInputElement>;

export function Input({ className, id, ...rest }: InputProps) {
  const field = useFieldControl();
  return (
    <input
      id={id ?? field?.id}
      aria-describedby={field?.describedBy}
      aria-invalid={field?.invalid || undefined}
      className={controlClasses(Boolean(field?.invalid), `h-9 ${className ?? ''}`)}
      {...rest}
    />
  );
}
