import type { MigrationInterface, QueryRunner } from 'typeorm';

/**
 * Club invites, items shared with a club and comments on them, lessons, read-only share links,
 * the record of e-mails the job runner sent (unique key: a retried job never sends twice), and
 * reminder opt-outs.
 */
export class ClubsLessonsSharing1796300000000 implements MigrationInterface {
  name = 'ClubsLessonsSharing1796300000000';

  async up(q: QueryRunner): Promise<void> {
    await q.query(`
      CREATE TABLE "club_invites" (
        "id" uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        "club_id" uuid NOT NULL REFERENCES "clubs" ("id") ON DELETE CASCADE,
        "email" varchar(254) NOT NULL CHECK ("email" = lower("email")),
        "token_hash" char(64) NOT NULL,
        "invited_by" uuid NOT NULL REFERENCES "users" ("id") ON DELETE CASCADE,
        "expires_at" timestamptz NOT NULL,
        "used_at" timestamptz,
        "created_at" timestamptz NOT NULL DEFAULT now()
      )`);
    await q.query(`CREATE UNIQUE INDEX "club_invites_token_hash_key" ON "club_invites" ("token_hash")`);
    await q.query(`CREATE INDEX "club_invites_club_id_idx" ON "club_invites" ("club_id")`);

    await q.query(`
      CREATE TABLE "club_shares" (
        "id" uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        "club_id" uuid NOT NULL REFERENCES "clubs" ("id") ON DELETE CASCADE,
        "owner_id" uuid NOT NULL REFERENCES "users" ("id") ON DELETE CASCADE,
        "item_type" varchar(8) NOT NULL CHECK ("item_type" IN ('tank', 'plan')),
        "item_id" uuid NOT NULL,
        "created_at" timestamptz NOT NULL DEFAULT now()
      )`);
    await q.query(`CREATE UNIQUE INDEX "club_shares_club_item_key" ON "club_shares" ("club_id", "item_type", "item_id")`);
    await q.query(`CREATE INDEX "club_shares_owner_id_idx" ON "club_shares" ("owner_id")`);

    await q.query(`
      CREATE TABLE "plan_comments" (
        "id" uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        "share_id" uuid NOT NULL REFERENCES "club_shares" ("id") ON DELETE CASCADE,
        "author_id" uuid NOT NULL REFERENCES "users" ("id") ON DELETE CASCADE,
        "body" text NOT NULL,
        "created_at" timestamptz NOT NULL DEFAULT now()
      )`);
    await q.query(`CREATE INDEX "plan_comments_share_id_idx" ON "plan_comments" ("share_id", "created_at")`);

    await q.query(`
      CREATE TABLE "lessons" (
        "id" uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        "club_id" uuid NOT NULL REFERENCES "clubs" ("id") ON DELETE CASCADE,
        "author_id" uuid REFERENCES "users" ("id") ON DELETE SET NULL,
        "title" varchar(120) NOT NULL,
        "summary" varchar(400) NOT NULL DEFAULT '',
        "kind" varchar(8) NOT NULL CHECK ("kind" IN ('single', 'compare')),
        "scenario" jsonb NOT NULL,
        "staged_scenario" jsonb,
        "steps" jsonb NOT NULL,
        "created_at" timestamptz NOT NULL DEFAULT now(),
        "updated_at" timestamptz NOT NULL DEFAULT now()
      )`);
    await q.query(`CREATE INDEX "lessons_club_id_idx" ON "lessons" ("club_id")`);

    await q.query(`
      CREATE TABLE "share_links" (
        "id" uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        "token_hash" char(64) NOT NULL,
        "item_type" varchar(8) NOT NULL CHECK ("item_type" IN ('plan', 'lesson')),
        "item_id" uuid NOT NULL,
        "created_by" uuid NOT NULL REFERENCES "users" ("id") ON DELETE CASCADE,
        "expires_at" timestamptz,
        "revoked_at" timestamptz,
        "created_at" timestamptz NOT NULL DEFAULT now()
      )`);
    await q.query(`CREATE UNIQUE INDEX "share_links_token_hash_key" ON "share_links" ("token_hash")`);
    await q.query(`CREATE INDEX "share_links_item_idx" ON "share_links" ("item_type", "item_id")`);

    await q.query(`
      CREATE TABLE "mail_sends" (
        "key" varchar(200) PRIMARY KEY,
        "user_id" uuid NOT NULL,
        "sent_at" timestamptz NOT NULL DEFAULT now()
      )`);

    await q.query(`
      CREATE TABLE "reminder_opt_outs" (
        "user_id" uuid PRIMARY KEY REFERENCES "users" ("id") ON DELETE CASCADE,
        "created_at" timestamptz NOT NULL DEFAULT now()
      )`);
  }

  async down(q: QueryRunner): Promise<void> {
    for (const t of ['reminder_opt_outs', 'mail_sends', 'share_links', 'lessons', 'plan_comments', 'club_shares', 'club_invites']) {
      await q.query(`DROP TABLE "${t}"`);
    }
  }
}
