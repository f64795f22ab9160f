'use client';

import { useQuery } from '@tanstack/react-query';
import { fetchSpectrum, spectraKeys } from './spectra-api';
import type { SpectrumDetail } from './spectra-types';

/** One spectrum; the server page hands its first copy in so the page paints without waiting. */
export function useSpectrum(id: string, initialData?: SpectrumDetail) {
  return useQuery({
    queryKey: spectraKeys.detail(id),
    queryFn: ({ signal }) => fetchSpectrum(id, signal),
    initialData,
    staleTime: 5_000,
  });
}
