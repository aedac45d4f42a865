import type { Request } from 'express';
import ipaddr from 'ipaddr.js';

const LOOPBACK = new Set(['127.0.0.1', '::1', '::ffff:127.0.0.1']);

/**
 * IPv6 clients are counted by their /64: a home line or a cloud machine is routinely given a
 * whole /64 (RFC 6177 / RIPE-690 practice), so anyone there can rotate through 2^64 addresses.
 */
export const IPV6_LIMIT_PREFIX = 64;

/**
 * The subject an address-based limit counts: an IPv4 address as is (IPv4-mapped IPv6 too), an
 * IPv6 address as its /64 network (`2001:db8:1:2::/64`). Anything unparsable is kept as given.
 */
export function addressBucket(address: string): string {
  if (!ipaddr.isValid(address)) return address.slice(0, 64);
  const ip = ipaddr.process(address);
  if (ip.kind() === 'ipv4') return ip.toString();
  const prefix = (ip as ipaddr.IPv6).parts.slice(0, IPV6_LIMIT_PREFIX / 16);
  return `${new ipaddr.IPv6([...prefix, 0, 0, 0, 0]).toString()}/${IPV6_LIMIT_PREFIX}`;
}

/** The client's exact address as seen through trusted proxies (Express `trust proxy`), for logs. */
export function clientIp(req: Request): string {
  return req.ip ?? req.socket.remoteAddress ?? 'unknown';
}

/**
 * The client as every address-based limit counts it (sign-in failures and the attempt limits):
 * its address through trusted proxies, IPv6 bucketed by /64. The one place limits get it from.
 */
export function clientAddress(req: Request): string {
  return addressBucket(clientIp(req));
}

/** True when the TCP peer itself is this machine (forwarding headers are not consulted). */
export function isLoopbackPeer(req: Request): boolean {
  return LOOPBACK.has(req.socket.remoteAddress ?? '');
}
