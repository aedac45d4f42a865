import type { DataSource } from 'typeorm';
import type { Db } from '../data-source.js';
import type { ShareableType, SharedView } from '../../shared/schemas/share.js';
import { notFound } from '../errors.js';
import { Lesson } from '../entities/lesson.js';
import { Livestock } from '../entities/livestock.js';
import { Plan } from '../entities/plan.js';
import { ShareLink } from '../entities/share-link.js';
import { Tank } from '../entities/tank.js';
import { authorName, canManageLesson, loadLesson } from './lessons.js';
import { scenarioFromPlanOrNull } from './scenario-from-plan.js';
import { newLinkToken, sha256Hex } from './secret-tokens.js';

const NO_SUCH_LINK = 'This link does not work: it was revoked, has expired, or is mistyped.';

/** 404 unless the user may share the item: the plan's tank owner, or a lesson's manager. */
export async function assertMayShare(ds: Db, userId: string, itemType: ShareableType, itemId: string): Promise<void> {
  if (itemType === 'plan') {
    const rows: unknown[] = await ds.query(`SELECT 1 FROM plans p JOIN tanks t ON t.id = p.tank_id WHERE p.id = $1 AND t.owner_id = $2`, [itemId, userId]);
    if (rows.length === 0) throw notFound('No such plan.');
    return;
  }
  const { lesson, membership } = await loadLesson(ds, userId, itemId);
  if (!canManageLesson(lesson, membership)) throw notFound('No such lesson.');
}

/** Creates a link; returns the row and the token (shown once, never stored). */
export async function createShareLink(
  ds: Db,
  userId: string,
  input: { itemType: ShareableType; itemId: string; expiresInDays?: number },
): Promise<{ link: ShareLink; token: string }> {
  await assertMayShare(ds, userId, input.itemType, input.itemId);
  const token = newLinkToken();
  const repo = ds.getRepository(ShareLink);
  const link = await repo.save(
    repo.create({
      tokenHash: sha256Hex(token),
      itemType: input.itemType,
      itemId: input.itemId,
      createdBy: userId,
      expiresAt: input.expiresInDays ? new Date(Date.now() + input.expiresInDays * 86_400_000) : null,
      revokedAt: null,
    }),
  );
  return { link, token };
}

export async function listShareLinks(ds: DataSource, userId: string, itemType: ShareableType, itemId: string): Promise<ShareLink[]> {
  await assertMayShare(ds, userId, itemType, itemId);
  return ds.getRepository(ShareLink).find({ where: { itemType, itemId, createdBy: userId }, order: { createdAt: 'DESC' } });
}

/** Revokes one of the caller's links; someone else's link is 404. */
export async function revokeShareLink(ds: DataSource, userId: string, linkId: string): Promise<void> {
  const result = await ds.getRepository(ShareLink).update({ id: linkId, createdBy: userId }, { revokedAt: () => 'COALESCE(revoked_at, now())' } as never);
  if (!result.affected) throw notFound('No such link.');
}

/** The read-only content behind a live token: the item only, no ids, no e-mail. */
export async function sharedView(ds: DataSource, token: string): Promise<SharedView> {
  const link = await ds.getRepository(ShareLink).findOneBy({ tokenHash: sha256Hex(token) });
  if (!link || link.revokedAt || (link.expiresAt && link.expiresAt.getTime() <= Date.now())) throw notFound(NO_SUCH_LINK);
  if (link.itemType === 'plan') {
    const plan = await ds.getRepository(Plan).findOneBy({ id: link.itemId });
    if (!plan) throw notFound(NO_SUCH_LINK);
    const tank = await ds.getRepository(Tank).findOneByOrFail({ id: plan.tankId });
    const livestock = await ds.getRepository(Livestock).findBy({ tankId: tank.id });
    return {
      itemType: 'plan',
      plan: { name: plan.name, startDate: plan.startDate, events: plan.events },
      scenario: scenarioFromPlanOrNull(tank, livestock, plan),
    };
  }
  const lesson = await ds.getRepository(Lesson).findOneBy({ id: link.itemId });
  if (!lesson) throw notFound(NO_SUCH_LINK);
  return {
    itemType: 'lesson',
    lesson: {
      title: lesson.title,
      summary: lesson.summary,
      kind: lesson.kind,
      authorName: await authorName(ds, lesson),
      steps: lesson.steps,
      scenario: lesson.scenario,
      stagedScenario: lesson.stagedScenario,
    },
  };
}
