/** Typed fetchers of the spectra API and the TanStack Query keys they live under. */
import { decodePlotData, type PlotData } from '@/lib/plot/wire';
import { getBytes, getJson } from './fetch-api';
import { spectraApiUrl, type QueueState } from './queue-params';
import type { ScreeningDto, SpectraPage, SpectrumDetail } from './spectra-types';

export const spectraKeys = {
  all: ['spectra'] as const,
  list: (group: string, state: QueueState) => ['spectra', 'list', group, state] as const,
  detail: (id: string) => ['spectra', 'detail', id] as const,
  screening: (revisionId: string) => ['revisions', revisionId, 'screening'] as const,
  data: (revisionId: string) => ['revisions', revisionId, 'data'] as const,
};

export function fetchSpectra(group: string, state: QueueState, signal?: AbortSignal): Promise<SpectraPage> {
  return getJson<SpectraPage>(spectraApiUrl(group, state), signal);
}

export function fetchSpectrum(id: string, signal?: AbortSignal): Promise<SpectrumDetail> {
  return getJson<SpectrumDetail>(`/api/v1/spectra/${encodeURIComponent(id)}`, signal);
}

export function fetchScreening(revisionId: string, signal?: AbortSignal): Promise<ScreeningDto> {
  return getJson<ScreeningDto>(`/api/v1/revisions/${encodeURIComponent(revisionId)}/screening`, signal);
}

export async function fetchRevisionData(revisionId: string, signal?: AbortSignal): Promise<PlotData> {
  return decodePlotData(await getBytes(`/api/v1/revisions/${encodeURIComponent(revisionId)}/data`, signal));
}
