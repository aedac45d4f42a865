import type { MigrationInterface, QueryRunner } from 'typeorm';

/**
 * Organizers can take back an e-mail invite before it is answered: `revoked_at` marks it, and
 * preview and accept refuse a revoked token like a used or expired one. There is no unique
 * index on (club_id, email), so the same address can be invited again after a revoke.
 */
export class ClubInviteRevocation1796312000000 implements MigrationInterface {
  name = 'ClubInviteRevocation1796312000000';

  async up(q: QueryRunner): Promise<void> {
    await q.query(`ALTER TABLE "club_invites" ADD COLUMN "revoked_at" timestamptz`);
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query(`ALTER TABLE "club_invites" DROP COLUMN "revoked_at"`);
  }
}
