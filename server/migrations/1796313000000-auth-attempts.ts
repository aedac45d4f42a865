import type { MigrationInterface, QueryRunner } from 'typeorm';

/**
 * Attempts at the expensive anonymous auth routes (sign-up, password reset, forgot-password,
 * invite accept), counted over sliding windows by server/services/attempt-limiter.ts. Rows live
 * in PostgreSQL so every server process sees the same count; old rows are pruned as new ones
 * arrive. `subject` is a client address, or the SHA-256 of an e-mail (anyone can type any
 * address, so the table does not keep them in clear).
 */
export class AuthAttempts1796313000000 implements MigrationInterface {
  name = 'AuthAttempts1796313000000';

  async up(q: QueryRunner): Promise<void> {
    await q.query(`
      CREATE TABLE "auth_attempts" (
        "id" bigserial PRIMARY KEY,
        "action" varchar(32) NOT NULL,
        "subject" varchar(80) NOT NULL,
        "created_at" timestamptz NOT NULL DEFAULT now()
      )`);
    await q.query(`CREATE INDEX "auth_attempts_action_subject_created_at_idx" ON "auth_attempts" ("action", "subject", "created_at")`);
    await q.query(`CREATE INDEX "auth_attempts_created_at_idx" ON "auth_attempts" ("created_at")`);
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query(`DROP TABLE "auth_attempts"`);
  }
}
