import { describe, expect, it } from 'vitest';
import { defaultModes } from './kinds';
import { preferencesFromRows, resolveMode, resolveModeFor, resolvePreferences } from './preferences';

describe('preferences', () => {
  it('a choice wins over the default, per kind', () => {
    expect(resolveMode({ mention: 'off' }, 'mention')).toBe('off');
    expect(resolveMode({ mention: 'off' }, 'decision')).toBe(defaultModes.decision);
    expect(resolveMode(undefined, 'thread')).toBe('digest');
  });

  it('a mail of two kinds goes by the more eager of the two choices, and only both off silence it', () => {
    expect(resolveModeFor({ decision: 'off', outcome: 'digest' }, 'decision', 'outcome')).toBe('digest');
    expect(resolveModeFor({ decision: 'immediate', outcome: 'off' }, 'decision', 'outcome')).toBe('immediate');
    expect(resolveModeFor({ decision: 'off', outcome: 'off' }, 'decision', 'outcome')).toBe('off');
    expect(resolveModeFor({ decision: 'off' }, 'decision')).toBe('off');
  });

  it('resolves every kind', () => {
    const all = resolvePreferences({ thread: 'immediate', outcome: 'digest' });
    expect(all).toEqual({ ...defaultModes, thread: 'immediate', outcome: 'digest' });
  });

  it('ignores stored rows it does not know', () => {
    expect(preferencesFromRows([
      { kind: 'mention', mode: 'digest' },
      { kind: 'retired-kind', mode: 'off' },
      { kind: 'decision', mode: 'sometimes' },
    ])).toEqual({ mention: 'digest' });
  });
});
