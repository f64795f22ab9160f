'use client';

import Link from 'next/link';
import { usePathname } from 'next/navigation';
import type { ReactNode } from 'react';
import { cx } from '@/components/ui/cx';

/** A header link that marks itself current (aria-current and an underline bar, not colour alone). */
export function NavLink({
  href,
  exact,
  children,
  testId,
}: {
  href: string;
  exact?: boolean;
  children: ReactNode;
  testId?: string;
}) {
  const pathname = usePathname();
  const current = exact ? pathname === href : pathname === href || pathname.startsWith(`${href}/`);
  return (
    <Link
      href={href}
      aria-current={current ? 'page' : undefined}
      data-testid={testId}
      className={cx(
        // The ring sits inside: the header's scrolling nav would clip one drawn outside the link.
        'relative inline-flex h-12 items-center whitespace-nowrap px-2.5 text-sm no-underline focus-visible:-outline-offset-4',
        current ? 'font-semibold text-paper-50' : 'text-ink-100 hover:text-paper-50',
      )}
    >
      {children}
      {current && <span className="absolute inset-x-2 bottom-0 h-[3px] rounded-t bg-ember-300" aria-hidden="true" />}
    </Link>
  );
}
