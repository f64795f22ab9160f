import Link from 'next/link';
import type { ReactNode } from 'react';

export type Crumb = { href: string; label: string };

/** A page's title block: optional breadcrumbs, the one h1, a line under it and actions on the right. */
export function PageHeader({
  title,
  crumbs,
  lead,
  actions,
  badge,
}: {
  title: ReactNode;
  crumbs?: Crumb[];
  lead?: ReactNode;
  actions?: ReactNode;
  badge?: ReactNode;
}) {
  return (
    <div className="mb-6 flex flex-wrap items-end justify-between gap-4">
      <div className="min-w-0">
        {crumbs && crumbs.length > 0 && (
          <nav aria-label="Breadcrumb" className="mb-1 text-xs text-paper-600">
            <ol className="flex flex-wrap items-center gap-1">
              {crumbs.map((c, i) => (
                <li key={c.href} className="flex items-center gap-1">
                  {i > 0 && <span aria-hidden="true">/</span>}
                  <Link href={c.href} className="text-paper-700 no-underline hover:underline">
                    {c.label}
                  </Link>
                </li>
              ))}
            </ol>
          </nav>
        )}
        <div className="flex flex-wrap items-center gap-2.5">
          <h1 className="text-xl font-semibold tracking-tight text-paper-900" data-testid="page-title">
            {title}
          </h1>
          {badge}
        </div>
        {lead && <p className="mt-1 max-w-2xl text-paper-600">{lead}</p>}
      </div>
      {actions && <div className="flex items-center gap-2">{actions}</div>}
    </div>
  );
}
