/**
 * The queue's list state (filters, search, sort, page) and its two written forms: the page's
 * URL (what people bookmark and share; defaults left out) and the API query of
 * `GET /api/v1/spectra`. Anything unreadable in a URL falls back to the default rather than
 * breaking the page.
 */
import { SCREENING_STATUSES, SORT_KEYS, SPECTRUM_STATUSES, VERDICT_FILTERS, type ScreeningStatus, type SortKey, type SpectrumStatus, type VerdictFilter } from './spectra-types';

export const PAGE_SIZES = [10, 25, 50, 100] as const;

/** 'assigned': spectra the caller is an assigned reviewer of; 'waiting': those waiting on the caller. */
export const MINE_FILTERS = ['assigned', 'waiting'] as const;
export type MineFilter = (typeof MINE_FILTERS)[number];

export interface QueueState {
  status: SpectrumStatus | null;
  mine: MineFilter | null;
  verdict: VerdictFilter | null;
  /** The current revision's screening status; `error` finds the files that did not parse. */
  screening: ScreeningStatus | null;
  q: string;
  sort: SortKey;
  direction: 'asc' | 'desc';
  page: number;
  pageSize: number;
}

export const DEFAULT_QUEUE_STATE: QueueState = {
  status: null,
  mine: null,
  verdict: null,
  screening: null,
  q: '',
  sort: 'updated',
  direction: 'desc',
  page: 1,
  pageSize: 25,
};

type ReadableParams = { get(name: string): string | null };

function oneOf<T extends string>(list: readonly T[], v: string | null): T | null {
  return v !== null && (list as readonly string[]).includes(v) ? (v as T) : null;
}

export function readQueueState(params: ReadableParams): QueueState {
  const d = DEFAULT_QUEUE_STATE;
  const rawSort = params.get('sort') ?? '';
  const sort = oneOf(SORT_KEYS, rawSort.replace(/^-/, ''));
  const page = Number(params.get('page'));
  const pageSize = Number(params.get('pageSize'));
  return {
    status: oneOf(SPECTRUM_STATUSES, params.get('status')),
    mine: oneOf(MINE_FILTERS, params.get('mine')),
    verdict: oneOf(VERDICT_FILTERS, params.get('verdict')),
    screening: oneOf(SCREENING_STATUSES, params.get('screening')),
    q: (params.get('q') ?? '').slice(0, 200),
    sort: sort ?? d.sort,
    direction: sort ? (rawSort.startsWith('-') ? 'desc' : 'asc') : d.direction,
    page: Number.isInteger(page) && page >= 1 ? page : d.page,
    pageSize: (PAGE_SIZES as readonly number[]).includes(pageSize) ? pageSize : d.pageSize,
  };
}

export function sortParam(s: Pick<QueueState, 'sort' | 'direction'>): string {
  return `${s.direction === 'desc' ? '-' : ''}${s.sort}`;
}

/** The page URL's query: only what differs from the defaults, in a stable order. */
export function queueSearch(s: QueueState): string {
  const d = DEFAULT_QUEUE_STATE;
  const p = new URLSearchParams();
  if (s.status) p.set('status', s.status);
  if (s.mine) p.set('mine', s.mine);
  if (s.verdict) p.set('verdict', s.verdict);
  if (s.screening) p.set('screening', s.screening);
  if (s.q.trim()) p.set('q', s.q.trim());
  if (s.sort !== d.sort || s.direction !== d.direction) p.set('sort', sortParam(s));
  if (s.page !== d.page) p.set('page', String(s.page));
  if (s.pageSize !== d.pageSize) p.set('pageSize', String(s.pageSize));
  const text = p.toString();
  return text ? `?${text}` : '';
}

/** `GET /api/v1/spectra?…` for one group and this state. */
export function spectraApiUrl(group: string, s: QueueState): string {
  const p = new URLSearchParams({ group });
  if (s.status) p.set('status', s.status);
  if (s.mine) p.set(s.mine, 'me');
  if (s.verdict) p.set('verdict', s.verdict);
  if (s.screening) p.set('screening', s.screening);
  if (s.q.trim()) p.set('q', s.q.trim());
  p.set('sort', sortParam(s));
  p.set('page', String(s.page));
  p.set('pageSize', String(s.pageSize));
  return `/api/v1/spectra?${p.toString()}`;
}

/**
 * A change to the state. A new filter, search, sort or page size starts again at page 1:
 * page 7 of the old list means nothing in the new one.
 */
export function changeQueueState(s: QueueState, change: Partial<QueueState>): QueueState {
  const next = { ...s, ...change };
  const refilters = (['status', 'mine', 'verdict', 'screening', 'q', 'sort', 'direction', 'pageSize'] as const).some(
    (k) => k in change && change[k] !== s[k],
  );
  if (refilters && !('page' in change)) next.page = 1;
  return next;
}

export function pageCount(total: number, pageSize: number): number {
  return Math.max(1, Math.ceil(total / pageSize));
}
