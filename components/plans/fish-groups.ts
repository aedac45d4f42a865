/**
 * The fish of one plan event as form text (pure, no React Native): each group is a row of
 * flat fields named by its schema path, `fish.0.species`, `fish.0.name`, `fish.0.count`,
 * `fish.0.lengthCm`, `fish.0.massG`, so an engine error on `fish.1.lengthCm` lands on that
 * row's length field without a mapping. `species` holds a catalogue id (set by the picker),
 * `name` the keeper's own fish.
 */
import { findSpecies } from '@/simulation/catalogue';
import { MAX_GROUPS_PER_EVENT } from '@/simulation/scenario';
import { parseDecimal, trimNumber } from '@/lib/units-format';

export type GroupFields = Record<string, string>;

/** What a group row can hold: a removal has no size. */
export type GroupShape = 'sized' | 'count-only';

export interface FishGroupValue {
  species?: string;
  name?: string;
  count: number;
  lengthCm?: number;
  massG?: number;
}

const ROW = /^fish\.(\d+)\.(species|name|count|lengthCm|massG)$/;
const PARTS = ['species', 'name', 'count', 'lengthCm', 'massG'] as const;
type Part = (typeof PARTS)[number];

export const groupKey = (i: number, part: Part) => `fish.${i}.${part}`;

/** How many group rows the fields hold (at least one). */
export function groupCount(f: GroupFields): number {
  let n = 0;
  for (const key of Object.keys(f)) {
    const m = ROW.exec(key);
    if (m) n = Math.max(n, Number(m[1]) + 1);
  }
  return Math.max(1, n);
}

export const canAddGroup = (f: GroupFields) => groupCount(f) < MAX_GROUPS_PER_EVENT;

/** The fields without any group rows. */
function withoutGroups(f: GroupFields): GroupFields {
  return Object.fromEntries(Object.entries(f).filter(([k]) => !k.startsWith('fish.')));
}

/** A blank row's text. */
export function blankGroup(i: number): GroupFields {
  return { [groupKey(i, 'species')]: '', [groupKey(i, 'name')]: '', [groupKey(i, 'count')]: '' };
}

/** The fields with one more blank row at the end. */
export function addGroup(f: GroupFields): GroupFields {
  return canAddGroup(f) ? { ...f, ...blankGroup(groupCount(f)) } : f;
}

/** The fields without row `index`; later rows move up one. The last row is emptied, never removed. */
export function removeGroup(f: GroupFields, index: number): GroupFields {
  const n = groupCount(f);
  if (n <= 1) return { ...withoutGroups(f), ...blankGroup(0) };
  const out = withoutGroups(f);
  let to = 0;
  for (let i = 0; i < n; i++) {
    if (i === index) continue;
    for (const part of PARTS) {
      const v = f[groupKey(i, part)];
      if (v !== undefined) out[groupKey(to, part)] = v;
    }
    to++;
  }
  return out;
}

/** Errors re-keyed after removing row `index`, so the messages stay beside their rows. */
export function removeGroupErrors(errors: Record<string, string>, index: number): Record<string, string> {
  const out: Record<string, string> = {};
  for (const [key, message] of Object.entries(errors)) {
    const m = /^fish\.(\d+)\.(.+)$/.exec(key);
    if (!m) out[key] = message;
    else if (Number(m[1]) !== index) out[`fish.${Number(m[1]) > index ? Number(m[1]) - 1 : Number(m[1])}.${m[2]}`] = message;
  }
  return out;
}

const text = (x: number | undefined) => (x === undefined ? '' : trimNumber(x, 2));

/** Groups → row text. */
export function groupsToFields(groups: readonly FishGroupValue[]): GroupFields {
  const out: GroupFields = {};
  (groups.length ? groups : [undefined]).forEach((g, i) => {
    if (!g) return Object.assign(out, blankGroup(0));
    const known = g.species !== undefined;
    out[groupKey(i, 'species')] = g.species ?? '';
    out[groupKey(i, 'name')] = known ? '' : (g.name ?? '');
    out[groupKey(i, 'count')] = text(g.count);
    if (g.lengthCm !== undefined) out[groupKey(i, 'lengthCm')] = text(g.lengthCm);
    if (g.massG !== undefined) out[groupKey(i, 'massG')] = text(g.massG);
  });
  return out;
}

/** Typed text → number; empty → undefined; unreadable → NaN (the schema then names the field). */
function num(t: string | undefined): number | undefined {
  const v = parseDecimal(t ?? '');
  return v === null ? undefined : v;
}

/** Row text → the raw groups the engine's schema then checks (an untouched extra row is left out). */
export function fieldsToGroups(f: GroupFields, shape: GroupShape): Record<string, unknown>[] {
  const out: Record<string, unknown>[] = [];
  const n = groupCount(f);
  for (let i = 0; i < n; i++) {
    const species = (f[groupKey(i, 'species')] ?? '').trim();
    const name = (f[groupKey(i, 'name')] ?? '').trim();
    const count = num(f[groupKey(i, 'count')]);
    const lengthCm = num(f[groupKey(i, 'lengthCm')]);
    const massG = num(f[groupKey(i, 'massG')]);
    const empty = !species && !name && count === undefined && lengthCm === undefined && massG === undefined;
    if (empty && n > 1) continue;
    const who = species && findSpecies(species) ? { species } : species ? { name: species } : name ? { name } : {};
    out.push(shape === 'sized' ? { ...who, count, lengthCm, massG } : { ...who, count });
  }
  return out;
}

/** A group in words: "10 Neon tetra", "3 Big Red (own fish)". */
export function groupWords(g: { species?: string; name?: string; count: number }): string {
  return `${g.count} ${fishName(g.species, g.name)}`;
}

/** Several groups in words: "10 Neon tetra and 6 Bronze corydoras", "1, 2 and 3". */
export function groupsWords(groups: readonly { species?: string; name?: string; count: number }[]): string {
  const parts = groups.map(groupWords);
  return parts.length <= 1 ? (parts[0] ?? 'no fish') : `${parts.slice(0, -1).join(', ')} and ${parts[parts.length - 1]}`;
}

/** A fish as a keeper reads it: the catalogue's common name, else the keeper's own. */
export function fishName(id: string | undefined, name: string | undefined): string {
  if (id) return findSpecies(id)?.commonName ?? name ?? 'fish not in the catalogue';
  return name ?? 'fish';
}
