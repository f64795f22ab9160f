import { describe, expect, it } from 'vitest';
import { addressKey, clientAddress } from './client-address';

describe('clientAddress', () => {
  it('takes the last x-forwarded-for entry: the one the app or its proxy added', () => {
    expect(clientAddress(new Headers({ 'x-forwarded-for': '203.0.113.9' }))).toBe('203.0.113.9');
    expect(clientAddress(new Headers({ 'x-forwarded-for': '10.9.9.9, 198.51.100.7' }))).toBe('198.51.100.7');
    expect(clientAddress(new Headers({ 'x-forwarded-for': 'made-up, 2001:db8:1:2::5' }))).toBe('2001:db8:1:2::/64');
  });

  it('is null without the header or with something that is not an address', () => {
    expect(clientAddress(new Headers())).toBeNull();
    expect(clientAddress(new Headers({ 'x-forwarded-for': '203.0.113.9, unknown' }))).toBeNull();
  });
});

describe('addressKey', () => {
  it('keeps IPv4, drops ports and brackets, reads IPv4-mapped IPv6 as IPv4', () => {
    expect(addressKey('192.0.2.1')).toBe('192.0.2.1');
    expect(addressKey('192.0.2.1:51234')).toBe('192.0.2.1');
    expect(addressKey('::ffff:192.0.2.1')).toBe('192.0.2.1');
    expect(addressKey('::FFFF:c000:0201')).toBe('192.0.2.1');
    expect(addressKey('[::ffff:192.0.2.1]:443')).toBe('192.0.2.1');
  });

  it('keys IPv6 by its /64, however it is written', () => {
    const key = '2001:db8:aa:bb::/64';
    expect(addressKey('2001:db8:aa:bb::1')).toBe(key);
    expect(addressKey('2001:0DB8:00aa:00bb:1234:5678:9abc:def0')).toBe(key);
    expect(addressKey('[2001:db8:aa:bb:ffff::7]:8080')).toBe(key);
    expect(addressKey('2001:db8:aa:bb::c000:201')).toBe(key);
    expect(addressKey('2001:db8:aa:bb::192.0.2.1')).toBe(key);
    expect(addressKey('fe80::1%eth0')).toBe('fe80:0:0:0::/64');
    expect(addressKey('::1')).toBe('0:0:0:0::/64');
    expect(addressKey('2001:db8:aa:bc::1')).not.toBe(key);
  });

  it('is null for text that is not an address', () => {
    for (const junk of ['', 'unknown', '999.1.1.1', '1.2.3', 'example.org', '2001:db8::g', ':::']) expect(addressKey(junk), junk).toBeNull();
  });
});
