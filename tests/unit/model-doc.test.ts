import { readdirSync, readFileSync } from 'node:fs';
import { join, relative, resolve, sep } from 'node:path';
import { describe, expect, it } from 'vitest';
import { PARAMETERS, PARAMETER_KEYS } from '@/simulation/parameters';

/**
 * simulation/MODEL.md describes the engine; the code cites its sections as "MODEL.md §N". This
 * keeps the two from drifting apart: its parameter table (§5.1) must carry every key of
 * parameters.ts with the code's unit, default, range and tag (descriptions and sources are
 * prose and not compared), and every "MODEL.md §…" citation — and every bare "§…" inside
 * MODEL.md itself — must name a section heading that exists.
 */

const root = resolve(__dirname, '../..');
const DOC = 'simulation/MODEL.md';
const CITING_FOLDERS = ['simulation', 'shared', 'server', 'tests'];
const doc = readFileSync(join(root, DOC), 'utf8');

/** A run of section numbers after a file name: "§3.4", "§2–§4", "§1–2, §9", "§3a". */
const SECTION_RUN = /(?:§?\d+(?:\.\d+)?[a-z]?(?:\s*(?:[–,-]|and)\s*)?)+/.source;
const MODEL_CITATION = new RegExp(`MODEL\\.md\\s*(§${SECTION_RUN})`, 'g');
const SOURCES_CITATION = new RegExp(`SOURCES\\.md\\s*§${SECTION_RUN}`, 'g');
const HEADING = /^#{2,6}\s+§(\d+(?:\.\d+)?)\s/gm;

const sections = new Set([...doc.matchAll(HEADING)].map((m) => m[1]));
const sectionsIn = (run: string) => [...run.matchAll(/§(\d+(?:\.\d+)?)/g)].map((m) => m[1]);

function textFiles(dir: string): string[] {
  return readdirSync(dir, { withFileTypes: true }).flatMap((e) => {
    const path = join(dir, e.name);
    if (e.isDirectory()) return e.name === 'node_modules' ? [] : textFiles(path);
    return /\.(ts|tsx|mts|cts|js|mjs|md)$/.test(e.name) ? [path] : [];
  });
}

const citingFiles = CITING_FOLDERS.flatMap((f) => textFiles(join(root, f))).map((path) => ({
  file: relative(root, path).split(sep).join('/'),
  text: readFileSync(path, 'utf8'),
}));

const lineOf = (text: string, index: number) => text.slice(0, index).split('\n').length;

/** Cells of a Markdown table row, with `\|` kept inside a cell. */
function cells(row: string): string[] {
  return row
    .trim()
    .replace(/^\||\|$/g, '')
    .split(/(?<!\\)\|/)
    .map((c) => c.trim().replace(/\\\|/g, '|'));
}

/** The rows of the parameter table in §5.1, by key. */
function parameterTable(): Map<string, Record<string, string>> {
  const start = doc.search(/^### §5\.1\s/m);
  expect(start, `${DOC} has no §5.1 heading`).toBeGreaterThanOrEqual(0);
  const rest = doc.slice(start).split('\n').slice(1);
  const end = rest.findIndex((line) => /^#{2,6}\s/.test(line));
  const lines = (end < 0 ? rest : rest.slice(0, end)).filter((line) => line.trim().startsWith('|'));
  const header = cells(lines[0]);
  const rows = new Map<string, Record<string, string>>();
  for (const line of lines.slice(2)) {
    const row = Object.fromEntries(cells(line).map((c, i) => [header[i], c]));
    rows.set(row.key.replace(/`/g, ''), row);
  }
  return rows;
}

describe('simulation/MODEL.md against the code', () => {
  it('numbers its sections §1 to §10', () => {
    for (let n = 1; n <= 10; n++) expect(sections.has(String(n)), `§${n}`).toBe(true);
  });

  it('lists every parameter of parameters.ts in its table, and no other', () => {
    const table = parameterTable();
    expect([...table.keys()].sort()).toEqual([...PARAMETER_KEYS].sort());
  });

  it('gives each parameter the unit, default, range and tag of parameters.ts', () => {
    const table = parameterTable();
    const differences: string[] = [];
    for (const key of PARAMETER_KEYS) {
      const row = table.get(key);
      if (!row) continue; // reported by the test above
      const spec = PARAMETERS[key];
      for (const field of ['default', 'min', 'max'] as const) {
        if (Number(row[field]) !== spec[field]) differences.push(`${key}.${field}: table ${row[field]}, code ${spec[field]}`);
      }
      if (row.unit !== spec.unit) differences.push(`${key}.unit: table "${row.unit}", code "${spec.unit}"`);
      if (row.tag !== spec.tag) differences.push(`${key}.tag: table ${row.tag}, code ${spec.tag}`);
    }
    expect(differences).toEqual([]);
  });

  it('is cited only by sections it has (simulation/, shared/, server/, tests/)', () => {
    const unknown: string[] = [];
    for (const { file, text } of citingFiles) {
      for (const m of text.matchAll(MODEL_CITATION)) {
        for (const s of sectionsIn(m[1])) if (!sections.has(s)) unknown.push(`${file}:${lineOf(text, m.index)} cites MODEL.md §${s}`);
      }
    }
    expect(sections.size).toBeGreaterThan(10);
    expect(unknown).toEqual([]);
  });

  it('refers inside itself only to sections it has', () => {
    // Headings define sections; references to SOURCES.md's own numbering are not ours.
    const body = doc.replace(HEADING, '').replace(SOURCES_CITATION, '');
    const unknown = sectionsIn(body).filter((s) => !sections.has(s));
    expect(unknown).toEqual([]);
  });

  it('has replaced every citation of the external science brief in code and tests', () => {
    const brief = /\bmodel\.md\b/g; // lower case: the brief outside the repo, never in code
    const left = citingFiles
      .filter(({ file }) => !file.endsWith('.md'))
      .flatMap(({ file, text }) => [...text.matchAll(brief)].map((m) => `${file}:${lineOf(text, m.index)}`));
    expect(left).toEqual([]);
  });
});
