import type { MigrationInterface, QueryRunner } from 'typeorm';

/**
 * Accounts, clubs, tanks with their livestock, readings and plans, sign-in failure counts,
 * and the session table connect-pg-simple reads (its own table.sql, plus an index on the
 * user id so a password reset can end all of one user's sessions).
 */
export class InitialSchema1796162158000 implements MigrationInterface {
  name = 'InitialSchema1796162158000';

  async up(q: QueryRunner): Promise<void> {
    await q.query(`
      CREATE TABLE "users" (
        "id" uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        "email" varchar(254) NOT NULL,
        "display_name" varchar(80) NOT NULL,
        "password_hash" varchar(100) NOT NULL,
        "role" varchar(16) NOT NULL DEFAULT 'user' CHECK ("role" IN ('user', 'admin')),
        "password_changed_at" timestamptz NOT NULL DEFAULT now(),
        "created_at" timestamptz NOT NULL DEFAULT now(),
        "updated_at" timestamptz NOT NULL DEFAULT now(),
        CONSTRAINT "users_email_lower" CHECK ("email" = lower("email"))
      )`);
    await q.query(`CREATE UNIQUE INDEX "users_email_key" ON "users" ("email")`);

    await q.query(`
      CREATE TABLE "password_reset_tokens" (
        "id" uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        "token_hash" char(64) NOT NULL,
        "user_id" uuid NOT NULL REFERENCES "users" ("id") ON DELETE CASCADE,
        "expires_at" timestamptz NOT NULL,
        "used_at" timestamptz,
        "created_at" timestamptz NOT NULL DEFAULT now()
      )`);
    await q.query(`CREATE UNIQUE INDEX "password_reset_tokens_token_hash_key" ON "password_reset_tokens" ("token_hash")`);
    await q.query(`CREATE INDEX "password_reset_tokens_user_id_idx" ON "password_reset_tokens" ("user_id")`);

    await q.query(`
      CREATE TABLE "clubs" (
        "id" uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        "name" varchar(120) NOT NULL,
        "created_at" timestamptz NOT NULL DEFAULT now(),
        "updated_at" timestamptz NOT NULL DEFAULT now()
      )`);

    await q.query(`
      CREATE TABLE "club_memberships" (
        "id" uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        "club_id" uuid NOT NULL REFERENCES "clubs" ("id") ON DELETE CASCADE,
        "user_id" uuid NOT NULL REFERENCES "users" ("id") ON DELETE CASCADE,
        "role" varchar(16) NOT NULL CHECK ("role" IN ('organizer', 'mentor', 'member')),
        "created_at" timestamptz NOT NULL DEFAULT now(),
        "updated_at" timestamptz NOT NULL DEFAULT now()
      )`);
    await q.query(`CREATE UNIQUE INDEX "club_memberships_club_user_key" ON "club_memberships" ("club_id", "user_id")`);
    await q.query(`CREATE INDEX "club_memberships_user_id_idx" ON "club_memberships" ("user_id")`);

    await q.query(`
      CREATE TABLE "tanks" (
        "id" uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        "owner_id" uuid NOT NULL REFERENCES "users" ("id") ON DELETE CASCADE,
        "name" varchar(80) NOT NULL,
        "volume_l" double precision NOT NULL CHECK ("volume_l" > 0),
        "temperature_c" double precision NOT NULL,
        "ph" double precision NOT NULL,
        "kh_dkh" double precision,
        "tap_tan_mg_n" double precision NOT NULL DEFAULT 0,
        "tap_no2_mg_n" double precision NOT NULL DEFAULT 0,
        "tap_no3_mg_n" double precision NOT NULL DEFAULT 0,
        "setup" jsonb NOT NULL DEFAULT '{}'::jsonb,
        "notes" text NOT NULL DEFAULT '',
        "created_at" timestamptz NOT NULL DEFAULT now(),
        "updated_at" timestamptz NOT NULL DEFAULT now()
      )`);
    await q.query(`CREATE INDEX "tanks_owner_id_idx" ON "tanks" ("owner_id")`);

    await q.query(`
      CREATE TABLE "livestock" (
        "id" uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        "tank_id" uuid NOT NULL REFERENCES "tanks" ("id") ON DELETE CASCADE,
        "species_id" varchar(64),
        "custom_name" varchar(80),
        "count" integer NOT NULL CHECK ("count" >= 0),
        "length_cm" double precision,
        "created_at" timestamptz NOT NULL DEFAULT now(),
        "updated_at" timestamptz NOT NULL DEFAULT now(),
        CONSTRAINT "livestock_species_or_name" CHECK ("species_id" IS NOT NULL OR "custom_name" IS NOT NULL)
      )`);
    await q.query(`CREATE INDEX "livestock_tank_id_idx" ON "livestock" ("tank_id")`);

    await q.query(`
      CREATE TABLE "readings" (
        "id" uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        "tank_id" uuid NOT NULL REFERENCES "tanks" ("id") ON DELETE CASCADE,
        "taken_at" timestamptz NOT NULL,
        "tan_mg_n" double precision,
        "no2_mg_n" double precision,
        "no3_mg_n" double precision,
        "ph" double precision,
        "temperature_c" double precision,
        "kh_dkh" double precision,
        "basis" varchar(8) NOT NULL DEFAULT 'N' CHECK ("basis" IN ('N', 'ion')),
        "created_at" timestamptz NOT NULL DEFAULT now(),
        "updated_at" timestamptz NOT NULL DEFAULT now()
      )`);
    // Serves both "readings of a tank" and "newest reading first".
    await q.query(`CREATE INDEX "readings_tank_id_taken_at_idx" ON "readings" ("tank_id", "taken_at" DESC)`);

    await q.query(`
      CREATE TABLE "plans" (
        "id" uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        "tank_id" uuid NOT NULL REFERENCES "tanks" ("id") ON DELETE CASCADE,
        "name" varchar(80) NOT NULL,
        "start_date" date NOT NULL,
        "status" varchar(16) NOT NULL DEFAULT 'draft' CHECK ("status" IN ('draft', 'active', 'done')),
        "events" jsonb NOT NULL DEFAULT '[]'::jsonb,
        "created_at" timestamptz NOT NULL DEFAULT now(),
        "updated_at" timestamptz NOT NULL DEFAULT now()
      )`);
    await q.query(`CREATE INDEX "plans_tank_id_idx" ON "plans" ("tank_id")`);

    await q.query(`
      CREATE TABLE "sign_in_failures" (
        "id" uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        "email" varchar(254) NOT NULL,
        "address" varchar(64) NOT NULL,
        "created_at" timestamptz NOT NULL DEFAULT now()
      )`);
    await q.query(`CREATE INDEX "sign_in_failures_email_created_at_idx" ON "sign_in_failures" ("email", "created_at")`);
    await q.query(`CREATE INDEX "sign_in_failures_address_created_at_idx" ON "sign_in_failures" ("address", "created_at")`);
    await q.query(`CREATE INDEX "sign_in_failures_created_at_idx" ON "sign_in_failures" ("created_at")`);

    // connect-pg-simple 10's table.sql, verbatim in shape.
    await q.query(`
      CREATE TABLE "session" (
        "sid" varchar NOT NULL COLLATE "default",
        "sess" json NOT NULL,
        "expire" timestamp(6) NOT NULL
      )`);
    await q.query(`ALTER TABLE "session" ADD CONSTRAINT "session_pkey" PRIMARY KEY ("sid") NOT DEFERRABLE INITIALLY IMMEDIATE`);
    await q.query(`CREATE INDEX "IDX_session_expire" ON "session" ("expire")`);
    await q.query(`CREATE INDEX "IDX_session_user_id" ON "session" (("sess" ->> 'userId'))`);
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query(`DROP TABLE "session"`);
    await q.query(`DROP TABLE "sign_in_failures"`);
    await q.query(`DROP TABLE "plans"`);
    await q.query(`DROP TABLE "readings"`);
    await q.query(`DROP TABLE "livestock"`);
    await q.query(`DROP TABLE "tanks"`);
    await q.query(`DROP TABLE "club_memberships"`);
    await q.query(`DROP TABLE "clubs"`);
    await q.query(`DROP TABLE "password_reset_tokens"`);
    await q.query(`DROP TABLE "users"`);
  }
}
