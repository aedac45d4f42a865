import { readdirSync, readFileSync } from 'node:fs';
import { dirname, join, relative, resolve, sep } from 'node:path';
import ts from 'typescript';
import { describe, expect, it } from 'vitest';

/**
 * The layers: the engine (simulation/) at the bottom imports nothing else of the repo, so the
 * same code runs in the browser, on the server and from bin/; shared/ (the wire contract) sits
 * above it; server/ and the client on top. Import specifiers are read with TypeScript's own
 * pre-processor, so `import type`, `export … from` and `import()` count too.
 */

const root = resolve(__dirname, '../..');
const ENGINE = 'simulation';
/** Packages the engine may use: pure computation, no I/O, nothing platform-specific. */
const ENGINE_PACKAGES = ['zod', 'odex', 'ml-levenberg-marquardt', 'mathjs'];

function sourceFiles(dir: string): string[] {
  return readdirSync(dir, { withFileTypes: true }).flatMap((e) => {
    const path = join(dir, e.name);
    if (e.isDirectory()) return sourceFiles(path);
    return /\.(ts|tsx|mts|cts|js|mjs)$/.test(e.name) ? [path] : [];
  });
}

function specifiers(source: string): string[] {
  return ts.preProcessFile(source, true, true).importedFiles.map((f) => f.fileName);
}

/** Why one import of an engine file (path relative to the repo) breaks the layering, or null. */
export function engineImportProblem(file: string, specifier: string): string | null {
  if (specifier.startsWith('.')) {
    const target = relative(root, resolve(root, dirname(file), specifier)).split(sep).join('/');
    return target === ENGINE || target.startsWith(`${ENGINE}/`) ? null : `${file} imports ${specifier} (${target}), outside ${ENGINE}/`;
  }
  if (specifier.startsWith('@/')) {
    return specifier.startsWith(`@/${ENGINE}/`) ? null : `${file} imports ${specifier}, outside ${ENGINE}/`;
  }
  const name = specifier.startsWith('@') ? specifier.split('/').slice(0, 2).join('/') : specifier.split('/')[0];
  return ENGINE_PACKAGES.includes(name) ? null : `${file} imports the package ${specifier}, not one the engine may use`;
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
