import type { MigrationInterface, QueryRunner } from 'typeorm';

/**
 * Invite caps (server/services/invite-quota.ts) count a day of invites per organizer and per
 * club on every send: indexes on (invited_by, created_at) and (club_id, created_at) keep that
 * an index range scan however many invites a club has sent over the years.
 */
export class InviteQuotaIndexes1796324100000 implements MigrationInterface {
  name = 'InviteQuotaIndexes1796324100000';

  async up(q: QueryRunner): Promise<void> {
    await q.query(`CREATE INDEX "club_invites_invited_by_created_at_idx" ON "club_invites" ("invited_by", "created_at")`);
    await q.query(`CREATE INDEX "club_invites_club_id_created_at_idx" ON "club_invites" ("club_id", "created_at")`);
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query(`DROP INDEX "club_invites_club_id_created_at_idx"`);
    await q.query(`DROP INDEX "club_invites_invited_by_created_at_idx"`);
  }
}
