/** Typed fetchers of the review API and the TanStack Query keys they live under. */
import { getJson } from '../fetch-api';
import type {
  ComparisonDto,
  DecideResponse,
  DecisionsResponse,
  DecisionVerdict,
  DerivedResponse,
  GroupAuditResponse,
  MembersResponse,
  PointAnchor,
  PolicyDto,
  ReplyDto,
  ReviewersDto,
  ReviewStateDto,
  ThreadDto,
  UpdateThreadResponse,
  WaiveManyResponse,
  WaiveResponse,
} from './review-types';
import { sendJson } from './send-json';

const enc = encodeURIComponent;

export const reviewKeys = {
  threads: (spectrumId: string) => ['review', spectrumId, 'threads'] as const,
  decisions: (spectrumId: string) => ['review', spectrumId, 'decisions'] as const,
  reviewers: (spectrumId: string) => ['review', spectrumId, 'reviewers'] as const,
  compare: (spectrumId: string, a: string, b: string) => ['review', spectrumId, 'compare', a, b] as const,
  derived: (revisionId: string) => ['revisions', revisionId, 'derived'] as const,
  policy: (slug: string) => ['groups', slug, 'policy'] as const,
  members: (slug: string) => ['groups', slug, 'members'] as const,
  audit: (slug: string, filter: AuditFilter) => ['groups', slug, 'audit', filter] as const,
};

export const fetchThreads = (spectrumId: string, signal?: AbortSignal) =>
  getJson<{ items: ThreadDto[] }>(`/api/v1/spectra/${enc(spectrumId)}/threads`, signal);

export const openThread = (spectrumId: string, input: { anchor: PointAnchor | { finding: string } | null; body: string; blocking?: boolean }) =>
  sendJson<ThreadDto>('POST', `/api/v1/spectra/${enc(spectrumId)}/threads`, input);

export const replyToThread = (threadId: string, body: string) => sendJson<ReplyDto>('POST', `/api/v1/threads/${enc(threadId)}/replies`, { body });

export const updateThread = (threadId: string, change: { resolved?: boolean; blocking?: boolean }) =>
  sendJson<UpdateThreadResponse>('PATCH', `/api/v1/threads/${enc(threadId)}`, change);

export const waiveFinding = (findingId: string, reason: string) =>
  sendJson<WaiveResponse>('POST', `/api/v1/findings/${enc(findingId)}/waiver`, { reason });

/** Several findings of one revision with one reason, all or none. */
export const waiveFindings = (revisionId: string, findingIds: string[], reason: string) =>
  sendJson<WaiveManyResponse>('POST', `/api/v1/revisions/${enc(revisionId)}/waivers`, { findingIds, reason });

export const fetchDecisions = (spectrumId: string, signal?: AbortSignal) =>
  getJson<DecisionsResponse>(`/api/v1/spectra/${enc(spectrumId)}/decisions`, signal);

export const decide = (spectrumId: string, input: { verdict: DecisionVerdict; note: string; revision: string; version?: number }) =>
  sendJson<DecideResponse>('POST', `/api/v1/spectra/${enc(spectrumId)}/decisions`, input);

export const withdrawSpectrum = (spectrumId: string, input: { note?: string; version?: number }) =>
  sendJson<ReviewStateDto>('POST', `/api/v1/spectra/${enc(spectrumId)}/withdraw`, input);

export const reopenSpectrum = (spectrumId: string, input: { note?: string; version?: number }) =>
  sendJson<ReviewStateDto>('POST', `/api/v1/spectra/${enc(spectrumId)}/reopen`, input);

export const fetchReviewers = (spectrumId: string, signal?: AbortSignal) =>
  getJson<ReviewersDto>(`/api/v1/spectra/${enc(spectrumId)}/reviewers`, signal);

export const setReviewers = (spectrumId: string, input: { reviewers: string[]; version?: number }) =>
  sendJson<ReviewersDto>('PUT', `/api/v1/spectra/${enc(spectrumId)}/reviewers`, input);

export const fetchComparison = (spectrumId: string, a: string, b: string, signal?: AbortSignal) =>
  getJson<ComparisonDto>(`/api/v1/spectra/${enc(spectrumId)}/compare?a=${enc(a)}&b=${enc(b)}`, signal);

export const fetchDerived = (revisionId: string, signal?: AbortSignal) =>
  getJson<DerivedResponse>(`/api/v1/revisions/${enc(revisionId)}/derived`, signal);

export const fetchMembers = (slug: string, signal?: AbortSignal) => getJson<MembersResponse>(`/api/v1/groups/${enc(slug)}/members`, signal);

export const fetchPolicy = (slug: string, signal?: AbortSignal) => getJson<PolicyDto>(`/api/v1/groups/${enc(slug)}/policy`, signal);

export const savePolicy = (slug: string, change: { requiredApprovals?: number; blockingSeverities?: string[]; checks?: Record<string, Record<string, unknown>> }) =>
  sendJson<PolicyDto>('PUT', `/api/v1/groups/${enc(slug)}/policy`, change);

export interface AuditFilter {
  action?: string;
  actor?: string;
  target?: string;
  from?: string;
  to?: string;
  page: number;
  pageSize: number;
}

export function auditUrl(slug: string, f: AuditFilter): string {
  const p = new URLSearchParams();
  for (const [k, v] of Object.entries(f)) if (v !== undefined && v !== '') p.set(k, String(v));
  // A day picked as "to" includes that whole day.
  if (f.to && /^\d{4}-\d{2}-\d{2}$/.test(f.to)) p.set('to', `${f.to}T23:59:59.999`);
  return `/api/v1/groups/${enc(slug)}/audit?${p}`;
}

export const fetchGroupAudit = (slug: string, f: AuditFilter, signal?: AbortSignal) => getJson<GroupAuditResponse>(auditUrl(slug, f), signal);

/** Where the export of an approved spectrum is served. */
export const exportUrl = (spectrumId: string, format: 'yaml' | 'csv' | 'record' | 'svg') => `/api/v1/spectra/${enc(spectrumId)}/export?format=${format}`;
