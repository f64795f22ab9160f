'use client';

import { useQuery } from '@tanstack/react-query';
import { fetchScreening, spectraKeys } from './spectra-api';

/** How often to ask while a revision is still being screened. */
export const SCREENING_POLL_MS = 1500;

/**
 * A revision's screening. Asks again every SCREENING_POLL_MS while it is `pending` and stops
 * once it is `done` or `error` (both are final for a revision).
 */
export function useScreening(revisionId: string | null | undefined) {
  return useQuery({
    queryKey: spectraKeys.screening(revisionId ?? ''),
    queryFn: ({ signal }) => fetchScreening(revisionId!, signal),
    enabled: Boolean(revisionId),
    refetchInterval: (query) => (query.state.data?.status === 'pending' || (!query.state.data && !query.state.error) ? SCREENING_POLL_MS : false),
    // Final answers never change; a pending one is refreshed by the interval above.
    staleTime: Infinity,
  });
}
