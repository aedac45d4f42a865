import type { MigrationInterface, QueryRunner } from 'typeorm';

/**
 * Fish events list their groups: `fish` on add and move events becomes a list, and a removal's
 * `species`/`name`/`count` move into `fish: [{…}]` (simulation/scenario.ts reads both shapes, the
 * server's code reads only the list). Rewrites stored plans and the scenarios of lessons, in
 * batches. Down splits an event of several groups into one event per group, same day, same
 * order (the engine forecasts that the same). The rewrite is kept here, frozen, not imported
 * from the schema, so later schema changes cannot change what this migration did.
 */

type Json = Record<string, unknown>;
const FISH_IN = new Set(['add-fish', 'move-fish']);
const BATCH = 500;

const isObject = (v: unknown): v is Json => v !== null && typeof v === 'object' && !Array.isArray(v);

/** One event in the list shape (unchanged when it already is, or is not a fish event). */
export function eventToGroups(e: unknown): unknown {
  if (!isObject(e)) return e;
  if (FISH_IN.has(e.type as string) && isObject(e.fish)) return { ...e, fish: [e.fish] };
  if (e.type === 'remove-fish' && e.fish === undefined) {
    const { species, name, count, ...rest } = e;
    return { ...rest, fish: [{ ...(species !== undefined ? { species } : {}), ...(name !== undefined ? { name } : {}), count }] };
  }
  return e;
}

/** One event in the single-group shape: one event per group. */
export function eventToSingles(e: unknown): unknown[] {
  if (!isObject(e) || !Array.isArray(e.fish)) return [e];
  if (FISH_IN.has(e.type as string)) return e.fish.map((g) => ({ ...e, fish: g }));
  if (e.type === 'remove-fish') {
    const { fish, ...rest } = e;
    return (fish as unknown[]).map((g) => ({ ...rest, ...(isObject(g) ? g : {}) }));
  }
  return [e];
}

const listToGroups = (events: unknown) => (Array.isArray(events) ? events.map(eventToGroups) : events);
const listToSingles = (events: unknown) => (Array.isArray(events) ? events.flatMap(eventToSingles) : events);
const scenarioWith = (s: unknown, f: (events: unknown) => unknown) => (isObject(s) && 'events' in s ? { ...s, events: f(s.events) } : s);

/** Rewrites every row of `table` whose `columns` change under `rewrite`, BATCH rows at a time by id. */
async function rewriteRows(q: QueryRunner, table: string, columns: readonly string[], rewrite: (value: unknown, column: string) => unknown): Promise<void> {
  let after = '00000000-0000-0000-0000-000000000000';
  for (;;) {
    const rows: Json[] = await q.query(`SELECT "id", ${columns.map((c) => `"${c}"`).join(', ')} FROM "${table}" WHERE "id" > $1 ORDER BY "id" LIMIT ${BATCH}`, [after]);
    for (const row of rows) {
      const next = columns.map((c) => rewrite(row[c], c));
      if (next.every((v, i) => JSON.stringify(v) === JSON.stringify(row[columns[i]!]))) continue;
      const sets = columns.map((c, i) => `"${c}" = $${i + 2}::jsonb`).join(', ');
      await q.query(`UPDATE "${table}" SET ${sets} WHERE "id" = $1`, [row.id, ...next.map((v) => (v === null || v === undefined ? null : JSON.stringify(v)))]);
    }
    if (rows.length < BATCH) return;
    after = rows[rows.length - 1]!.id as string;
  }
}

export class FishEventGroups1796330000000 implements MigrationInterface {
  name = 'FishEventGroups1796330000000';

  async up(q: QueryRunner): Promise<void> {
    await rewriteRows(q, 'plans', ['events'], listToGroups);
    await rewriteRows(q, 'lessons', ['scenario', 'staged_scenario'], (s) => scenarioWith(s, listToGroups));
  }

  async down(q: QueryRunner): Promise<void> {
    await rewriteRows(q, 'plans', ['events'], listToSingles);
    await rewriteRows(q, 'lessons', ['scenario', 'staged_scenario'], (s) => scenarioWith(s, listToSingles));
  }
}
