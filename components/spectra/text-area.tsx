'use client';

import type { Ref, TextareaHTMLAttributes } from 'react';
import { controlClasses } from '@/components/ui/control-classes';
import { useFieldControl } from '@/components/ui/field';

/** A multi-line control in a Field, with the same look and aria wiring as the design system's Input. */
export function TextArea({ className, id, rows = 4, ...rest }: TextareaHTMLAttributes<HTMLTextAreaElement> & { ref?: Ref<HTMLTextAreaElement> }) {
  const field = useFieldControl();
  return (
    <textarea
      id={id ?? field?.id}
      rows={rows}
      aria-describedby={field?.describedBy}
      aria-invalid={field?.invalid || undefined}
      className={controlClasses(Boolean(field?.invalid), `py-2 leading-5 ${className ?? ''}`)}
      {...rest}
    />
  );
}
