import type { MigrationInterface, QueryRunner } from 'typeorm';

/**
 * Responses to unsafe requests that carried an `Idempotency-Key` header, so a client retrying
 * the same key gets the first answer instead of a second write. One row per (scope, key): the
 * primary key is the unique index that makes concurrent retries wait for the first.
 */
export class IdempotencyKeys1796170000000 implements MigrationInterface {
  name = 'IdempotencyKeys1796170000000';

  async up(q: QueryRunner): Promise<void> {
    await q.query(`
      CREATE TABLE "idempotency_keys" (
        "scope" varchar(300) NOT NULL,
        "key" varchar(200) NOT NULL,
        "fingerprint" char(64) NOT NULL,
        "status" smallint NOT NULL,
        "body" json,
        "created_at" timestamptz NOT NULL DEFAULT now(),
        PRIMARY KEY ("scope", "key")
      )`);
    await q.query(`CREATE INDEX "idempotency_keys_created_at_idx" ON "idempotency_keys" ("created_at")`);
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query(`DROP TABLE "idempotency_keys"`);
  }
}
