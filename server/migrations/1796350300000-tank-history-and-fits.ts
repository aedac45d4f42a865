import type { MigrationInterface, QueryRunner } from 'typeorm';

/**
 * The keeper's account of a tank's past (`tanks.history`, JSON, null = not given) and the
 * tank's fits to its own tests (`tank_fits`: at most one offered and one applied per tank,
 * kept so by the partial unique indexes).
 */
export class TankHistoryAndFits1796350300000 implements MigrationInterface {
  name = 'TankHistoryAndFits1796350300000';

  async up(q: QueryRunner): Promise<void> {
    await q.query(`ALTER TABLE "tanks" ADD COLUMN "history" jsonb`);
    await q.query(`CREATE TABLE "tank_fits" (
      "id" uuid NOT NULL DEFAULT gen_random_uuid(),
      "tank_id" uuid NOT NULL,
      "fitted_at" timestamptz NOT NULL,
      "applied_at" timestamptz,
      "last_reading_at" timestamptz NOT NULL,
      "readings_used" integer NOT NULL,
      "verdict" varchar(8) NOT NULL,
      "capacities" jsonb NOT NULL,
      CONSTRAINT "tank_fits_pkey" PRIMARY KEY ("id"),
      CONSTRAINT "tank_fits_tank_id_fkey" FOREIGN KEY ("tank_id") REFERENCES "tanks"("id") ON DELETE CASCADE
    )`);
    await q.query(`CREATE UNIQUE INDEX "tank_fits_offered_key" ON "tank_fits" ("tank_id") WHERE "applied_at" IS NULL`);
    await q.query(`CREATE UNIQUE INDEX "tank_fits_applied_key" ON "tank_fits" ("tank_id") WHERE "applied_at" IS NOT NULL`);
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query(`DROP TABLE "tank_fits"`);
    await q.query(`ALTER TABLE "tanks" DROP COLUMN "history"`);
  }
}
