import type { MigrationInterface, QueryRunner } from 'typeorm';

/**
 * Saved-plan forecasts keyed by a sha256 of their inputs (the parsed scenario, the engine
 * version and the parameter table), so asking again for the same plan does not run the engine.
 * Rows are safe to lose: a miss recomputes.
 */
export class ForecastCache1796180000500 implements MigrationInterface {
  name = 'ForecastCache1796180000500';

  async up(q: QueryRunner): Promise<void> {
    await q.query(`
      CREATE TABLE "forecast_cache" (
        "input_hash" char(64) PRIMARY KEY,
        "engine_version" varchar(64) NOT NULL,
        "result" jsonb NOT NULL,
        "compute_ms" double precision NOT NULL,
        "created_at" timestamptz NOT NULL DEFAULT now(),
        "last_used_at" timestamptz NOT NULL DEFAULT now()
      )`);
    await q.query(`CREATE INDEX "forecast_cache_last_used_at_idx" ON "forecast_cache" ("last_used_at")`);
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query(`DROP TABLE "forecast_cache"`);
  }
}
