import type { CommentItem } from '../../shared/schemas/club.js';
import type { CommentRow } from '../services/club-shares.js';

/** A comment on a shared plan; an author who has left the club shows as a member. */
export function presentComment(r: CommentRow): CommentItem {
  return { id: r.id, authorName: r.author_name, authorRole: r.role ?? 'member', body: r.body, createdAt: new Date(r.created_at).toISOString() };
}
