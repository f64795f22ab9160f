'use client';

import { keepPreviousData, useMutation, useQuery, useQueryClient, type QueryKey } from '@tanstack/react-query';
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

/** The group's members (for @-mentions); asked for only once `enabled`, then shared by every box. */
export function useGroupMembers(slug: string, enabled = true) {
  return useQuery({ queryKey: reviewKeys.members(slug), queryFn: ({ signal }) => api.fetchMembers(slug, signal), enabled, staleTime: 60_000 });
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
 * reviewers and the queue may all have moved; `also` names further queries the change touches.
 */
export function useReviewRefresh(spectrumId: string, also: readonly QueryKey[] = []) {
  const qc = useQueryClient();
  return () =>
    Promise.all([
      qc.invalidateQueries({ queryKey: spectraKeys.detail(spectrumId) }),
      qc.invalidateQueries({ queryKey: ['review', spectrumId] }),
      qc.invalidateQueries({ queryKey: ['spectra', 'list'] }),
      ...also.map((queryKey) => qc.invalidateQueries({ queryKey })),
    ]);
}

/** A mutation that refreshes the spectrum's review data (and the queries in `also`) when it succeeds. */
export function useReviewMutation<I, O>(spectrumId: string, fn: (input: I) => Promise<O>, also: readonly QueryKey[] = []) {
  const refresh = useReviewRefresh(spectrumId, also);
  return useMutation({ mutationFn: fn, onSuccess: () => refresh() });
}
