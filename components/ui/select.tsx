'use client';

import type { SelectHTMLAttributes } from 'react';
import { useFieldControl } from './field';
import { controlClasses } from './control-classes';

export type SelectOption = { value: string; label: string };

export type SelectProps = Omit<SelectHTMLAttributes<HTMLSelectElement>, 'size'> & {
  options: SelectOption[];
  /** Control height (the HTML `size` attribute, rows shown, is not used here). */
  size?: 'sm' | 'md';
};

export function Select({ options, className, id, size = 'md', ...rest }: SelectProps) {
  const field = useFieldControl();
  return (
    <select
      id={id ?? field?.id}
      aria-describedby={field?.describedBy}
      aria-invalid={field?.invalid || undefined}
      className={controlClasses(Boolean(field?.invalid), `${size === 'sm' ? 'h-7 text-xs' : 'h-9'} pr-7 ${className ?? ''}`)}
      {...rest}
    >
      {options.map((o) => (
        <option key={o.value} value={o.value}>
          {o.label}
        </option>
      ))}
    </select>
  );
}
