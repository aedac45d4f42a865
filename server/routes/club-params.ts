import type { Request } from 'express';
import { z } from 'zod';
import { notFound } from '../errors.js';

const uuid = z.string().uuid();

/** A uuid route parameter; a malformed one is 404 like an unknown one, so ids cannot be probed. */
export function idParam(req: Request, name: string, what: string): string {
  const parsed = uuid.safeParse((req.params as Record<string, string | undefined>)[name]);
  if (!parsed.success) throw notFound(`No such ${what}.`);
  return parsed.data;
}
