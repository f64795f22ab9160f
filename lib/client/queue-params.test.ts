import { describe, expect, it } from 'vitest';
import { changeQueueState, DEFAULT_QUEUE_STATE, pageCount, queueSearch, readQueueState, spectraApiUrl } from './queue-params';

const read = (s: string) => readQueueState(new URLSearchParams(s));

describe('queue list state', () => {
  it('reads the defaults from an empty URL and writes them back as nothing', () => {
    expect(read('')).toEqual(DEFAULT_QUEUE_STATE);
    expect(queueSearch(DEFAULT_QUEUE_STATE)).toBe('');
  });

  it('round-trips every field through the URL', () => {
    const s = read('status=in-review&mine=waiting&verdict=none&screening=error&q=silicon&sort=title&page=3&pageSize=50');
    expect(s).toEqual({ status: 'in-review', mine: 'waiting', verdict: 'none', screening: 'error', q: 'silicon', sort: 'title', direction: 'asc', page: 3, pageSize: 50 });
    expect(read(queueSearch(s).slice(1))).toEqual(s);
  });

  it('falls back to defaults for values it does not know', () => {
    expect(read('status=lost&mine=yours&verdict=maybe&screening=broken&sort=-colour&page=-2&pageSize=7')).toEqual(DEFAULT_QUEUE_STATE);
    expect(read('page=2.5').page).toBe(1);
  });

  it('reads a leading "-" as descending', () => {
    expect(read('sort=-material')).toMatchObject({ sort: 'material', direction: 'desc' });
  });

  it('builds the API query with the group and every parameter', () => {
    const url = new URL(spectraApiUrl('fjordlight', read('verdict=fail&screening=error&q=a b')), 'http://x');
    expect(url.pathname).toBe('/api/v1/spectra');
    expect(Object.fromEntries(url.searchParams)).toEqual({
      group: 'fjordlight', verdict: 'fail', screening: 'error', q: 'a b', sort: '-updated', page: '1', pageSize: '25',
    });
  });

  it('asks the API for "assigned to me" or "waiting on me" as assigned=me or waiting=me', () => {
    const q = (s: string) => Object.fromEntries(new URL(spectraApiUrl('g', read(s)), 'http://x').searchParams);
    expect(q('mine=assigned')).toMatchObject({ assigned: 'me' });
    expect(q('mine=waiting')).toMatchObject({ waiting: 'me' });
    expect(q('mine=waiting')).not.toHaveProperty('assigned');
  });

  it('goes back to page 1 when the filter, search, sort or page size change, not when only the page does', () => {
    const on3 = { ...DEFAULT_QUEUE_STATE, page: 3 };
    expect(changeQueueState(on3, { status: 'returned' }).page).toBe(1);
    expect(changeQueueState(on3, { q: 'x' }).page).toBe(1);
    expect(changeQueueState(on3, { mine: 'assigned' }).page).toBe(1);
    expect(changeQueueState(on3, { screening: 'error' }).page).toBe(1);
    expect(changeQueueState(on3, { sort: 'title', direction: 'asc' }).page).toBe(1);
    expect(changeQueueState(on3, { page: 4 }).page).toBe(4);
    expect(changeQueueState(on3, { status: null }).page).toBe(3);
  });

  it('counts at least one page', () => {
    expect(pageCount(0, 25)).toBe(1);
    expect(pageCount(26, 25)).toBe(2);
  });
});
