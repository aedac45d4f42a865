/**
 * How many animals a tank holds, fish apart from shrimp and snails (the catalogue says which
 * kinds are invertebrates), and how many kinds. One rule for the tank list (grouped in SQL)
 * and the tank page (its livestock rows).
 */
import { findSpecies } from '../simulation/catalogue';

export interface StockCounts {
  fish: number;
  invertebrates: number;
  species: number;
}

/** A kind of animal: its catalogue id, else its custom name case-folded (as the SQL groups it). */
export function stockKind(item: { speciesId: string | null; customName: string | null }): string {
  return item.speciesId ?? `custom:${(item.customName ?? '').toLowerCase()}`;
}

/** Counts from one row per kind with its number of animals. */
export function stockCounts(groups: readonly { kind: string; animals: number }[]): StockCounts {
  const c: StockCounts = { fish: 0, invertebrates: 0, species: 0 };
  for (const g of groups) {
    if (findSpecies(g.kind)?.invertebrate) c.invertebrates += g.animals;
    else c.fish += g.animals;
    c.species += 1;
  }
  return c;
}

/** Counts of a tank's livestock rows (several rows of one kind are one species). */
export function livestockCounts(items: readonly { speciesId: string | null; customName: string | null; count: number }[]): StockCounts {
  const byKind = new Map<string, number>();
  for (const item of items) byKind.set(stockKind(item), (byKind.get(stockKind(item)) ?? 0) + item.count);
  return stockCounts([...byKind].map(([kind, animals]) => ({ kind, animals })));
}
