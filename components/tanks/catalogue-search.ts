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

/** Most matches the species picker lists at once. */
export const PICKER_RESULTS = 6;

/**
 * What the species picker offers for a query: matching catalogue entries (the `preferred`
 * ones, e.g. the tank's own fish, first; with an empty query only those), and whether to offer
 * the typed words as the keeper's own fish (when no entry is named exactly that).
 */
export function pickerOptions(
  entries: readonly CatalogueEntry[],
  query: string,
  preferred: readonly string[] = [],
): { results: CatalogueEntry[]; offerCustom: boolean } {
  const q = fold(query.trim());
  const rank = (e: CatalogueEntry) => (preferred.includes(e.id) ? 0 : 1);
  if (!q) return { results: entries.filter((e) => preferred.includes(e.id)).slice(0, PICKER_RESULTS), offerCustom: false };
  const results = searchCatalogue(entries, query)
    .map((e, i) => ({ e, i }))
    .sort((a, b) => rank(a.e) - rank(b.e) || a.i - b.i)
    .map(({ e }) => e)
    .slice(0, PICKER_RESULTS);
  return { results, offerCustom: !entries.some((e) => fold(e.commonName) === q) };
}
