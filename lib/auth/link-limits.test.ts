import { describe, expect, it } from 'vitest';
import { windowVerdict } from './link-limits';

const minute = 60_000;
const t0 = new Date('2026-03-02T09:00:00Z');
const at = (minutes: number) => new Date(t0.getTime() + minutes * minute);

describe('windowVerdict', () => {
  it('lets max requests through in a window, refuses the next until the oldest has left it', () => {
    const earlier = [at(0), at(1), at(2), at(3), at(4)];
    expect(windowVerdict(earlier.slice(0, 4), at(5), 5, 15 * minute)).toEqual({ allowed: true });
    expect(windowVerdict(earlier, at(5), 5, 15 * minute)).toEqual({ allowed: false, retryAt: at(15) });
    expect(windowVerdict(earlier, at(14.99), 5, 15 * minute).allowed).toBe(false);
    // At exactly 15 minutes the first request is no longer inside the window.
    expect(windowVerdict(earlier, at(15), 5, 15 * minute)).toEqual({ allowed: true });
  });

  it('ignores order and requests older than the window', () => {
    const earlier = [at(4), at(-30), at(0), at(3), at(-16), at(1)];
    expect(windowVerdict(earlier, at(5), 4, 15 * minute)).toEqual({ allowed: false, retryAt: at(15) });
    expect(windowVerdict(earlier, at(5), 5, 15 * minute)).toEqual({ allowed: true });
  });

  it('with more in the window than the limit (a lowered limit) waits for enough of them to leave', () => {
    const earlier = [at(0), at(1), at(2), at(3)];
    expect(windowVerdict(earlier, at(4), 2, 15 * minute)).toEqual({ allowed: false, retryAt: at(17) });
  });
});
