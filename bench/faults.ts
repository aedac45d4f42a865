/**
 * Fault bench (issue 7), loopback only, each step bounded in time. Uses its own cluster
 * (pg-faults, port 54374) because F1 kills PostgreSQL.
 *   F1  PostgreSQL killed (pg_ctl -m immediate) under write load, then restarted: the API
 *       answers 503 meanwhile and recovers by itself; every acknowledged write is present.
 *       Negative control: synchronous_commit=off shows this check can see loss.
 *   F2  server SIGKILLed mid-request; clients retry with the same Idempotency-Key: no
 *       acknowledged write lost, none written twice, no half-written key, and no retry
 *       answered 409 (a retry gets the first attempt's answer replayed, or runs it afresh).
 *   F3  SIGTERM: in-flight requests finish, pools close, exit 0.
 *   F4  two server processes on one database: a session made on one works on the other.
 * Run: npm run bench:faults   (exit code 1 when a check fails)
 */
import { execFileSync } from 'node:child_process';
import { randomUUID } from 'node:crypto';
import path from 'node:path';
import {
  CSRF,
  DEMO_MEMBER,
  ROOT,
  VIA_TLS_PROXY,
  freshDatabase,
  getJson,
  psql,
  signIn,
  sleep,
  startCluster,
  stopCluster,
  startServer,
  type Server,
} from './harness.js';

const CLUSTER = 'pg-faults';
const DB_PORT = Number(process.env.FAULTS_DB_PORT ?? 54374);
const PORT_A = Number(process.env.FAULTS_PORT_A ?? 3214);
const PORT_B = Number(process.env.FAULTS_PORT_B ?? 3204);
const WRITERS = 8;

const failures: string[] = [];
function check(ok: boolean, what: string) {
  console.log(`  ${ok ? 'PASS' : 'FAIL'}  ${what}`);
  if (!ok) failures.push(what);
}

function pgCtl(...args: string[]) {
  const bin = execFileSync('bash', ['-c', 'ls -d /usr/lib/postgresql/*/bin | sort -V | tail -n 1'], { encoding: 'utf8' }).trim();
  const cmd = [path.join(bin, 'pg_ctl'), '-D', path.join(ROOT, '.data', CLUSTER), ...args];
  const asRoot = process.getuid?.() === 0;
  execFileSync(asRoot ? 'runuser' : cmd[0]!, asRoot ? ['-u', 'postgres', '--', ...cmd] : cmd.slice(1), { stdio: 'ignore' });
}
const killPostgres = () => pgCtl('-m', 'immediate', 'stop');

interface Op {
  key: string;
  takenAt: string;
  statuses: (number | string)[];
  /** Answers that carried Idempotent-Replayed: true (the first attempt's stored answer). */
  replayed: number;
  outcome?: 'ack' | 'conflict' | 'gave-up';
  at?: number;
}

let inFlight = 0;

/** One POST of a reading; a status, or the network error's name. */
async function post(base: string, cookie: string, tankId: string, op: Op): Promise<number | string> {
  inFlight++;
  try {
    const res = await fetch(`${base}/api/tanks/${tankId}/readings`, {
      method: 'POST',
      headers: { cookie, ...CSRF, ...VIA_TLS_PROXY, 'content-type': 'application/json', 'idempotency-key': op.key },
      body: JSON.stringify({ takenAt: op.takenAt, basis: 'N', tan: 0.5, no2: 0.2, no3: 10, note: 'fault bench' }),
      signal: AbortSignal.timeout(15_000),
    });
    await res.arrayBuffer();
    if (res.headers.get('idempotent-replayed') === 'true') op.replayed++;
    return res.status;
  } catch (err) {
    return (err as { cause?: { code?: string } }).cause?.code ?? (err as Error).name;
  } finally {
    inFlight--;
  }
}

let clock = Date.parse('2019-01-01T00:00:00Z');
const newOp = (): Op => ({ key: randomUUID(), takenAt: new Date((clock += 1000)).toISOString(), statuses: [], replayed: 0 });

/**
 * WRITERS loops posting readings until `stop()` is true. With `retry`, an op is retried with
 * the same key (and body) after a network error or 5xx until answered 201/409 or 40 s pass.
 */
async function writeLoad(base: () => string, cookie: string, tankId: string, stop: () => boolean, retry: boolean): Promise<Op[]> {
  const ops: Op[] = [];
  const t0 = Date.now();
  await Promise.all(
    Array.from({ length: WRITERS }, async () => {
      while (!stop()) {
        const op = newOp();
        ops.push(op);
        const began = Date.now();
        for (;;) {
          const s = await post(base(), cookie, tankId, op);
          op.statuses.push(s);
          if (s === 201) op.outcome = 'ack';
          else if (s === 409) op.outcome = 'conflict';
          if (op.outcome || !retry || Date.now() - began > 40_000) break;
          await sleep(150);
        }
        op.outcome ??= 'gave-up';
        op.at = Date.now() - t0;
        if (op.outcome === 'gave-up') await sleep(100);
      }
    }),
  );
  return ops;
}

function presentTimes(dbUrl: string, tankId: string): Map<number, number> {
  const rows = psql(dbUrl, `SELECT (extract(epoch FROM taken_at) * 1000)::bigint, count(*) FROM readings WHERE tank_id = '${tankId}' GROUP BY 1`);
  const out = new Map<number, number>();
  for (const line of rows.split('\n').filter(Boolean)) {
    const [t, n] = line.split('|');
    out.set(Number(t), Number(n));
  }
  return out;
}

const tally = (ops: Op[]) => {
  const t: Record<string, number> = {};
  for (const op of ops) for (const s of op.statuses) t[String(s)] = (t[String(s)] ?? 0) + 1;
  return t;
};

async function f1(dbUrl: string, server: Server, cookie: string, tankId: string, control: boolean, retryable = false): Promise<number> {
  const label = control ? 'F1 control (synchronous_commit=off)' : 'F1 PostgreSQL killed under write load';
  console.log(`\n${label}`);
  if (control) {
    // Commits are acknowledged before their WAL is flushed; the WAL writer waits up to 10 s.
    psql(dbUrl, `ALTER SYSTEM SET synchronous_commit = off`);
    psql(dbUrl, `ALTER SYSTEM SET wal_writer_delay = '10s'`);
    psql(dbUrl, `SELECT pg_reload_conf()`);
    await sleep(300);
  }
  const pid = server.child.pid;
  let stop = false;
  let phase: 'before' | 'outage' | 'after' = 'before';
  const phaseOf = new Map<Op, string>();
  const load = writeLoad(() => server.url, cookie, tankId, () => stop, false);
  const stamp = setInterval(() => undefined, 1000);
  await sleep(2000);
  phase = 'outage';
  const killedAt = Date.now();
  killPostgres();
  let outageStatuses: Record<string, number> = {};
  if (!control) {
    await sleep(2500);
    const health = await fetch(`${server.url}/api/health`).then((r) => r.status, () => 'neterr');
    check(health === 503, `health answers 503 while PostgreSQL is down (got ${health})`);
  } else {
    await sleep(500);
  }
  startCluster(CLUSTER, DB_PORT, 'shoalshift_faults');
  const downMs = Date.now() - killedAt;
  phase = 'after';
  await sleep(3000);
  stop = true;
  const ops = await load;
  clearInterval(stamp);
  void phase;
  void phaseOf;

  outageStatuses = tally(ops);
  const present = presentTimes(dbUrl, tankId);
  const acked = ops.filter((o) => o.outcome === 'ack');
  const lost = acked.filter((o) => !present.has(Date.parse(o.takenAt)));
  const doubled = [...present.values()].filter((n) => n > 1).length;
  const lastOps = ops.filter((o) => o.at !== undefined).sort((a, b) => a.at! - b.at!).slice(-WRITERS * 3);
  const recovered = lastOps.some((o) => o.outcome === 'ack');
  console.log(`  down ${downMs} ms; answers: ${JSON.stringify(outageStatuses)}; acknowledged ${acked.length}, present ${acked.length - lost.length}, lost ${lost.length}`);
  console.log(`  server pid ${pid} → ${server.child.pid} (exit code so far: ${server.child.exitCode ?? 'running'})`);
  if (server.child.exitCode !== null) console.log(`  server log tail:\n    ${server.log.slice(-12).join('\n    ')}`);
  if (!control) {
    check((outageStatuses['503'] ?? 0) > 0, 'writes during the outage answered 503');
    check(Object.keys(outageStatuses).every((s) => ['201', '503'].includes(s)), 'no answer other than 201 or 503 (no 500s, no hangs)');
    check(server.child.exitCode === null && recovered, 'the same server process answers 201 again after PostgreSQL is back');
    check(lost.length === 0, `every acknowledged write is present (${acked.length - lost.length}/${acked.length})`);
    check(doubled === 0, 'no reading stored twice');
  } else {
    psql(dbUrl, `ALTER SYSTEM RESET synchronous_commit`);
    psql(dbUrl, `ALTER SYSTEM RESET wal_writer_delay`);
    psql(dbUrl, `SELECT pg_reload_conf()`);
    console.log(`  control: ${lost.length} acknowledged writes missing after the immediate kill`);
    if (lost.length > 0 || !retryable) check(lost.length > 0, 'the negative control shows loss (so the F1 check can see it)');
  }
  return lost.length;
}

async function f2(dbUrl: string, cookie: string, tankId: string) {
  console.log('\nF2 server SIGKILLed mid-request; clients retry the same Idempotency-Key');
  let server = await startServer(PORT_A, dbUrl);
  const current = { url: server.url };
  let stop = false;
  const load = writeLoad(() => current.url, cookie, tankId, () => stop, true);
  await sleep(1500);
  const inFlightAtKill = inFlight;
  server.child.kill('SIGKILL');
  await server.exited;
  console.log(`  killed pid ${server.child.pid} with SIGKILL (${inFlightAtKill} requests in flight at the kill); starting a new process`);
  server = await startServer(PORT_A, dbUrl);
  await sleep(2000);
  stop = true;
  const ops = await load;
  const present = presentTimes(dbUrl, tankId);
  const acked = ops.filter((o) => o.outcome === 'ack');
  const conflicts = ops.filter((o) => o.outcome === 'conflict');
  const gaveUp = ops.filter((o) => o.outcome === 'gave-up');
  const retried = ops.filter((o) => o.statuses.length > 1);
  const replayed = ops.filter((o) => o.replayed > 0);
  const lost = acked.filter((o) => !present.has(Date.parse(o.takenAt)));
  const doubled = ops.filter((o) => (present.get(Date.parse(o.takenAt)) ?? 0) > 1);
  const pending = Number(psql(dbUrl, `SELECT count(*) FROM idempotency_keys WHERE status = 0`));
  const orphanKeys = Number(
    psql(dbUrl, `SELECT count(*) FROM idempotency_keys k WHERE k.status = 201 AND NOT EXISTS (SELECT 1 FROM readings r WHERE r.id::text = k.body->>'id')`),
  );
  console.log(
    `  ops ${ops.length}: acknowledged ${acked.length}, 409 on retry ${conflicts.length}, gave up ${gaveUp.length}, retried ${retried.length} (answer replayed ${replayed.length}); answers ${JSON.stringify(tally(ops))}`,
  );
  check(lost.length === 0, `every acknowledged write is present (${acked.length - lost.length}/${acked.length})`);
  check(doubled.length === 0, 'no operation written twice');
  check(pending === 0 && orphanKeys === 0, `no half-written operation (pending keys ${pending}, stored answers without their reading ${orphanKeys})`);
  check(gaveUp.length === 0, 'every operation was answered once the server was back');
  // Each op has its own time, so a 409 can only be a retry meeting its own first write: the key
  // did not hold. A retry must get 201 (the stored answer replayed, or the first run afresh).
  check(conflicts.length === 0, `no keyed retry answered 409 (${conflicts.length})`);
  const once = ops.filter((o) => present.get(Date.parse(o.takenAt)) === 1).length;
  check(once === ops.length, `every operation's reading is stored exactly once (${once}/${ops.length})`);
  return server;
}

async function f3(server: Server, cookie: string, tankId: string, dbUrl: string) {
  console.log('\nF3 SIGTERM with requests in flight');
  const heavy = () =>
    fetch(`${server.url}/api/tanks/${tankId}/ensemble`, {
      method: 'POST',
      headers: { cookie, ...CSRF, ...VIA_TLS_PROXY, 'content-type': 'application/json' },
      body: JSON.stringify({ members: 128 }),
    }).then((r) => r.status, (e: Error) => e.name);
  const inflight = Array.from({ length: 4 }, heavy);
  await sleep(150);
  const t0 = Date.now();
  server.child.kill('SIGTERM');
  const statuses = await Promise.all(inflight);
  const code = await server.exited;
  await sleep(300);
  const left = Number(psql(dbUrl, `SELECT count(*) FROM pg_stat_activity WHERE application_name LIKE 'shoalshift%'`));
  console.log(`  in-flight answers ${JSON.stringify(statuses)}; exit ${code} after ${Date.now() - t0} ms; server connections left ${left}`);
  check(statuses.every((s) => s === 200), 'every in-flight request finished with 200');
  check(code === 0, 'exit code 0');
  check(server.log.some((l) => l.includes('shutdown.done')), 'logged shutdown.done (session store and pools closed)');
  check(left === 0, 'no database connection left open by the server');
}

async function f4(dbUrl: string) {
  console.log('\nF4 two server processes over one database');
  const [a, b] = await Promise.all([startServer(PORT_A, dbUrl), startServer(PORT_B, dbUrl)]);
  try {
    const cookie = await signIn(a.url, DEMO_MEMBER.email, DEMO_MEMBER.password);
    const me = await fetch(`${b.url}/api/me`, { headers: { cookie, ...VIA_TLS_PROXY } });
    check(me.status === 200, `a session made on A (:${PORT_A}) works on B (:${PORT_B}) (${me.status})`);
    await fetch(`${b.url}/api/auth/sign-out`, { method: 'POST', headers: { cookie, ...CSRF, ...VIA_TLS_PROXY } });
    const after = await fetch(`${a.url}/api/me`, { headers: { cookie, ...VIA_TLS_PROXY } });
    check(after.status === 401, `signed out on B, the session is dead on A too (${after.status})`);
  } finally {
    a.child.kill('SIGTERM');
    b.child.kill('SIGTERM');
    await Promise.all([a.exited, b.exited]);
  }
}

async function main() {
  const dbUrl = startCluster(CLUSTER, DB_PORT, 'shoalshift_faults');
  freshDatabase(dbUrl);
  let server = await startServer(PORT_A, dbUrl);
  const cookie = await signIn(server.url, DEMO_MEMBER.email, DEMO_MEMBER.password);
  const tankId = (await getJson<{ tanks: { id: string }[] }>(server.url, '/api/tanks', cookie)).tanks[0]!.id;
  try {
    await f1(dbUrl, server, cookie, tankId, false);
    // The loss window of the control is the WAL not yet written at the kill: it is usually
    // there, but a kill just after the WAL writer ran loses nothing. Up to three tries.
    for (let i = 1; i <= 3; i++) {
      const lost = await f1(dbUrl, server, cookie, tankId, true, i < 3);
      if (lost > 0) break;
    }
    server.child.kill('SIGTERM');
    await server.exited;
    server = await f2(dbUrl, cookie, tankId);
    await f3(server, cookie, tankId, dbUrl);
    await f4(dbUrl);
  } finally {
    if (server.child.exitCode === null) {
      server.child.kill('SIGTERM');
      await server.exited;
    }
    stopCluster(CLUSTER);
  }
  console.log(`\n${failures.length === 0 ? 'all fault checks passed' : `${failures.length} fault check(s) failed:\n  ${failures.join('\n  ')}`}`);
  process.exit(failures.length === 0 ? 0 : 1);
}

main().catch((err: unknown) => {
  console.error(err);
  process.exit(1);
});
