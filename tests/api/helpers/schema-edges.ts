import { z } from 'zod';

/** One request body with one numeric field set to an edge of what its schema accepts. */
export interface EdgeCase {
  path: (string | number)[];
  value: number;
  /** The schema refuses this value (a probe below its minimum): the answer must name the path. */
  refused: boolean;
  body: unknown;
}

type Json = Record<string, unknown>;

/** The schema node for `value` among oneOf/anyOf options (objects by their `const` discriminator). */
function pick(node: Json, value: unknown): Json {
  const options = (node.oneOf ?? node.anyOf) as Json[] | undefined;
  if (!options) return node;
  const match = options.find((o) => {
    if (Array.isArray(value)) return o.type === 'array';
    const props = (o.properties ?? {}) as Record<string, Json>;
    if (o.type === 'object' && value && typeof value === 'object') {
      return Object.entries(props).every(([k, p]) => p.const === undefined || (value as Json)[k] === p.const);
    }
    return o.type === (typeof value === 'number' ? (Number.isInteger(value) ? o.type : 'number') : typeof value);
  });
  return pick(match ?? options[0]!, value);
}

/** A deep copy of `root` with the value at `at` replaced (the fuzz tests use it too). */
export function setAt(root: unknown, at: (string | number)[], v: unknown): unknown {
  const copy = structuredClone(root) as Record<string | number, unknown>;
  let node = copy;
  for (const key of at.slice(0, -1)) node = node[key] as Record<string | number, unknown>;
  node[at[at.length - 1]!] = v;
  return copy;
}

/**
 * For every numeric leaf of `base`, the smallest and largest values `schema` accepts there (its
 * JSON Schema bounds), and 1e-9 where the minimum is above 0 (what `gt(0)` used to let through)
 * as a probe that must be refused. Generated from the schema, so a bound added later is tested.
 */
export function schemaEdges(schema: z.ZodType, base: unknown): EdgeCase[] {
  const root = z.toJSONSchema(schema, { io: 'input', unrepresentable: 'any' }) as Json;
  const cases: EdgeCase[] = [];
  const walk = (node: Json, value: unknown, at: (string | number)[]) => {
    node = pick(node, value);
    if (typeof value === 'number') {
      const min = node.minimum as number | undefined;
      const exclusive = node.exclusiveMinimum as number | undefined;
      const max = node.maximum as number | undefined;
      const int = node.type === 'integer';
      const lows = new Set<number>();
      if (min !== undefined) lows.add(min);
      if (exclusive !== undefined) lows.add(int ? exclusive + 1 : exclusive + 1e-9);
      const values = [...lows, max ?? (int ? Number.MAX_SAFE_INTEGER : 1e9)];
      for (const v of new Set(values)) cases.push({ path: at, value: v, refused: false, body: setAt(base, at, v) });
      if (min !== undefined && min > 1e-9 && !int) cases.push({ path: at, value: 1e-9, refused: true, body: setAt(base, at, 1e-9) });
      return;
    }
    if (Array.isArray(value)) {
      value.forEach((v, i) => walk((node.items ?? {}) as Json, v, [...at, i]));
      return;
    }
    if (value && typeof value === 'object') {
      const props = (node.properties ?? {}) as Record<string, Json>;
      for (const [k, v] of Object.entries(value)) walk(props[k] ?? ((node.additionalProperties ?? {}) as Json), v, [...at, k]);
    }
  };
  walk(root, base, []);
  return cases;
}

/** Runs `run` over `items` with at most `limit` at once. */
export async function withConcurrency<T>(items: readonly T[], limit: number, run: (item: T, lane: number) => Promise<void>): Promise<void> {
  let next = 0;
  await Promise.all(
    Array.from({ length: limit }, async (_, lane) => {
      while (next < items.length) await run(items[next++]!, lane);
    }),
  );
}
