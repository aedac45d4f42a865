import type { MigrationInterface, QueryRunner } from 'typeorm';

/**
 * Heavy engine requests running per account (server/services/engine-slots.ts): one row per
 * request holding one of the account's slots, so the cap holds over every server process. A
 * row is a lease: a process that dies without releasing it frees the slot when it expires.
 */
export class EngineSlots1796321500000 implements MigrationInterface {
  name = 'EngineSlots1796321500000';

  async up(q: QueryRunner): Promise<void> {
    await q.query(`
      CREATE TABLE "engine_slots" (
        "user_id" uuid NOT NULL REFERENCES "users" ("id") ON DELETE CASCADE,
        "slot" smallint NOT NULL,
        "holder" uuid NOT NULL,
        "expires_at" timestamptz NOT NULL,
        PRIMARY KEY ("user_id", "slot")
      )`);
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query(`DROP TABLE "engine_slots"`);
  }
}
