import { monitorEventLoopDelay } from 'node:perf_hooks';
import { afterAll, describe, expect, it } from 'vitest';
import {
  additionAdviceBodySchema,
  calibrationBodySchema,
  ensembleBodySchema,
  planCreateSchema,
  removalAdviceBodySchema,
  rescueAdviceBodySchema,
} from '../../shared/schemas/plan.js';
import { closeEnginePool } from '../../server/workers/engine-pool.js';
import { createLivestock, createReading, createTank } from './helpers/factories.js';
import { signedInKeeper, type Keeper } from './helpers/keeper-client.js';
import { schemaEdges, withConcurrency, type EdgeCase } from './helpers/schema-edges.js';
import { useTestApp } from './helpers/test-app.js';

/**
 * Engine cost at the schemas' edges (issue 11): every numeric field of the plan, advice,
 * ensemble and calibration bodies at the smallest and largest value its schema accepts, and
 * 1e-9 where it once allowed anything above 0. Each answers in time with 2xx or a 4xx naming
 * the field, the process stays up, and the health check keeps answering quickly meanwhile.
 */

// Two engine threads and two lanes of requests (one keeper each: the per-account cap is 2):
// bounded concurrency keeps this file to about a minute. A run stops at 8 s, so an answer that
// took longer than the 10 s bound would mean a limit did not hold.
const LANES = 2;
const previousThreads = process.env.ENGINE_THREADS;
process.env.ENGINE_THREADS = String(LANES);
const ctx = useTestApp({ env: { ENGINE_TASK_SECONDS: '8', ENGINE_QUEUE_WAIT_SECONDS: '8' } });
afterAll(async () => {
  await closeEnginePool();
  if (previousThreads === undefined) delete process.env.ENGINE_THREADS;
  else process.env.ENGINE_THREADS = previousThreads;
});

const DAY_MS = 86_400_000;
const isoDay = (offsetDays: number) => new Date(Date.now() + offsetDays * DAY_MS).toISOString().slice(0, 10);

const fish = { species: 'harlequin-rasbora', count: 12, lengthCm: 3 };
const settings = { limits: { sensitivityFactor: 0.8, overrides: { nitrite: 0.5 } }, members: 64, seed: 1, boundingSize: 4 };

/** A plan with one event of every kind and every optional number present. */
const planBase = {
  name: 'Edges',
  startDate: isoDay(-10),
  events: [
    { type: 'add-fish', day: 0, fish: { species: 'neon-tetra', count: 6, lengthCm: 3, massG: 0.5 } },
    { type: 'add-fish', day: 1, fish: [{ species: 'neon-tetra', count: 6, lengthCm: 3 }, { name: 'Big red', count: 2, massG: 4 }] },
    { type: 'remove-fish', day: 5, species: 'neon-tetra', count: 2 },
    { type: 'remove-fish', day: 5, fish: [{ species: 'neon-tetra', count: 1 }] },
    { type: 'move-fish', direction: 'in', day: 6, fish: { name: 'guppy', count: 2, lengthCm: 3 } },
    { type: 'feeding', day: 7, feeding: { mode: 'grams', gramsPerDay: 0.5, proteinShare: 0.4 } },
    { type: 'feeding', day: 8, feeding: { mode: 'body-mass', percentPerDay: 2, proteinShare: 0.4 } },
    { type: 'water-change', day: 9, percent: 25 },
    { type: 'ammonia-dose', day: 10, amount: { unit: 'mgN-per-L', value: 0.5 }, repeatEveryDays: 2, repeatCount: 3 },
    { type: 'ammonia-dose', day: 11, amount: { unit: 'ammonium-chloride-g', grams: 0.1 } },
    // Weekly, so the repeat-count edge (1000) stays a few hundred timeline entries; the budget's own tests cover the cap.
    { type: 'ammonia-dose', day: 12, amount: { unit: 'mgN-per-L', value: 0.2 }, timesPerDay: 2, repeatEveryDays: 7, repeatCount: 3 },
    { type: 'ammonia-dose', day: 12, amount: { unit: 'mgN-per-L', value: 0.2 }, delivery: 'continuous', repeatEveryDays: 7, repeatCount: 3 },
    { type: 'ammonia-dose', day: 11, amount: { unit: 'ammonia-solution-mL', mL: 1, percentNH3: 10, densityGPerMl: 0.96 } },
    { type: 'filter-clean', day: 12, zoneId: 'filter', action: 'rinse', shareLost: 0.3 },
    { type: 'medication', day: 13, durationDays: 3, oxidationMultiplier: 0.5 },
    { type: 'temperature', day: 14, temperatureC: 26 },
    { type: 'aeration-loss', day: 15, durationDays: 1, oxygenShare: 0.5 },
  ],
};

interface Target {
  label: string;
  cases: EdgeCase[];
  send(k: Keeper, tankId: string, body: unknown): Promise<{ status: number; body: { error?: { code: string; fields?: Record<string, string> } } }>;
}

const post = (k: Keeper, url: string, body: unknown) => k.post(url, body as object);

const targets: Target[] = [
  {
    label: 'plans (saved, then forecast)',
    cases: schemaEdges(planCreateSchema, planBase),
    async send(k, tankId, body) {
      const created = await post(k, `/api/tanks/${tankId}/plans`, body);
      if (created.status !== 201) return created;
      return post(k, `/api/plans/${created.body.id}/forecast`, {});
    },
  },
  {
    label: 'addition advice',
    cases: schemaEdges(additionAdviceBodySchema, {
      fish: { ...fish, massG: 0.5 },
      constraints: { minBatch: 2, maxBatches: 4, firstDay: 0, latestFinishDay: 60, allowedDays: [0, 7, 14] },
      searchDays: 60,
      settings,
    }),
    send: (k, tankId, body) => post(k, `/api/tanks/${tankId}/advice/addition`, body),
  },
  {
    label: 'removal advice',
    cases: schemaEdges(removalAdviceBodySchema, {
      removals: [{ species: 'neon-tetra', count: 6 }],
      removalDay: 0,
      restockDay: 14,
      restock: [fish],
      solution: { percentNH3: 10, densityGPerMl: 0.96 },
      daysAfterRestock: 14,
    }),
    send: (k, tankId, body) => post(k, `/api/tanks/${tankId}/advice/removal`, body),
  },
  {
    label: 'rescue advice',
    // `settings` is the same schema as in the addition body, whose edges cover it.
    cases: schemaEdges(rescueAdviceBodySchema, { horizonDays: 14, maxPercent: 50, stepPercent: 5, minPercent: 10 }),
    send: (k, tankId, body) => post(k, `/api/tanks/${tankId}/advice/rescue`, body),
  },
  {
    label: 'ensemble',
    cases: schemaEdges(ensembleBodySchema, { members: 64, seed: 1, horizonDays: 30 }),
    send: (k, tankId, body) => post(k, `/api/tanks/${tankId}/ensemble`, body),
  },
  {
    label: 'calibration',
    cases: schemaEdges(calibrationBodySchema, {
      kits: { tan: { stepMgN: 0.25, relativeError: 0.1 }, no2: { stepMgN: 0.25, relativeError: 0.1 } },
      fit: ['ao'],
      forecastDays: 7,
      members: 64,
      seed: 1,
      sinceDays: 30,
    }),
    send: (k, tankId, body) => post(k, `/api/tanks/${tankId}/calibration`, body),
  },
];

const lanes: { keeper: Keeper; tankId: string }[] = [];

async function setUpLanes() {
  const ds = ctx.deps.dataSource;
  lanes.length = 0;
  for (let i = 0; i < LANES; i++) {
    const keeper = await signedInKeeper(ctx, `edges${i}@example.org`);
    const tank = await createTank(ds, keeper.user.id);
    await createLivestock(ds, tank.id, { speciesId: 'neon-tetra', count: 12, lengthCm: 3 });
    for (const [daysAgo, tan] of [[9, 0.3], [6, 0.5], [3, 0.25], [1, 0.1]] as const) {
      await createReading(ds, tank.id, { takenAt: new Date(Date.now() - daysAgo * DAY_MS), tanMgN: tan, no2MgN: tan / 2 });
    }
    lanes.push({ keeper, tankId: tank.id });
  }
}

/** Runs one group of targets' edge cases; see the tests below. */
async function runEdges(group: Target[]) {
  await setUpLanes();
  // Start every engine thread first: a worker's start-up (tsx loading the engine) counts as
  // queue wait and on a busy machine may pass it (503 engine_busy); it is not what this measures.
  await Promise.all(
    lanes.map(async (l) => {
      let status = 0;
      for (let i = 0; i < 10 && status !== 200; i++) status = (await l.keeper.post(`/api/tanks/${l.tankId}/ensemble`, { members: 64, horizonDays: 5 })).status;
      expect(status).toBe(200);
    }),
  );
  const all = group.flatMap((t) => t.cases.map((c) => ({ target: t, edge: c })));
  expect(all.length).toBeGreaterThan(10);

  // The health check, every 50 ms from a client of its own, while the edge cases run.
  const health: number[] = [];
  let running = true;
  const probe = (async () => {
    const { client } = await import('./helpers/test-app.js');
    const anon = client(ctx.app);
    while (running) {
      const t0 = performance.now();
      const res = await anon.get('/api/health');
      health.push(performance.now() - t0);
      expect(res.status).toBe(200);
      await new Promise((r) => setTimeout(r, 50));
    }
  })();
  const loop = monitorEventLoopDelay({ resolution: 10 });
  loop.enable();

  const slowest: { label: string; ms: number }[] = [];
  const failures: string[] = [];
  const t0 = performance.now();
  await withConcurrency(all, LANES, async ({ target, edge }, lane) => {
    const { keeper, tankId } = lanes[lane]!;
    const name = `${target.label}: ${edge.path.join('.')} = ${edge.value}`;
    const started = performance.now();
    const res = await target.send(keeper, tankId, edge.body);
    const ms = performance.now() - started;
    slowest.push({ label: `${name} → ${res.status}`, ms });
    const fields = Object.keys(res.body.error?.fields ?? {});
    if (ms > 10_000) failures.push(`${name}: ${Math.round(ms)} ms`);
    if (res.status === 429) failures.push(`${name}: 429 (lanes must not share an account)`);
    else if (res.status >= 500) failures.push(`${name}: ${res.status} ${JSON.stringify(res.body)}`);
    else if (res.status >= 400 && fields.length === 0) failures.push(`${name}: ${res.status} names no field: ${JSON.stringify(res.body)}`);
    else if (edge.refused && !fields.includes(edge.path.join('.'))) failures.push(`${name}: expected a 400 naming it, got ${res.status} ${JSON.stringify(res.body)}`);
  });
  const totalMs = performance.now() - t0;
  running = false;
  await probe;
  loop.disable();

  health.sort((a, b) => a - b);
  const p99 = health[Math.min(health.length - 1, Math.floor(health.length * 0.99))]!;
  slowest.sort((a, b) => b.ms - a.ms);
  console.log(
    `[edges] ${all.length} cases in ${(totalMs / 1000).toFixed(1)} s; health p99 ${p99.toFixed(0)} ms over ${health.length} probes; ` +
      `event-loop delay max ${(loop.max / 1e6).toFixed(0)} ms; slowest: ${slowest.slice(0, 3).map((s) => `${s.label} ${Math.round(s.ms)} ms`).join('; ')}`,
  );
  expect(failures).toEqual([]);
  expect(p99).toBeLessThan(200);
  // The process is alive and the pool still answers after all of it.
  const after = await lanes[0]!.keeper.post(`/api/tanks/${lanes[0]!.tankId}/ensemble`, { members: 64, horizonDays: 10 });
  expect(after.status).toBe(200);
}

describe('engine cost at the edges of what the schemas accept', () => {
  it('every numeric field of plans, advice and ensembles at its smallest and largest accepted value answers within 10 s with 2xx or a 4xx naming the field, while /api/health stays fast', async () => {
    await runEdges(targets.filter((t) => t.label !== 'calibration'));
  }, 600_000);

  // Kept apart: on a loaded 2-core machine every calibration (even the base body) ran past the
  // 8 s limit and answered 422 engine_time_limit; see the report of issue 11.
  it('every numeric field of the calibration body at its edges answers within 10 s with 2xx or a 4xx naming the field', async () => {
    await runEdges(targets.filter((t) => t.label === 'calibration'));
  }, 600_000);
});
