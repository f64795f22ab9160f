import type { ReactNode } from 'react';
import { cx } from './cx';

export type PanelProps = {
  title?: ReactNode;
  /** Heading level of the title; pages keep one h1 and panels sit under it. */
  level?: 2 | 3;
  description?: ReactNode;
  actions?: ReactNode;
  children?: ReactNode;
  className?: string;
  /** Remove the body padding (for tables that run edge to edge). */
  flush?: boolean;
  id?: string;
  'data-testid'?: string;
};

export function Panel({ title, level = 2, description, actions, children, className, flush, ...rest }: PanelProps) {
  const H = level === 2 ? 'h2' : 'h3';
  const headingId = rest.id ? `${rest.id}-title` : undefined;
  return (
    <section
      className={cx('min-w-0 rounded-lg border border-paper-300 bg-paper-0 shadow-panel', className)}
      aria-labelledby={title ? headingId : undefined}
      {...rest}
    >
      {(title || actions) && (
        <header className="flex flex-wrap items-start justify-between gap-3 border-b border-paper-200 px-4 py-3">
          <div className="min-w-0">
            {title && (
              <H id={headingId} className="text-sm font-semibold text-paper-900">
                {title}
              </H>
            )}
            {description && <p className="mt-0.5 text-xs text-paper-600">{description}</p>}
          </div>
          {actions && <div className="flex shrink-0 items-center gap-2">{actions}</div>}
        </header>
      )}
      <div className={flush ? undefined : 'px-4 py-4'}>{children}</div>
    </section>
  );
}

/** Alias: a card is a panel. */
export const Card = Panel;
