import type { ButtonHTMLAttributes } from 'react';
import { cx } from './cx';

export type ButtonVariant = 'primary' | 'secondary' | 'quiet' | 'danger';
export type ButtonSize = 'sm' | 'md';

const base =
  'inline-flex items-center justify-center gap-1.5 rounded-md font-medium no-underline transition-colors ' +
  'disabled:cursor-not-allowed disabled:opacity-60 whitespace-nowrap';

const variants: Record<ButtonVariant, string> = {
  primary: 'bg-ink-800 text-paper-50 hover:bg-ink-700 active:bg-ink-900 border border-ink-900',
  secondary: 'bg-paper-0 text-ink-800 border border-paper-300 hover:border-ink-400 hover:bg-ink-50',
  quiet: 'bg-transparent text-ink-700 border border-transparent hover:bg-ink-50',
  danger: 'bg-paper-0 text-brick-700 border border-brick-200 hover:bg-brick-50 hover:border-brick-600',
};

const sizes: Record<ButtonSize, string> = {
  sm: 'h-7 px-2.5 text-xs',
  md: 'h-9 px-3.5 text-sm',
};

/** Classes for anything that should look like a button (a Link, a label). */
export function buttonClasses(variant: ButtonVariant = 'primary', size: ButtonSize = 'md', extra?: string) {
  return cx(base, variants[variant], sizes[size], extra);
}

export type ButtonProps = ButtonHTMLAttributes<HTMLButtonElement> & {
  variant?: ButtonVariant;
  size?: ButtonSize;
};

export function Button({ variant = 'primary', size = 'md', className, type = 'button', ...rest }: ButtonProps) {
  return <button type={type} className={buttonClasses(variant, size, className)} {...rest} />;
}
