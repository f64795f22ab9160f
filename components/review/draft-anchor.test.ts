import { describe, expect, it } from 'vitest';
import { draftAnchorText, draftPlace, type DraftAnchor } from './draft-anchor';

const spectrum: DraftAnchor = { kind: 'spectrum' };
const point: DraftAnchor = { kind: 'point', revision: 'r', revisionNumber: 2, index: 4, branch: 1, frequencyTHz: 3.2 };
const finding: DraftAnchor = { kind: 'finding', finding: 'f', label: 'imaginary-modes (q-point 3)' };

describe('draftPlace', () => {
  it('a thread on the spectrum can be written whatever the screening: pending, failed or done', () => {
    for (const s of [undefined, 'pending', 'error', 'done'] as const) expect(draftPlace(spectrum, s, true)).toBe('threads');
  });
  it('points and findings only beside a screened plot', () => {
    expect(draftPlace(point, 'done', true)).toBe('plot');
    expect(draftPlace(finding, 'done', true)).toBe('plot');
    for (const s of [undefined, 'pending', 'error'] as const) {
      expect(draftPlace(point, s, true)).toBeNull();
      expect(draftPlace(finding, s, true)).toBeNull();
    }
  });
  it('nothing without a draft or without a revision to hang it on', () => {
    expect(draftPlace(null, 'done', true)).toBeNull();
    expect(draftPlace(spectrum, undefined, false)).toBeNull();
  });
});

describe('draftAnchorText', () => {
  it('says where the thread will sit, in the page unit', () => {
    expect(draftAnchorText(point, 'THz')).toBe('q-point 4, branch 1 at 3.200 THz (revision 2)');
    expect(draftAnchorText(finding, 'THz')).toBe('the finding imaginary-modes (q-point 3)');
    expect(draftAnchorText(spectrum, 'meV')).toBe('the spectrum as a whole');
  });
});
