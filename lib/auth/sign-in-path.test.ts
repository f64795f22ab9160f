import { describe, expect, it } from 'vitest';
import { signInPath } from './sign-in-path';

describe('signInPath', () => {
  it('comes back to the page that was asked for, query included', () => {
    expect(signInPath('/groups/kestrel/spectra/abc')).toBe('/sign-in?callbackUrl=%2Fgroups%2Fkestrel%2Fspectra%2Fabc');
    expect(signInPath('/groups/kestrel/spectra?mine=waiting')).toBe('/sign-in?callbackUrl=%2Fgroups%2Fkestrel%2Fspectra%3Fmine%3Dwaiting');
  });

  it('keeps nothing that is not a path of this app, nor home or sign-in itself', () => {
    for (const from of [null, undefined, '', '/', '//evil.example/x', '/\\evil.example', 'https://evil.example/', '/sign-in?x=1']) {
      expect(signInPath(from), String(from)).toBe('/sign-in');
    }
  });
});
