import type { Request } from 'express';

const LOOPBACK = new Set(['127.0.0.1', '::1', '::ffff:127.0.0.1']);

/** The client's address as seen through trusted proxies (Express `trust proxy`). */
export function clientAddress(req: Request): string {
  return req.ip ?? req.socket.remoteAddress ?? 'unknown';
}

/** True when the TCP peer itself is this machine (forwarding headers are not consulted). */
export function isLoopbackPeer(req: Request): boolean {
  return LOOPBACK.has(req.socket.remoteAddress ?? '');
}
