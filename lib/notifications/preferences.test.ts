import { describe, expect, it } from 'vitest';
import { defaultModes } from './kinds';
import { preferencesFromRows, resolveMode, resolvePreferences } from './preferences';

describe('preferences', () => {
  it('a choice wins over the default, per kind', () => {
    expect(resolveMode({ mention: 'off' }, 'mention')).toBe('off');
    expect(resolveMode({ mention: 'off' }, 'decision')).toBe(defaultModes.decision);
    expect(resolveMode(undefined, 'thread')).toBe('digest');
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
