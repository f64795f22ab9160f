'use client';

import { keepPreviousData, useQuery } from '@tanstack/react-query';
import { fetchSpectra, spectraKeys } from './spectra-api';
import type { QueueState } from './queue-params';

/**
 * One page of a group's queue. The previous page stays on screen while the next loads
 * (`placeholderData`), so sorting or paging never blanks the table.
 */
export function useSpectra(group: string, state: QueueState) {
  return useQuery({
    queryKey: spectraKeys.list(group, state),
    queryFn: ({ signal }) => fetchSpectra(group, state, signal),
    placeholderData: keepPreviousData,
    staleTime: 10_000,
  });
}
