import { describe, expect, it } from 'vitest';
import { loadConfig } from '../../server/config.js';
import { addressBucket } from '../../server/middleware/client-address.js';
import { describeTrustProxy } from '../../server/security/trust-proxy.js';

const production = { NODE_ENV: 'production' as const, DATABASE_URL: 'postgres://u:p@127.0.0.1:5432/db', APP_URL: 'https://shoalshift.example', SESSION_SECRET: 'x'.repeat(40), UNSUBSCRIBE_SECRET: 'u'.repeat(40) };
const development = { NODE_ENV: 'development' as const, DATABASE_URL: 'postgres://u:p@127.0.0.1:5432/db' };

describe('the address every limit counts', () => {
  it('is an IPv4 address as is, and an IPv6 address as its /64 network', () => {
    expect(addressBucket('203.0.113.7')).toBe('203.0.113.7');
    expect(addressBucket('::ffff:203.0.113.7'), 'IPv4-mapped IPv6 is the IPv4 client').toBe('203.0.113.7');
    expect(addressBucket('2001:db8:1:2:3:4:5:6')).toBe('2001:db8:1:2::/64');
    expect(addressBucket('2001:0DB8:0001:0002:ffff:ffff:ffff:ffff')).toBe('2001:db8:1:2::/64');
    expect(addressBucket('2001:db8:1:3::1')).toBe('2001:db8:1:3::/64');
    expect(addressBucket('fe80::1%eth0')).toBe('fe80::/64');
    expect(addressBucket('unknown')).toBe('unknown');
  });
});

describe('TRUST_PROXY', () => {
  it('is refused as true in production, with a message saying what to give instead', () => {
    expect(() => loadConfig({ ...production, TRUST_PROXY: 'true' })).toThrow(/TRUST_PROXY must not be true in production .*number of proxies/);
  });

  it('takes a hop count, false, or a list of addresses, subnets and named ranges', () => {
    expect(loadConfig({ ...production, TRUST_PROXY: '1' }).trustProxy).toBe(1);
    expect(loadConfig({ ...production, TRUST_PROXY: 'false' }).trustProxy).toBe(false);
    expect(loadConfig({ ...production, TRUST_PROXY: '10.0.0.0/8, loopback,2001:db8::/32' }).trustProxy).toBe('10.0.0.0/8, loopback,2001:db8::/32');
    expect(loadConfig(production).trustProxy).toBe('loopback');
  });

  it('names a list entry that is not an address, a subnet or a known range, in any environment', () => {
    expect(() => loadConfig({ ...development, TRUST_PROXY: 'loopback,10.0.0.0/33' })).toThrow(/TRUST_PROXY has "10\.0\.0\.0\/33"/);
    expect(() => loadConfig({ ...development, TRUST_PROXY: 'yes' })).toThrow(/TRUST_PROXY has "yes"/);
  });

  it('is accepted as true outside production (local experiments), and the boot log says what it means', () => {
    expect(loadConfig({ ...development, TRUST_PROXY: 'true' }).trustProxy).toBe(true);
    expect(describeTrustProxy(true)).toMatch(/every X-Forwarded-For/);
    expect(describeTrustProxy(1)).toMatch(/1 nearest hop/);
    expect(describeTrustProxy('loopback')).toBe('proxies at loopback are trusted');
  });
});
