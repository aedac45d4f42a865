import { describe, expect, it } from 'vitest';
import { PICKER_RESULTS, pickerOptions, searchCatalogue } from '@/components/tanks/catalogue-search';
import { CATALOGUE } from '@/simulation/catalogue';

/** The species picker's search (components/tanks/catalogue-search.ts), used by livestock and plan events. */
describe('species picker search', () => {
  const ids = (q: string, preferred?: string[]) => pickerOptions(CATALOGUE, q, preferred).results.map((e) => e.id);

  it('finds a fish by the common name a keeper types, in any case, with or without accents', () => {
    expect(ids('Neon tetra')[0]).toBe('neon-tetra');
    expect(ids('NEON')[0]).toBe('neon-tetra');
    expect(ids('corydoras')).toEqual(['bronze-corydoras', 'panda-corydoras']);
    expect(ids('boeseman')).toEqual(['boesemani-rainbowfish']);
    expect(ids('tetra neon')[0]).toBe('neon-tetra');
  });

  it('lists names starting with the words first', () => {
    const hits = searchCatalogue(CATALOGUE, 'pe').map((e) => e.commonName.toLowerCase().startsWith('pe'));
    expect(hits.length).toBeGreaterThan(1);
    expect(hits).toEqual([...hits].sort((a, b) => Number(b) - Number(a)));
    expect(ids('platy')).toEqual(['platy']);
  });

  it('shows at most a handful of matches at once', () => {
    expect(pickerOptions(CATALOGUE, 'a').results.length).toBeLessThanOrEqual(PICKER_RESULTS);
  });

  it("lists the tank's own fish first, and alone before anything is typed", () => {
    expect(ids('', ['platy', 'guppy'])).toEqual(['guppy', 'platy']);
    expect(ids('')).toEqual([]);
    expect(ids('tetra', ['cardinal-tetra'])[0]).toBe('cardinal-tetra');
  });

  it('offers the typed words as your own fish unless a catalogue fish has exactly that name', () => {
    expect(pickerOptions(CATALOGUE, 'Big red').offerCustom).toBe(true);
    expect(pickerOptions(CATALOGUE, 'big red').results).toEqual([]);
    expect(pickerOptions(CATALOGUE, 'neon tetra').offerCustom).toBe(false);
    expect(pickerOptions(CATALOGUE, 'neon').offerCustom).toBe(true);
    expect(pickerOptions(CATALOGUE, '   ').offerCustom).toBe(false);
  });

  it('gives every match a plain common name, never a catalogue id', () => {
    for (const e of CATALOGUE) {
      expect(e.commonName).not.toBe(e.id);
      expect(e.commonName).not.toMatch(/^[a-z0-9]+(-[a-z0-9]+)+$/);
      expect(e.commonName[0]).toBe(e.commonName[0]!.toUpperCase());
    }
  });
});
