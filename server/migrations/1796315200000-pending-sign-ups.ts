import type { MigrationInterface, QueryRunner } from 'typeorm';

/**
 * Sign-ups waiting for their e-mailed link (server/services/sign-up.ts). A sign-up answers the
 * same whether or not the address has an account, so the account is only made when the link is
 * opened. Only the token's SHA-256 and the password's bcrypt hash are kept; rows expire.
 */
export class PendingSignUps1796315200000 implements MigrationInterface {
  name = 'PendingSignUps1796315200000';

  async up(q: QueryRunner): Promise<void> {
    await q.query(`
      CREATE TABLE "pending_sign_ups" (
        "token_hash" char(64) PRIMARY KEY,
        "email" varchar(254) NOT NULL,
        "display_name" varchar(80) NOT NULL,
        "password_hash" varchar(100) NOT NULL,
        "expires_at" timestamptz NOT NULL,
        "created_at" timestamptz NOT NULL DEFAULT now()
      )`);
    await q.query(`CREATE INDEX "pending_sign_ups_email_idx" ON "pending_sign_ups" ("email")`);
    await q.query(`CREATE INDEX "pending_sign_ups_expires_at_idx" ON "pending_sign_ups" ("expires_at")`);
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query(`DROP TABLE "pending_sign_ups"`);
  }
}
