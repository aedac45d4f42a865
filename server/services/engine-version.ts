import { createHash } from 'node:crypto';
import { existsSync, readdirSync, readFileSync, statSync } from 'node:fs';
import { join, relative, resolve, sep } from 'node:path';

/**
 * The engine's version, derived from its sources when the server boots: a hash of every
 * source file of the engine (simulation/), of the code that shapes a stored forecast from its
 * result, and of the versions of the packages the engine runs on. Any change to them gives a
 * new version, so a cached forecast (keyed by it) cannot outlive a model change, and nobody
 * has to remember a revision number. Reading ~60 small files takes a few milliseconds.
 */

const REPO_ROOT = resolve(__dirname, '../..');

/** Files and folders whose code makes a stored forecast, relative to the repo. */
export const ENGINE_SOURCES = ['simulation', 'shared/forecast-view.ts', 'server/workers/engine-tasks.ts'] as const;

/** Packages the engine may import (tests/unit/layers.test.ts holds simulation/ to these). */
export const ENGINE_PACKAGES = ['zod', 'odex'] as const;

const SOURCE_FILE = /\.(ts|tsx|mts|cts|js|mjs|json)$/;

function filesUnder(path: string): string[] {
  if (!statSync(path).isDirectory()) return [path];
  return readdirSync(path, { withFileTypes: true }).flatMap((e) => (e.isDirectory() ? filesUnder(join(path, e.name)) : SOURCE_FILE.test(e.name) ? [join(path, e.name)] : []));
}

/**
 * sha256 over each source file's path (relative to `root`, `/`-separated) and contents, in path
 * order, then over each package's installed version: independent of the order folders list.
 */
export function engineSourceHash(root: string, sources: readonly string[], packages: readonly string[] = []): string {
  const hash = createHash('sha256');
  const files = sources.flatMap((s) => filesUnder(join(root, s))).map((f) => ({ path: relative(root, f).split(sep).join('/'), full: f }));
  files.sort((a, b) => (a.path < b.path ? -1 : a.path > b.path ? 1 : 0));
  for (const f of files) hash.update(`${f.path}\0`).update(readFileSync(f.full)).update('\0');
  for (const name of packages) {
    const manifest = join(root, 'node_modules', name, 'package.json');
    const version = existsSync(manifest) ? (JSON.parse(readFileSync(manifest, 'utf8')) as { version?: string }).version : 'missing';
    hash.update(`package ${name}@${version}\0`);
  }
  return hash.digest('hex');
}

/** The engine version stored with each cached forecast and sent with each plan forecast. */
export const ENGINE_VERSION = `src-${engineSourceHash(REPO_ROOT, ENGINE_SOURCES, ENGINE_PACKAGES).slice(0, 16)}`;
