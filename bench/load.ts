/**
 * Load bench (issue 7): the real server in its own process (NODE_ENV=production, its own
 * database on the pg-d cluster), driven with autocannon on 127.0.0.1 only, each run bounded
 * in time after a discarded warm-up run. Target: forecast of a saved plan p99 ≤ 50 ms at 50
 * connections, 0 errors.
 * Run: npm run bench:load   (env: LOAD_SECONDS=10 CONNECTIONS=50 BENCH_DB_PORT=54364 BENCH_PORT=3204)
 */
import os from 'node:os';
import autocannon from 'autocannon';
import { CSRF, DEMO_MEMBER, VIA_TLS_PROXY, freshDatabase, getJson, psql, signIn, startCluster, startServer, stopCluster } from './harness.js';

const SECONDS = Number(process.env.LOAD_SECONDS ?? 10);
const WARMUP_SECONDS = 3;
const CONNECTIONS = Number(process.env.CONNECTIONS ?? 50);
const DB_PORT = Number(process.env.BENCH_DB_PORT ?? 54364);
const PORT = Number(process.env.BENCH_PORT ?? 3204);
const CREATE_AMOUNT = Number(process.env.CREATE_AMOUNT ?? 1500);

type Result = autocannon.Result;
type Options = autocannon.Options;

function run(opts: Options): Promise<Result> {
  return new Promise((resolve, reject) => {
    autocannon(opts, (err, result) => (err ? reject(err) : resolve(result)));
  });
}

function status(result: Result, code: number): number {
  const stats = (result as unknown as { statusCodeStats?: Record<string, { count: number }> }).statusCodeStats ?? {};
  return stats[String(code)]?.count ?? 0;
}

/** Status codes other than 2xx with their counts. */
function nonOk(result: Result): Record<string, number> {
  const stats = (result as unknown as { statusCodeStats?: Record<string, { count: number }> }).statusCodeStats ?? {};
  return Object.fromEntries(Object.entries(stats).filter(([code]) => !code.startsWith('2')).map(([code, v]) => [code, v.count]));
}

function line(label: string, r: Result, target?: string): string {
  return [
    label.padEnd(34),
    `${r.requests.average.toFixed(0).padStart(6)} req/s`,
    `p50 ${String(r.latency.p50).padStart(4)} ms`,
    `p97.5 ${String(r.latency.p97_5).padStart(4)} ms`,
    `p99 ${String(r.latency.p99).padStart(4)} ms`,
    `errors ${r.errors + r.timeouts}`,
    `non-2xx ${r.non2xx}${r.non2xx ? ` ${JSON.stringify(nonOk(r))}` : ''}`,
    target ?? '',
  ].join('  ');
}

/** Warm-up (discarded), then the measured run. */
async function measure(opts: Options): Promise<Result> {
  await run({ ...opts, duration: WARMUP_SECONDS });
  return run({ ...opts, duration: SECONDS });
}

async function main() {
  const dbUrl = startCluster('pg-d', DB_PORT, 'shoalshift_load');
  freshDatabase(dbUrl);
  const server = await startServer(PORT, dbUrl);
  const base = server.url;
  try {
    const cookie = await signIn(base, DEMO_MEMBER.email, DEMO_MEMBER.password);
    const headers = { cookie, ...VIA_TLS_PROXY };
    const tanks = await getJson<{ tanks: { id: string }[] }>(base, '/api/tanks', cookie);
    const tankId = tanks.tanks[0]!.id;
    const plans = await getJson<{ plans: { id: string; status: string }[] }>(base, '/api/plans', cookie).catch(() => ({ plans: [] }));
    const planId = plans.plans.find((p) => p.status === 'active')?.id ?? plans.plans[0]?.id;

    console.log(`Shoalshift load bench — ${os.cpus().length} cores (${os.cpus()[0]?.model}), Node ${process.version}, server NODE_ENV=production`);
    console.log(`load average before: ${os.loadavg().map((x) => x.toFixed(2)).join(' ')} (other work on this machine skews the figures)`);
    console.log(`127.0.0.1 only; ${WARMUP_SECONDS} s warm-up discarded, then ${SECONDS} s measured per run; ${CONNECTIONS} connections\n`);

    // 0. The floor of this machine: the health check (no session; one `SELECT 1`) through the
    //    same pipeline (headers, guards, logging) at the same concurrency. No route can beat it.
    const floor = await measure({ url: `${base}/api/health`, connections: CONNECTIONS });
    console.log(line('GET /api/health (floor)', floor));

    // 1. Forecast of a saved plan (served from the engine pool / cache), else the tank detail.
    if (planId) {
      const r = await measure({ url: `${base}/api/plans/${planId}/forecast`, method: 'POST', connections: CONNECTIONS, headers: { ...headers, ...CSRF } });
      const ok = r.latency.p99 <= 50 && r.errors + r.timeouts === 0 && r.non2xx === 0;
      console.log(line('POST /api/plans/:id/forecast', r, `target p99 ≤ 50 ms, 0 errors: ${ok ? 'MET' : 'NOT MET'}`));
      console.log(`  ratio to the floor: ${(r.requests.average / floor.requests.average).toFixed(2)}× its req/s, ${(r.latency.p99 / Math.max(1, floor.latency.p99)).toFixed(1)}× its p99`);
      // Closed loop, 50 connections: latency ≈ connections ÷ throughput (Little's law), so the
      // same route is also measured at a fixed offered rate, where p99 is the service time.
      const rate = Number(process.env.FORECAST_RATE ?? 300);
      const paced = await measure({ url: `${base}/api/plans/${planId}/forecast`, method: 'POST', connections: CONNECTIONS, overallRate: rate, headers: { ...headers, ...CSRF } });
      const pacedOk = paced.latency.p99 <= 50 && paced.errors + paced.timeouts === 0 && paced.non2xx === 0;
      console.log(line(`  same, paced at ${rate} req/s`, paced, `p99 ≤ 50 ms: ${pacedOk ? 'MET' : 'NOT MET'}`));
    } else {
      const r = await measure({ url: `${base}/api/tanks/${tankId}`, connections: CONNECTIONS, headers });
      console.log(line('GET /api/tanks/:id (no plan)', r));
    }

    // 2. Test-log list.
    const list = await measure({ url: `${base}/api/tanks/${tankId}/readings?page=1&pageSize=50`, connections: CONNECTIONS, headers });
    console.log(line('GET /api/tanks/:id/readings', list));

    // 3. Reading create: each request a distinct test time; created rows reconciled with 201s.
    //    A fixed number of requests (not a duration), so no request is still in flight when
    //    the rows are counted: every write is either answered or not sent.
    const count = () => Number(psql(dbUrl, `SELECT count(*) FROM readings WHERE tank_id = '${tankId}' AND note = 'bench'`));
    let n = 0;
    const t0 = Date.parse('2020-01-01T00:00:00Z');
    const createOpts = (): Options => ({
      url: `${base}/api/tanks/${tankId}/readings`,
      method: 'POST',
      connections: CONNECTIONS,
      headers: { ...headers, ...CSRF, 'content-type': 'application/json' },
      requests: [
        {
          setupRequest: (req) => ({
            ...req,
            body: JSON.stringify({ takenAt: new Date(t0 + ++n * 1000).toISOString(), basis: 'N', tan: 0.25, no2: 0.1, no3: 5, note: 'bench' }),
          }),
        },
      ],
    });
    await run({ ...createOpts(), amount: CREATE_AMOUNT / 5 });
    const before = count();
    const create = await run({ ...createOpts(), amount: CREATE_AMOUNT });
    const after = count();
    const created = status(create, 201);
    console.log(line(`POST /api/tanks/:id/readings (${CREATE_AMOUNT} requests)`, create));
    console.log(`  reconcile: ${after - before} rows created, ${created} answers 201 → ${after - before === created ? 'MATCH' : 'MISMATCH'}`);

    // 4. A light route's p99 while heavy advice requests (64-member ensembles) run.
    const light = { url: `${base}/api/me`, connections: 10, headers };
    const alone = await measure(light);
    console.log(line('GET /api/me (alone, 10 conn)', alone));
    const heavyOpts: Options = {
      url: `${base}/api/tanks/${tankId}/ensemble`,
      method: 'POST',
      connections: 4,
      headers: { ...headers, ...CSRF, 'content-type': 'application/json' },
      body: JSON.stringify({ members: 64 }),
    };
    // Heavy requests in small fixed batches until the light run ends: a run stopped by its
    // clock reports the requests it cut off as timeouts, which would read as server errors.
    let lightDone = false;
    const heavyBatches: Result[] = [];
    const heavyRun = (async () => {
      while (!lightDone) heavyBatches.push(await run({ ...heavyOpts, amount: 8 }));
    })();
    await new Promise((r) => setTimeout(r, 1000));
    const during = await run({ ...light, duration: SECONDS });
    lightDone = true;
    await heavyRun;
    console.log(line('GET /api/me (during ensembles)', during));
    const sum = (f: (r: Result) => number) => heavyBatches.reduce((a, r) => a + f(r), 0);
    console.log(
      [
        'POST /api/tanks/:id/ensemble (4 conn)'.padEnd(34),
        `${sum((r) => r.requests.total)} requests`,
        `slowest ${Math.max(...heavyBatches.map((r) => r.latency.max))} ms`,
        `errors ${sum((r) => r.errors + r.timeouts)}`,
        `non-2xx ${sum((r) => r.non2xx)}`,
      ].join('  '),
    );
  } finally {
    server.child.kill('SIGTERM');
    const code = await server.exited;
    console.log(`\nserver stopped with SIGTERM → exit ${code}`);
    if (code !== 0) console.log(server.log.filter((l) => !l.startsWith('    at ')).slice(-8).join('\n'));
    stopCluster('pg-d');
  }
}

main().catch((err: unknown) => {
  console.error(err);
  process.exit(1);
});
