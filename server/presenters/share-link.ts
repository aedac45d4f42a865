import type { z } from 'zod';
import type { ShareLinkItem, SharedView, replayedShareLinkSchema } from '../../shared/schemas/share.js';
import type { ShareLink } from '../entities/share-link.js';
import type { SharedItem } from '../services/share-links.js';
import { presentLessonContent } from './lesson.js';

/** A link as its managers see it: never its token (only the maker's first answer carries the URL). */
export function presentShareLink(l: ShareLink, madeBy: string, viewerId: string): ShareLinkItem {
  return {
    id: l.id,
    itemType: l.itemType,
    createdAt: l.createdAt.toISOString(),
    expiresAt: l.expiresAt.toISOString(),
    revokedAt: l.revokedAt ? new Date(l.revokedAt).toISOString() : null,
    madeBy,
    mine: l.createdBy === viewerId,
  };
}

/** The answer to making a link: the link with its address, shown this once. */
export function presentCreatedShareLink(l: ShareLink, maker: { id: string; displayName: string }, url: string): ShareLinkItem & { url: string } {
  return { ...presentShareLink(l, maker.displayName, maker.id), url };
}

/** What a replay of a keyed create answers: the link without its address (never stored). */
export function presentReplayedShareLink(l: ShareLink, maker: { id: string; displayName: string }): z.infer<typeof replayedShareLinkSchema> {
  return { ...presentShareLink(l, maker.displayName, maker.id), url: null, urlShownOnce: true };
}

/** The read-only view behind a link: content only, no ids, no e-mail. */
export function presentSharedView(item: SharedItem): SharedView {
  if (item.itemType === 'plan') {
    const { plan } = item;
    return { itemType: 'plan', plan: { name: plan.name, startDate: plan.startDate, events: plan.events }, scenario: item.scenario };
  }
  return { itemType: 'lesson', lesson: presentLessonContent(item.lesson, item.authorName) };
}
