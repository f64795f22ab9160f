import { describe, expect, it } from 'vitest';
import { findingRuns } from './finding-runs';

const f = (id: string, check: string, branch: number | null, waived: unknown = null) => ({ id, check, branch, waived });

describe('findingRuns', () => {
  it('groups open findings by check and branch, two or more, largest first', () => {
    const runs = findingRuns([
      f('a', 'continuity', 0),
      f('b', 'imaginary-modes', 0),
      f('c', 'continuity', 0),
      f('d', 'continuity', 2),
      f('e', 'continuity', 0),
      f('g', 'continuity', 2),
      f('h', 'acoustic-gamma', null),
      f('i', 'acoustic-gamma', null),
    ]);
    expect(runs).toEqual([
      { check: 'continuity', branch: 0, ids: ['a', 'c', 'e'] },
      { check: 'continuity', branch: 2, ids: ['d', 'g'] },
    ]);
  });

  it('leaves waived findings out, and a run that shrinks to one disappears', () => {
    const runs = findingRuns([f('a', 'continuity', 1), f('b', 'continuity', 1, { reason: 'real' }), f('c', 'continuity', 3), f('d', 'continuity', 3)]);
    expect(runs).toEqual([{ check: 'continuity', branch: 3, ids: ['c', 'd'] }]);
  });
});
