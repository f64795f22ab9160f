'use client';

import Link from 'next/link';
import { usePathname, useRouter, useSearchParams } from 'next/navigation';
import { useCallback, useMemo } from 'react';
import { Alert } from '@/components/ui/alert';
import { buttonClasses } from '@/components/ui/button';
import { EmptyState } from '@/components/ui/empty-state';
import { Panel } from '@/components/ui/panel';
import { changeQueueState, queueSearch, readQueueState, type QueueState } from '@/lib/client/queue-params';
import { useSpectra } from '@/lib/client/use-spectra';
import { QueuePager } from './queue-pager';
import { QueueToolbar } from './queue-toolbar';
import { SpectraTable } from './spectra-table';

export interface SpectraQueueProps {
  group: string;
  groupName: string;
  /** Computed on the server from the caller's role. */
  canCreate: boolean;
}

/**
 * The group's review queue. The list state lives in the URL (replaced, not pushed, so the back
 * button leaves the queue rather than stepping through every keystroke); the rows come from
 * `GET /api/v1/spectra`.
 */
export function SpectraQueue({ group, groupName, canCreate }: SpectraQueueProps) {
  const router = useRouter();
  const pathname = usePathname();
  const params = useSearchParams();
  const state = useMemo(() => readQueueState(params), [params]);
  const query = useSpectra(group, state);

  const change = useCallback(
    (c: Partial<QueueState>) => {
      const next = changeQueueState(readQueueState(new URLSearchParams(window.location.search)), c);
      router.replace(`${pathname}${queueSearch(next)}`, { scroll: false });
    },
    [router, pathname],
  );

  const newButton = canCreate ? (
    <Link href={`/groups/${group}/spectra/new`} className={buttonClasses('primary')} data-testid="new-spectrum">
      New spectrum
    </Link>
  ) : null;

  const data = query.data;
  const filtered = Boolean(state.status || state.verdict || state.q);

  return (
    <Panel flush title="Queue" description={`Spectra of ${groupName}, newest change first unless sorted otherwise`} actions={newButton} data-testid="spectra-queue">
      <QueueToolbar state={state} onChange={change} />
      {query.isError && !data ? (
        <div className="p-4">
          <Alert tone="error" title="The queue could not be loaded">
            {query.error.message}
          </Alert>
        </div>
      ) : !data ? (
        <p className="px-4 py-10 text-center text-paper-600" role="status">
          Loading the queue…
        </p>
      ) : data.items.length === 0 ? (
        filtered ? (
          <EmptyState title="No spectrum matches" data-testid="queue-empty">
            Nothing in this group has that status, verdict or text. Clear the filters to see the whole queue.
          </EmptyState>
        ) : (
          <EmptyState title="No spectra yet" data-testid="queue-empty" action={newButton}>
            {canCreate
              ? 'Upload a band file with its metadata; screening runs at once and reviewers see it here.'
              : 'When submitters upload band files, they appear here with their screening verdict.'}
          </EmptyState>
        )
      ) : (
        <>
          <SpectraTable
            group={group}
            items={data.items}
            total={data.total}
            state={state}
            stale={query.isPlaceholderData}
            caption={`Spectra of ${groupName}`}
            onSort={(sort, direction) => change({ sort, direction })}
          />
          <QueuePager
            page={state.page}
            pageSize={state.pageSize}
            total={data.total}
            onPage={(page) => change({ page })}
            onPageSize={(pageSize) => change({ pageSize })}
          />
        </>
      )}
      {query.isError && data && (
        <div className="border-t border-paper-200 p-3">
          <Alert tone="error">{query.error.message}</Alert>
        </div>
      )}
    </Panel>
  );
}
