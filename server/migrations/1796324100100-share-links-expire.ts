import type { MigrationInterface, QueryRunner } from 'typeorm';

/**
 * Every share link expires: links made "until revoked" get the default 30 days from now (so no
 * one's link stops working the moment this runs), and `expires_at` becomes NOT NULL. Down only
 * drops the constraint: which links had no expiry before is not kept.
 */
export class ShareLinksExpire1796324100100 implements MigrationInterface {
  name = 'ShareLinksExpire1796324100100';

  async up(q: QueryRunner): Promise<void> {
    await q.query(`UPDATE "share_links" SET "expires_at" = now() + interval '30 days' WHERE "expires_at" IS NULL`);
    await q.query(`ALTER TABLE "share_links" ALTER COLUMN "expires_at" SET NOT NULL`);
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query(`ALTER TABLE "share_links" ALTER COLUMN "expires_at" DROP NOT NULL`);
  }
}
