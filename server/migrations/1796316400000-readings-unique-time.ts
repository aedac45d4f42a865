import type { MigrationInterface, QueryRunner } from 'typeorm';

/**
 * One water test per tank and moment: a unique index on readings (tank_id, taken_at), so a
 * retried or raced POST cannot store a test twice (the API already refused a second test at
 * the same time, but only by looking first). It replaces the plain index on the same columns
 * (a b-tree serves "newest first" read backwards).
 *
 * Rows that already repeat a (tank, time) can only be such double writes: the later copies
 * (by created_at, then id) are deleted so the index can be built; the first one stays.
 */
export class ReadingsUniqueTime1796316400000 implements MigrationInterface {
  name = 'ReadingsUniqueTime1796316400000';

  async up(q: QueryRunner): Promise<void> {
    await q.query(`
      DELETE FROM "readings" r
       USING (
         SELECT id, row_number() OVER (PARTITION BY tank_id, taken_at ORDER BY created_at, id) AS n FROM "readings"
       ) d
       WHERE r.id = d.id AND d.n > 1`);
    await q.query(`CREATE UNIQUE INDEX "readings_tank_id_taken_at_key" ON "readings" ("tank_id", "taken_at")`);
    await q.query(`DROP INDEX "readings_tank_id_taken_at_idx"`);
  }

  async down(q: QueryRunner): Promise<void> {
    // Deleted double writes do not come back.
    await q.query(`CREATE INDEX "readings_tank_id_taken_at_idx" ON "readings" ("tank_id", "taken_at" DESC)`);
    await q.query(`DROP INDEX "readings_tank_id_taken_at_key"`);
  }
}
