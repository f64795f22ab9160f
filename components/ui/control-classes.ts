import { cx } from './cx';

/** Shared look of text inputs and selects; the invalid state adds a thicker brick edge. */
export function controlClasses(invalid: boolean, extra?: string) {
  return cx(
    'block w-full rounded-md border bg-paper-0 px-2.5 text-sm text-paper-900 placeholder:text-paper-500',
    'disabled:bg-paper-100 disabled:text-paper-600',
    invalid ? 'border-brick-600 ring-1 ring-brick-600' : 'border-paper-300 hover:border-paper-400',
    extra,
  );
}
