import type { MigrationInterface, QueryRunner } from 'typeorm';

/** Display units and reminders per person; a short note on each water test. */
export class KeeperPreferencesAndReadingNotes1796172100000 implements MigrationInterface {
  name = 'KeeperPreferencesAndReadingNotes1796172100000';

  async up(q: QueryRunner): Promise<void> {
    await q.query(`
      CREATE TABLE "user_preferences" (
        "user_id" uuid PRIMARY KEY REFERENCES "users" ("id") ON DELETE CASCADE,
        "volume_unit" varchar(8) NOT NULL CHECK ("volume_unit" IN ('L', 'USgal')),
        "temperature_unit" varchar(8) NOT NULL CHECK ("temperature_unit" IN ('C', 'F')),
        "nitrogen_basis" varchar(8) NOT NULL CHECK ("nitrogen_basis" IN ('N', 'ion')),
        "reminders" boolean NOT NULL,
        "updated_at" timestamptz NOT NULL DEFAULT now()
      )`);
    await q.query(`ALTER TABLE "readings" ADD COLUMN "note" varchar(200) NOT NULL DEFAULT ''`);
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query(`ALTER TABLE "readings" DROP COLUMN "note"`);
    await q.query(`DROP TABLE "user_preferences"`);
  }
}
