import { describe, expect, it } from 'vitest';
import { addressLimitKey } from './client-address.js';

describe('the address a sign-in limit is kept under', () => {
  it('keys IPv4 by the address itself, also when written IPv4-mapped', () => {
    expect(addressLimitKey('203.0.113.7')).toBe('203.0.113.7');
    expect(addressLimitKey('::ffff:203.0.113.7')).toBe('203.0.113.7');
  });

  it('keys every address of one IPv6 /64 alike, however it is written', () => {
    const keys = ['2001:db8:1:2::1', '2001:0db8:0001:0002:ffff:ffff:ffff:ffff', '2001:DB8:1:2:a:b:c:d', '2001:db8:1:2::1%eth0'].map(addressLimitKey);
    expect(new Set(keys)).toEqual(new Set(['2001:db8:1:2::/64']));
  });

  it('keys neighbouring /64s apart', () => {
    expect(addressLimitKey('2001:db8:1:3::1')).not.toBe(addressLimitKey('2001:db8:1:2::1'));
    expect(addressLimitKey('::1')).toBe('0:0:0:0::/64');
  });
});
