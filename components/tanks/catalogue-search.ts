import type { CatalogueEntry } from '@/simulation/catalogue';

const fold = (s: string) => s.normalize('NFD').replace(/[\u0300-\u036f]/g, '').toLowerCase();

/**
 * Catalogue entries matching every word of the query in the common or scientific name,
 * names starting with the query first; an empty query lists the catalogue in its order.
 */
export function searchCatalogue(entries: readonly CatalogueEntry[], query: string): CatalogueEntry[] {
  const words = fold(query).split(/\s+/).filter(Boolean);
  if (words.length === 0) return [...entries];
  const hits = entries.filter((e) => {
    const hay = fold(`${e.commonName} ${e.scientificName}`);
    return words.every((w) => hay.includes(w));
  });
  const q = fold(query.trim());
  return hits.sort((a, b) => Number(!fold(a.commonName).startsWith(q)) - Number(!fold(b.commonName).startsWith(q)));
}
