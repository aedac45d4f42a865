import { readdirSync, readFileSync } from 'node:fs';
import { join, relative, resolve, sep } from 'node:path';
import { describe, expect, it } from 'vitest';

/**
 * The server's error vocabulary is one list: the factories in server/errors.ts. An AppError made
 * anywhere else adds a status, code or wording the list does not show.
 */

const root = resolve(__dirname, '../..');
const VOCABULARY = 'server/errors.ts';
const CONSTRUCTION = /new\s+AppError\s*\(/g;

function sourceFiles(dir: string): string[] {
  return readdirSync(dir, { withFileTypes: true }).flatMap((e) => {
    const path = join(dir, e.name);
    if (e.isDirectory()) return e.name === 'node_modules' ? [] : sourceFiles(path);
    return /\.(ts|tsx|mts|cts|js|mjs|cjs)$/.test(e.name) ? [path] : [];
  });
}

/** `file:line` of each AppError constructed outside the vocabulary. */
function inlineAppErrors(files: ReadonlyMap<string, string>): string[] {
  const found: string[] = [];
  for (const [file, source] of files) {
    if (file === VOCABULARY) continue;
    for (const match of source.matchAll(CONSTRUCTION)) found.push(`${file}:${source.slice(0, match.index).split('\n').length}`);
  }
  return found;
}

describe('the error vocabulary', () => {
  it('constructs every AppError in server/errors.ts, through its named factories', () => {
    const files = new Map(sourceFiles(join(root, 'server')).map((p) => [relative(root, p).split(sep).join('/'), readFileSync(p, 'utf8')]));
    expect(files.has(VOCABULARY)).toBe(true);
    expect(inlineAppErrors(files)).toEqual([]);
  });

  it('names the file and line of an AppError made elsewhere', () => {
    const files = new Map([
      [VOCABULARY, "export const notFound = () => new AppError(404, 'not_found', 'Not found.');"],
      ['server/routes/x.ts', "import { AppError } from '../errors.js';\n\nthrow new AppError(418, 'teapot', 'No.');"],
    ]);
    expect(inlineAppErrors(files)).toEqual(['server/routes/x.ts:3']);
  });
});
