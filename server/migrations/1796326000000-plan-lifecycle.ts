import type { MigrationInterface, QueryRunner } from 'typeorm';

/**
 * A plan's life: draft → running ('active', from `started_at`) → done (at `finished_at`).
 * Plans already running get their start date as `started_at`; finished ones their last change
 * as `finished_at`. One plan runs per tank (a partial unique index decides a race): where
 * several were marked running, all but the latest start are finished now, so the index can
 * be built. Down drops the columns, the checks and the index; the finished plans stay finished.
 */
export class PlanLifecycle1796326000000 implements MigrationInterface {
  name = 'PlanLifecycle1796326000000';

  async up(q: QueryRunner): Promise<void> {
    await q.query(`ALTER TABLE "plans" ADD COLUMN "started_at" timestamptz, ADD COLUMN "finished_at" timestamptz`);
    await q.query(`UPDATE "plans" SET "started_at" = "start_date"::timestamptz WHERE "status" IN ('active', 'done')`);
    await q.query(`UPDATE "plans" SET "finished_at" = "updated_at" WHERE "status" = 'done'`);
    await q.query(`
      UPDATE "plans" p SET "status" = 'done', "finished_at" = now()
      FROM (
        SELECT "id", row_number() OVER (PARTITION BY "tank_id" ORDER BY "start_date" DESC, "created_at" DESC) AS n
        FROM "plans" WHERE "status" = 'active'
      ) ranked
      WHERE p."id" = ranked."id" AND ranked.n > 1`);
    await q.query(`ALTER TABLE "plans" ADD CONSTRAINT "plans_started_when_running" CHECK ("status" = 'draft' OR "started_at" IS NOT NULL)`);
    await q.query(`ALTER TABLE "plans" ADD CONSTRAINT "plans_finished_when_done" CHECK ("status" <> 'done' OR "finished_at" IS NOT NULL)`);
    await q.query(`CREATE UNIQUE INDEX "plans_one_running_per_tank" ON "plans" ("tank_id") WHERE "status" = 'active'`);
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query(`DROP INDEX "plans_one_running_per_tank"`);
    await q.query(`ALTER TABLE "plans" DROP CONSTRAINT "plans_finished_when_done", DROP CONSTRAINT "plans_started_when_running"`);
    await q.query(`ALTER TABLE "plans" DROP COLUMN "finished_at", DROP COLUMN "started_at"`);
  }
}
