'use client';

import { keepPreviousData, useMutation, useQueries, useQuery, useQueryClient } from '@tanstack/react-query';
import { spectraKeys } from '../spectra-api';
import * as api from './review-api';
import type { AuditFilter } from './review-api';

const { reviewKeys } = api;

export function useThreads(spectrumId: string) {
  return useQuery({ queryKey: reviewKeys.threads(spectrumId), queryFn: ({ signal }) => api.fetchThreads(spectrumId, signal), staleTime: 5_000 });
}

export function useDecisions(spectrumId: string) {
  return useQuery({ queryKey: reviewKeys.decisions(spectrumId), queryFn: ({ signal }) => api.fetchDecisions(spectrumId, signal), staleTime: 5_000 });
}

export function useReviewers(spectrumId: string) {
  return useQuery({ queryKey: reviewKeys.reviewers(spectrumId), queryFn: ({ signal }) => api.fetchReviewers(spectrumId, signal), staleTime: 5_000 });
}

/** Each finding's waiver (null when not waived), keyed by finding id. */
export function useWaivers(spectrumId: string, findingIds: readonly string[]) {
  return useQueries({
    queries: findingIds.map((id) => ({
      queryKey: reviewKeys.waiver(spectrumId, id),
      queryFn: ({ signal }: { signal: AbortSignal }) => api.fetchWaiver(id, signal),
      staleTime: 30_000,
    })),
    combine: (results) => {
      const map = new Map<string, NonNullable<(typeof results)[number]['data']>>();
      results.forEach((r, i) => {
        if (r.data) map.set(findingIds[i], r.data);
      });
      return { waivers: map, loading: results.some((r) => r.isPending), error: results.find((r) => r.error)?.error ?? null };
    },
  });
}

export function useComparison(spectrumId: string, a: string | null, b: string | null) {
  return useQuery({
    queryKey: reviewKeys.compare(spectrumId, a ?? '', b ?? ''),
    queryFn: ({ signal }) => api.fetchComparison(spectrumId, a!, b!, signal),
    enabled: Boolean(a && b && a !== b),
    staleTime: Infinity,
  });
}

export function useDerived(revisionId: string | null, enabled = true) {
  return useQuery({
    queryKey: reviewKeys.derived(revisionId ?? ''),
    queryFn: ({ signal }) => api.fetchDerived(revisionId!, signal),
    enabled: Boolean(revisionId) && enabled,
    // A screened revision's data never changes.
    staleTime: Infinity,
  });
}

export function usePolicy(slug: string) {
  return useQuery({ queryKey: reviewKeys.policy(slug), queryFn: ({ signal }) => api.fetchPolicy(slug, signal) });
}

export function useGroupAudit(slug: string, filter: AuditFilter) {
  return useQuery({
    queryKey: reviewKeys.audit(slug, filter),
    queryFn: ({ signal }) => api.fetchGroupAudit(slug, filter, signal),
    placeholderData: keepPreviousData,
  });
}

/**
 * After any review change: the spectrum (status, verdict, version), its threads, decisions,
 * reviewers, waivers and the queue may all have moved.
 */
export function useReviewRefresh(spectrumId: string) {
  const qc = useQueryClient();
  return () =>
    Promise.all([
      qc.invalidateQueries({ queryKey: spectraKeys.detail(spectrumId) }),
      qc.invalidateQueries({ queryKey: ['review', spectrumId] }),
      qc.invalidateQueries({ queryKey: ['spectra', 'list'] }),
    ]);
}

/** A mutation that refreshes the spectrum's review data when it succeeds. */
export function useReviewMutation<I, O>(spectrumId: string, fn: (input: I) => Promise<O>) {
  const refresh = useReviewRefresh(spectrumId);
  return useMutation({ mutationFn: fn, onSuccess: () => refresh() });
}
