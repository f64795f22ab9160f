'use client';

import { useQuery } from '@tanstack/react-query';
import { fetchRevisionData, spectraKeys } from './spectra-api';

/** The decoded plot data of a screened revision; fetched only when `enabled` (screening done). */
export function useRevisionData(revisionId: string | null | undefined, enabled: boolean) {
  return useQuery({
    queryKey: spectraKeys.data(revisionId ?? ''),
    queryFn: ({ signal }) => fetchRevisionData(revisionId!, signal),
    enabled: Boolean(revisionId) && enabled,
    // A screened revision's data never changes.
    staleTime: Infinity,
    gcTime: 10 * 60_000,
  });
}
