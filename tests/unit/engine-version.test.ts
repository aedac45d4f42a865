import { cpSync, mkdtempSync, renameSync, rmSync, writeFileSync, appendFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import { afterEach, describe, expect, it } from 'vitest';
import { ENGINE_PACKAGES, ENGINE_SOURCES, ENGINE_VERSION, engineSourceHash } from '../../server/services/engine-version';

const root = resolve(__dirname, '../..');
const copies: string[] = [];

/** A copy of the engine's sources (and the engine's packages' manifests) in a folder of its own. */
function copyOfEngine(): string {
  const dir = mkdtempSync(join(tmpdir(), 'engine-version-'));
  copies.push(dir);
  for (const source of ENGINE_SOURCES) cpSync(join(root, source), join(dir, source), { recursive: true });
  for (const name of ENGINE_PACKAGES) cpSync(join(root, 'node_modules', name, 'package.json'), join(dir, 'node_modules', name, 'package.json'));
  return dir;
}

const hashOf = (dir: string) => engineSourceHash(dir, ENGINE_SOURCES, ENGINE_PACKAGES);

afterEach(() => {
  for (const dir of copies.splice(0)) rmSync(dir, { recursive: true, force: true });
});

describe('the engine version, derived from its sources', () => {
  it('is the hash of the engine sources the server runs', () => {
    expect(ENGINE_VERSION).toBe(`src-${hashOf(root).slice(0, 16)}`);
    expect(hashOf(copyOfEngine())).toBe(hashOf(root));
  });

  it('changes when one engine source changes, even by a comment', () => {
    const dir = copyOfEngine();
    const before = hashOf(dir);
    appendFileSync(join(dir, 'simulation/forecast/events.ts'), '\n// a change\n');
    expect(hashOf(dir)).not.toBe(before);
  });

  it('changes when a parameter default, a file name or a new file changes, and when the code shaping a stored forecast does', () => {
    const dir = copyOfEngine();
    const seen = new Set([hashOf(dir)]);
    const change = (act: () => void) => {
      act();
      const h = hashOf(dir);
      expect(seen.has(h)).toBe(false);
      seen.add(h);
    };
    change(() => appendFileSync(join(dir, 'simulation/parameters.ts'), '\nexport const EXTRA = 1;\n'));
    change(() => renameSync(join(dir, 'simulation/units.ts'), join(dir, 'simulation/units-renamed.ts')));
    change(() => writeFileSync(join(dir, 'simulation/advice/new-advisor.ts'), 'export const x = 1;\n'));
    change(() => appendFileSync(join(dir, 'shared/forecast-view.ts'), '\n'));
    change(() => writeFileSync(join(dir, 'node_modules/odex/package.json'), JSON.stringify({ name: 'odex', version: '9.9.9' })));
  });

  it('does not change when files outside the engine change', () => {
    const dir = copyOfEngine();
    const before = hashOf(dir);
    writeFileSync(join(dir, 'README.md'), 'notes');
    writeFileSync(join(dir, 'simulation/notes.txt'), 'not a source file');
    expect(hashOf(dir)).toBe(before);
  });
});
