import type { ReactNode } from 'react';
import { cx } from './cx';
import { Glyph, type GlyphShape } from './glyph';

export type AlertTone = 'error' | 'success' | 'info' | 'warning';

const looks: Record<AlertTone, { box: string; icon: string; shape: GlyphShape; word: string }> = {
  error: { box: 'border-brick-200 bg-brick-50 text-brick-800', icon: 'text-brick-700', shape: 'cross', word: 'Problem' },
  success: { box: 'border-moss-200 bg-moss-50 text-moss-800', icon: 'text-moss-700', shape: 'check', word: 'Done' },
  info: { box: 'border-ink-200 bg-ink-50 text-ink-900', icon: 'text-ink-700', shape: 'dot', word: 'Note' },
  warning: { box: 'border-ochre-200 bg-ochre-50 text-ochre-800', icon: 'text-ochre-700', shape: 'bang', word: 'Careful' },
};

export type AlertProps = {
  tone?: AlertTone;
  title?: ReactNode;
  children?: ReactNode;
  className?: string;
  'data-testid'?: string;
};

/**
 * A message box. Errors use role="alert" (read at once), the rest role="status".
 * Tests scope alerts to `main`: Next's route announcer is also a role="alert".
 */
export function Alert({ tone = 'info', title, children, className, ...rest }: AlertProps) {
  const look = looks[tone];
  return (
    <div
      role={tone === 'error' ? 'alert' : 'status'}
      className={cx('flex items-start gap-2.5 rounded-md border px-3 py-2.5 text-sm', look.box, className)}
      {...rest}
    >
      <span className={cx('mt-[5px] flex items-center', look.icon)}>
        <Glyph shape={look.shape} />
        <span className="sr-only">{look.word}: </span>
      </span>
      <div className="min-w-0">
        {title && <p className="font-semibold">{title}</p>}
        {children && <div className={title ? 'mt-0.5' : undefined}>{children}</div>}
      </div>
    </div>
  );
}
