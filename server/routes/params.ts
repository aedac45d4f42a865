import type { Request } from 'express';
import type { DataSource } from 'typeorm';
import { z } from 'zod';
import type { Tank } from '../entities/tank.js';
import { notFound } from '../errors.js';
import { currentUser } from '../middleware/require-auth.js';
import { findOwnPlan, type OwnPlan } from '../services/plans.js';
import { findOwnTank } from '../services/tanks.js';

/*
 * Route parameters, read one way everywhere. Names say what they hold (`:tankId`, `:planId`,
 * `:clubId`, …), never a bare `:id`. A malformed id answers the same 404 as an unknown one, so
 * ids cannot be probed.
 */

const uuid = z.string().uuid();
/** Invite and share-link tokens are base64url of 32 bytes; anything else is not worth a look-up. */
const TOKEN = /^[A-Za-z0-9_-]{43}$/;

const raw = (req: Request, name: string): unknown => (req.params as Record<string, string | undefined>)[name];

/** The uuid in `:name`; 404 with `notFoundMessage` when it is missing or malformed. */
export function uuidParam(req: Request, name: string, notFoundMessage: string): string {
  const parsed = uuid.safeParse(raw(req, name));
  if (!parsed.success) throw notFound(notFoundMessage);
  return parsed.data;
}

/** `uuidParam` with the usual wording: "No such <what>." */
export function idParam(req: Request, name: string, what: string): string {
  return uuidParam(req, name, `No such ${what}.`);
}

/** The secret token in `:name`; 404 with `notFoundMessage` unless it has a token's shape. */
export function tokenParam(req: Request, name: string, notFoundMessage: string): string {
  const value = raw(req, name);
  if (typeof value !== 'string' || !TOKEN.test(value)) throw notFound(notFoundMessage);
  return value;
}

/** The signed-in keeper's own tank from `:tankId`; another keeper's, a missing one and a malformed id are all 404. */
export async function ownTankParam(ds: DataSource, req: Request): Promise<Tank> {
  const tank = await findOwnTank(ds, currentUser(req).id, idParam(req, 'tankId', 'tank'));
  if (!tank) throw notFound('No such tank.');
  return tank;
}

/** The signed-in keeper's own plan from `:planId` (same 404 rule). */
export async function ownPlanParam(ds: DataSource, req: Request): Promise<OwnPlan> {
  const own = await findOwnPlan(ds, currentUser(req).id, idParam(req, 'planId', 'plan'));
  if (!own) throw notFound('No such plan.');
  return own;
}
