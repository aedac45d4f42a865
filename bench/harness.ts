/**
 * Shared by bench/load.ts and bench/faults.ts: a project-local PostgreSQL cluster, a migrated
 * and seeded database, and the real server started as a child process (loopback only).
 */
import { execFileSync, spawn, type ChildProcess } from 'node:child_process';
import { randomBytes } from 'node:crypto';
import fs from 'node:fs';
import path from 'node:path';
import { DEMO_PEOPLE } from '../server/demo-people.js';

export const ROOT = path.resolve(import.meta.dirname, '..');
const TSX = [path.join(ROOT, 'node_modules/tsx/dist/cli.mjs'), '--tsconfig', path.join(ROOT, 'server/tsconfig.json')];
export const CSRF = { 'x-shoalshift-csrf': '1' };

/** Starts (creating if needed) cluster `name` on `port` with database `db`; returns its URL. */
export function startCluster(name: string, port: number, db: string): string {
  const out = execFileSync('bash', [path.join(ROOT, 'scripts/db.sh'), 'start', name, String(port), db], { cwd: ROOT, encoding: 'utf8' });
  const line = out.trim().split('\n').pop() ?? '';
  if (!line.startsWith('DATABASE_URL=')) throw new Error(`db.sh gave no URL: ${out}`);
  return line.slice('DATABASE_URL='.length);
}

export function stopCluster(name: string): void {
  execFileSync('bash', [path.join(ROOT, 'scripts/db.sh'), 'stop', name], { cwd: ROOT, stdio: 'ignore' });
}

/** Empties the database, then migrates and seeds the demo data. */
export function freshDatabase(url: string): void {
  execFileSync('psql', [url, '-qc', 'drop schema public cascade; create schema public;'], { stdio: 'ignore' });
  execFileSync('psql', [url, '-qc', 'drop schema if exists pgboss cascade;'], { stdio: 'ignore' });
  const env = { ...process.env, DATABASE_URL: url, NODE_ENV: 'development' };
  execFileSync('node', [...TSX, 'server/migrate.ts'], { cwd: ROOT, env, stdio: 'ignore' });
  execFileSync('node', [...TSX, 'server/seed.ts'], { cwd: ROOT, env, stdio: 'ignore' });
}

export function psql(url: string, sql: string): string {
  return execFileSync('psql', [url, '-Atqc', sql], { encoding: 'utf8' }).trim();
}

export interface Server {
  child: ChildProcess;
  url: string;
  log: string[];
  exited: Promise<number | null>;
}

export const SESSION_SECRET = randomBytes(48).toString('base64url');
/** Production requires its own unsubscribe key, different from the session secret. */
const UNSUBSCRIBE_SECRET = randomBytes(48).toString('base64url');

/** The real server (server/index.ts) in its own process, production settings, on 127.0.0.1. */
export async function startServer(port: number, databaseUrl: string, extraEnv: Record<string, string> = {}): Promise<Server> {
  // Something already answering on the port would be measured instead: refuse.
  if (await fetch(`http://127.0.0.1:${port}/api/health`).then(() => true, () => false)) {
    throw new Error(`port ${port} is already in use: stop what runs there, or set another port`);
  }
  const staticDir = fs.mkdtempSync('/tmp/shoalshift-bench-static-');
  fs.writeFileSync(path.join(staticDir, 'index.html'), '<!doctype html><title>Shoalshift</title>');
  // tsx loaded into the server's own node process (not tsx's CLI, which runs the server as a
  // grandchild): a signal sent to `child` then reaches the server itself.
  const child = spawn('node', ['--import', 'tsx', 'server/index.ts'], {
    cwd: ROOT,
    env: {
      PATH: process.env.PATH ?? '',
      TSX_TSCONFIG_PATH: path.join(ROOT, 'server/tsconfig.json'),
      NODE_ENV: 'production',
      DATABASE_URL: databaseUrl,
      PORT: String(port),
      HOST: '127.0.0.1',
      APP_URL: `https://127.0.0.1:${port}`,
      SESSION_SECRET,
      UNSUBSCRIBE_SECRET,
      STATIC_DIR: staticDir,
      // Nothing listens there: no bench step sends mail (override when 2631 is taken).
      SMTP_PORT: process.env.BENCH_SMTP_PORT ?? '2631',
      // The benches send four heavy requests at once from one demo account; the default cap
      // of two per account would answer half of them 429 (tests/api/engine-limits.test.ts tests the cap).
      ENGINE_REQUESTS_PER_ACCOUNT: '4',
      ...extraEnv,
    },
    stdio: ['ignore', 'pipe', 'pipe'],
  });
  const log: string[] = [];
  child.stdout!.on('data', (d: Buffer) => log.push(...d.toString().split('\n').filter(Boolean)));
  child.stderr!.on('data', (d: Buffer) => log.push(...d.toString().split('\n').filter(Boolean)));
  const exited = new Promise<number | null>((resolve) =>
    child.once('exit', (code) => {
      fs.rmSync(staticDir, { recursive: true, force: true });
      resolve(code);
    }),
  );
  const url = `http://127.0.0.1:${port}`;
  const deadline = Date.now() + 30_000;
  for (;;) {
    if (child.exitCode !== null) throw new Error(`server exited ${child.exitCode}:\n${log.join('\n')}`);
    const ok = await fetch(`${url}/api/health`).then((r) => r.ok, () => false);
    if (ok) break;
    if (Date.now() > deadline) throw new Error(`server did not start:\n${log.join('\n')}`);
    await sleep(200);
  }
  return { child, url, log, exited };
}

export const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

/**
 * Production cookies are Secure: the server sets them only for HTTPS. The bench talks plain
 * HTTP on loopback as a TLS-terminating proxy would (trust proxy = loopback).
 */
export const VIA_TLS_PROXY = { 'x-forwarded-proto': 'https' };

/** Signs in and returns the `Cookie` header value. */
export async function signIn(base: string, email: string, password: string): Promise<string> {
  const res = await fetch(`${base}/api/auth/sign-in`, {
    method: 'POST',
    headers: { 'content-type': 'application/json', ...CSRF, ...VIA_TLS_PROXY },
    body: JSON.stringify({ email, password }),
  });
  if (!res.ok) throw new Error(`sign-in ${res.status}: ${await res.text()}`);
  const cookie = res.headers.getSetCookie().find((c) => c.startsWith('shoalshift.sid='));
  if (!cookie) throw new Error('no session cookie');
  return cookie.split(';')[0]!;
}

export async function getJson<T>(base: string, route: string, cookie: string): Promise<T> {
  const res = await fetch(`${base}${route}`, { headers: { cookie, ...VIA_TLS_PROXY } });
  if (!res.ok) throw new Error(`GET ${route} ${res.status}`);
  return (await res.json()) as T;
}

export const DEMO_MEMBER = DEMO_PEOPLE.find((p) => p.key === 'member')!;
