import { readdirSync, readFileSync } from 'node:fs';
import { dirname, join, relative, resolve, sep } from 'node:path';
import ts from 'typescript';
import { describe, expect, it } from 'vitest';
import { ENGINE_PACKAGES } from '../../server/services/engine-version';

/**
 * The layers: the engine (simulation/) at the bottom imports nothing else of the repo, so the
 * same code runs in the browser, on the server and from bin/; shared/ (the wire contract) sits
 * above it; server/ and the client on top. Import specifiers are read with TypeScript's own
 * pre-processor, so `import type`, `export … from` and `import()` count too.
 */

const root = resolve(__dirname, '../..');
const ENGINE = 'simulation';
/** Packages the engine may use (pure computation, no I/O, nothing platform-specific): their versions are part of the engine's version. */
const enginePackages: readonly string[] = ENGINE_PACKAGES;

function sourceFiles(dir: string): string[] {
  return readdirSync(dir, { withFileTypes: true }).flatMap((e) => {
    const path = join(dir, e.name);
    if (e.isDirectory()) return sourceFiles(path);
    return /\.(ts|tsx|mts|cts|js|mjs)$/.test(e.name) ? [path] : [];
  });
}

/** Files of the repo's code folders, by path relative to the repo. */
function repoFiles(folders: string[]): Map<string, string> {
  const out = new Map<string, string>();
  for (const folder of folders) for (const path of sourceFiles(join(root, folder))) out.set(relative(root, path).split(sep).join('/'), readFileSync(path, 'utf8'));
  return out;
}

function specifiers(source: string): string[] {
  return ts.preProcessFile(source, true, true).importedFiles.map((f) => f.fileName);
}

/** Why one import of an engine file (path relative to the repo) breaks the layering, or null. */
function engineImportProblem(file: string, specifier: string): string | null {
  if (specifier.startsWith('.')) {
    const target = relative(root, resolve(root, dirname(file), specifier)).split(sep).join('/');
    return target === ENGINE || target.startsWith(`${ENGINE}/`) ? null : `${file} imports ${specifier} (${target}), outside ${ENGINE}/`;
  }
  if (specifier.startsWith('@/')) {
    return specifier.startsWith(`@/${ENGINE}/`) ? null : `${file} imports ${specifier}, outside ${ENGINE}/`;
  }
  const name = specifier.startsWith('@') ? specifier.split('/').slice(0, 2).join('/') : specifier.split('/')[0];
  return enginePackages.includes(name) ? null : `${file} imports the package ${specifier}, not one the engine may use`;
}

function engineProblems(files: { file: string; source: string }[]): string[] {
  return files.flatMap(({ file, source }) => specifiers(source).map((s) => engineImportProblem(file, s)).filter((p): p is string => p !== null));
}

describe('the engine at the bottom', () => {
  const files = sourceFiles(join(root, ENGINE)).map((path) => ({ file: relative(root, path).split(sep).join('/'), source: readFileSync(path, 'utf8') }));

  it('reads every engine source file', () => {
    expect(files.length).toBeGreaterThan(30);
    expect(files.some((f) => f.file === 'simulation/advice/schemas.ts')).toBe(true);
  });

  it('imports nothing from shared/, server/, components/, lib/, hooks/, app/ or any other folder of the repo', () => {
    expect(engineProblems(files)).toEqual([]);
  });

  it('catches each kind of import that would break the layering', () => {
    const bad = [
      "import { fieldErrors } from '../../shared/api-error';",
      "import type { Plan } from '../../server/entities/plan.js';",
      "export { formatNumber } from '@/lib/format';",
      "const hooks = import('../../hooks/use-plans');",
      "import { readFileSync } from 'node:fs';",
      "import { View } from 'react-native';",
    ];
    expect(engineProblems(bad.map((source) => ({ file: 'simulation/advice/x.ts', source })))).toHaveLength(bad.length);
    const good = ["import { z } from 'zod';", "import type { Scenario } from '../scenario';", "import { Solver } from 'odex';", "export * from './session';"];
    expect(engineProblems(good.map((source) => ({ file: 'simulation/advice/x.ts', source })))).toEqual([]);
  });
});

/** The repo file an import names (relative or `@/`, with or without `.js`), or null for a package. */
function resolveImport(files: Map<string, string>, file: string, specifier: string): string | null {
  let target: string;
  if (specifier.startsWith('@/')) target = specifier.slice(2);
  else if (specifier.startsWith('.')) target = relative(root, resolve(root, dirname(file), specifier)).split(sep).join('/');
  else return null;
  target = target.replace(/\.js$/, '');
  return [`${target}.ts`, `${target}.tsx`, `${target}/index.ts`, `${target}/index.tsx`, target].find((c) => files.has(c)) ?? null;
}

/** Import cycles (type-only imports included), each as the files of one strongly connected group. */
function importCycles(files: Map<string, string>): string[][] {
  const edges = new Map([...files].map(([file, source]) => [file, specifiers(source).map((s) => resolveImport(files, file, s)).filter((t): t is string => t !== null)]));
  // Tarjan's strongly connected components.
  let counter = 0;
  const index = new Map<string, number>();
  const low = new Map<string, number>();
  const stack: string[] = [];
  const onStack = new Set<string>();
  const groups: string[][] = [];
  const visit = (v: string) => {
    index.set(v, counter);
    low.set(v, counter++);
    stack.push(v);
    onStack.add(v);
    for (const w of edges.get(v) ?? []) {
      if (!index.has(w)) {
        visit(w);
        low.set(v, Math.min(low.get(v)!, low.get(w)!));
      } else if (onStack.has(w)) low.set(v, Math.min(low.get(v)!, index.get(w)!));
    }
    if (low.get(v) === index.get(v)) {
      const group: string[] = [];
      let w: string;
      do {
        w = stack.pop()!;
        onStack.delete(w);
        group.push(w);
      } while (w !== v);
      if (group.length > 1 || edges.get(v)!.includes(v)) groups.push(group.sort());
    }
  };
  for (const v of edges.keys()) if (!index.has(v)) visit(v);
  return groups;
}

describe('no import cycles', () => {
  it('no file of the app, the server, shared/ or the engine reaches itself through its imports', () => {
    expect(importCycles(repoFiles(['simulation', 'shared', 'server', 'components', 'lib', 'hooks', 'app', 'bin']))).toEqual([]);
  });

  it('finds a cycle made only of type imports', () => {
    const files = new Map([
      ['server/deps.ts', "import type { JobQueue } from './jobs/runner.js';"],
      ['server/jobs/runner.ts', "import type { AppDeps } from '../deps.js';"],
      ['server/app.ts', "import type { AppDeps } from './deps.js';"],
    ]);
    expect(importCycles(files)).toEqual([['server/deps.ts', 'server/jobs/runner.ts']]);
  });
});
