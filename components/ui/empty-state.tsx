import type { ReactNode } from 'react';
import { cx } from './cx';

export function EmptyState({
  title,
  children,
  action,
  className,
  ...rest
}: {
  title: ReactNode;
  children?: ReactNode;
  action?: ReactNode;
  className?: string;
  'data-testid'?: string;
}) {
  return (
    <div className={cx('flex flex-col items-center gap-2 px-6 py-10 text-center', className)} {...rest}>
      <svg viewBox="0 0 48 32" className="h-8 w-12 text-paper-400" aria-hidden="true">
        <path d="M4 28 H44" stroke="currentColor" strokeWidth="1.5" />
        <path d="M6 28 C 16 20, 26 16, 42 14" fill="none" stroke="currentColor" strokeWidth="1.5" strokeDasharray="3 3" />
        <circle cx="6" cy="28" r="2.5" fill="currentColor" />
      </svg>
      <p className="font-semibold text-paper-800">{title}</p>
      {children && <div className="max-w-md text-sm text-paper-600">{children}</div>}
      {action && <div className="mt-2">{action}</div>}
    </div>
  );
}
