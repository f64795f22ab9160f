'use client';

import { useId } from 'react';
import { Button } from '@/components/ui/button';
import { controlClasses } from '@/components/ui/control-classes';
import { PAGE_SIZES, pageCount } from '@/lib/client/queue-params';

export interface QueuePagerProps {
  page: number;
  pageSize: number;
  total: number;
  onPage: (page: number) => void;
  onPageSize: (size: number) => void;
}

export function QueuePager({ page, pageSize, total, onPage, onPageSize }: QueuePagerProps) {
  const id = useId();
  const pages = pageCount(total, pageSize);
  const from = total === 0 ? 0 : (page - 1) * pageSize + 1;
  const to = Math.min(total, page * pageSize);
  return (
    <nav aria-label="Queue pages" className="flex flex-wrap items-center justify-between gap-3 border-t border-paper-200 px-4 py-2.5 text-xs text-paper-700">
      <p className="tabular" aria-live="polite" data-testid="queue-range">
        {total === 0 ? 'No spectra' : `${from}–${to} of ${total} ${total === 1 ? 'spectrum' : 'spectra'}`}
      </p>
      <div className="flex items-center gap-2">
        <label htmlFor={`${id}-size`} className="whitespace-nowrap text-paper-600">
          Per page
        </label>
        <div className="w-20">
          <select
            id={`${id}-size`}
            value={pageSize}
            onChange={(e) => onPageSize(Number(e.target.value))}
            className={controlClasses(false, 'h-7 pr-7 text-xs')}
            data-testid="queue-page-size"
          >
            {PAGE_SIZES.map((n) => (
              <option key={n} value={n}>
                {n}
              </option>
            ))}
          </select>
        </div>
        <Button variant="secondary" size="sm" disabled={page <= 1} onClick={() => onPage(page - 1)} data-testid="queue-prev">
          Previous
        </Button>
        <span className="tabular whitespace-nowrap" data-testid="queue-page">
          Page {Math.min(page, pages)} of {pages}
        </span>
        <Button variant="secondary" size="sm" disabled={page >= pages} onClick={() => onPage(page + 1)} data-testid="queue-next">
          Next
        </Button>
      </div>
    </nav>
  );
}
