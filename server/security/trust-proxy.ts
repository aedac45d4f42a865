import ipaddr from 'ipaddr.js';

/** The range names Express's `trust proxy` (proxy-addr) knows besides addresses and subnets. */
const NAMED_RANGES = new Set(['loopback', 'linklocal', 'uniquelocal']);

const isAddressOrSubnet = (entry: string) => NAMED_RANGES.has(entry) || ipaddr.isValid(entry) || ipaddr.isValidCIDR(entry);

/**
 * What is wrong with a TRUST_PROXY value, or null. Accepted: a hop count (`1`), `false`, or a
 * comma-separated list of addresses, subnets and the names loopback/linklocal/uniquelocal.
 * `true` trusts every X-Forwarded-For, so any client could pick the address the limits count;
 * it is refused in production and accepted elsewhere only for local experiments.
 */
export function trustProxyProblem(value: string, env: 'development' | 'test' | 'production'): string | null {
  if (value === 'true') {
    return env === 'production'
      ? 'must not be true in production (it trusts any X-Forwarded-For, so clients choose the address every limit counts): give the number of proxies in front of the server (e.g. 1) or their addresses/subnets (e.g. 10.0.0.0/8,loopback)'
      : null;
  }
  if (value === 'false' || /^\d+$/.test(value)) return null;
  const bad = value
    .split(',')
    .map((s) => s.trim())
    .filter((s) => !isAddressOrSubnet(s));
  return bad.length === 0 ? null : `has ${bad.map((b) => JSON.stringify(b)).join(', ')}, which is not a hop count, an address, a subnet, loopback, linklocal or uniquelocal`;
}

/** Plain words for the boot log: whose X-Forwarded-For the server believes. */
export function describeTrustProxy(setting: string | number | boolean): string {
  if (setting === true) return 'every X-Forwarded-For is believed (not for production)';
  if (setting === false || setting === 0) return 'no proxy: the TCP peer is the client';
  if (typeof setting === 'number') return `the ${setting} nearest hop(s) are trusted proxies`;
  return `proxies at ${setting} are trusted`;
}
