/**
 * Starter catalogue of common freshwater species. All lengths are typical adult total
 * lengths in aquaria, in cm — approximate, from memory; the keeper should enter the real
 * length. Body-shape class sets `a` of W = a·L^b (see ./bioload).
 */
import type { ShapeClassId } from './scenario';

/** Body-shape classes; `a` values (g/cm^b) are from memory (MODEL.md §6.1). */
export const SHAPE_CLASSES: Record<ShapeClassId, { a: number; note: string }> = {
  'eel-like': { a: 0.002, note: 'loaches, eels: 0.001–0.003 (MODEL.md §6.1, memory)' },
  slender: { a: 0.006, note: 'rasboras, danios, pencilfish (memory)' },
  ordinary: { a: 0.01, note: 'ordinary fusiform fish (MODEL.md §6.1, memory)' },
  deep: { a: 0.025, note: 'angelfish, discus, gouramis: 0.02–0.03 (MODEL.md §6.1, memory)' },
  shrimp: { a: 0.008, note: 'dwarf and Amano shrimp (memory)' },
  snail: { a: 0.02, note: 'soft-tissue equivalent of a snail, shell excluded (memory)' },
};

export type ShapeClass = ShapeClassId;

export interface CatalogueEntry {
  readonly id: string;
  readonly commonName: string;
  readonly scientificName: string;
  readonly adultLengthCm: number;
  readonly shape: ShapeClass;
  readonly invertebrate: boolean;
  readonly approximate: true;
}

function entry(
  id: string,
  commonName: string,
  scientificName: string,
  adultLengthCm: number,
  shape: ShapeClass,
  invertebrate = false,
): CatalogueEntry {
  return { id, commonName, scientificName, adultLengthCm, shape, invertebrate, approximate: true };
}

export const CATALOGUE: readonly CatalogueEntry[] = [
  entry('neon-tetra', 'Neon tetra', 'Paracheirodon innesi', 3.5, 'slender'),
  entry('cardinal-tetra', 'Cardinal tetra', 'Paracheirodon axelrodi', 4, 'slender'),
  entry('ember-tetra', 'Ember tetra', 'Hyphessobrycon amandae', 2, 'slender'),
  entry('black-skirt-tetra', 'Black skirt tetra', 'Gymnocorymbus ternetzi', 5.5, 'deep'),
  entry('rummy-nose-tetra', 'Rummy-nose tetra', 'Hemigrammus rhodostomus', 5, 'slender'),
  entry('serpae-tetra', 'Serpae tetra', 'Hyphessobrycon eques', 4, 'ordinary'),
  entry('congo-tetra', 'Congo tetra', 'Phenacogrammus interruptus', 8, 'ordinary'),
  entry('zebra-danio', 'Zebra danio', 'Danio rerio', 4.5, 'slender'),
  entry('celestial-pearl-danio', 'Celestial pearl danio', 'Danio margaritatus', 2.2, 'slender'),
  entry('harlequin-rasbora', 'Harlequin rasbora', 'Trigonostigma heteromorpha', 4.5, 'ordinary'),
  entry('chili-rasbora', 'Chili rasbora', 'Boraras brigittae', 1.8, 'slender'),
  entry('white-cloud-minnow', 'White cloud mountain minnow', 'Tanichthys albonubes', 4, 'slender'),
  entry('cherry-barb', 'Cherry barb', 'Puntius titteya', 5, 'ordinary'),
  entry('tiger-barb', 'Tiger barb', 'Puntigrus tetrazona', 6, 'deep'),
  entry('rosy-barb', 'Rosy barb', 'Pethia conchonius', 10, 'ordinary'),
  entry('guppy', 'Guppy', 'Poecilia reticulata', 4.5, 'ordinary'),
  entry('endler', "Endler's livebearer", 'Poecilia wingei', 3, 'ordinary'),
  entry('platy', 'Platy', 'Xiphophorus maculatus', 5.5, 'ordinary'),
  entry('swordtail', 'Swordtail', 'Xiphophorus hellerii', 11, 'ordinary'),
  entry('molly', 'Molly', 'Poecilia sphenops', 8, 'ordinary'),
  entry('betta', 'Betta', 'Betta splendens', 6.5, 'ordinary'),
  entry('dwarf-gourami', 'Dwarf gourami', 'Trichogaster lalius', 7, 'deep'),
  entry('honey-gourami', 'Honey gourami', 'Trichogaster chuna', 5, 'deep'),
  entry('pearl-gourami', 'Pearl gourami', 'Trichopodus leerii', 11, 'deep'),
  entry('angelfish', 'Angelfish', 'Pterophyllum scalare', 15, 'deep'),
  entry('discus', 'Discus', 'Symphysodon aequifasciatus', 17, 'deep'),
  entry('german-blue-ram', 'Ram cichlid', 'Mikrogeophagus ramirezi', 6, 'deep'),
  entry('kribensis', 'Kribensis', 'Pelvicachromis pulcher', 9, 'ordinary'),
  entry('convict-cichlid', 'Convict cichlid', 'Amatitlania nigrofasciata', 12, 'deep'),
  entry('electric-yellow-cichlid', 'Electric yellow cichlid', 'Labidochromis caeruleus', 10, 'ordinary'),
  entry('oscar', 'Oscar', 'Astronotus ocellatus', 30, 'deep'),
  entry('bronze-corydoras', 'Bronze corydoras', 'Corydoras aeneus', 6.5, 'ordinary'),
  entry('panda-corydoras', 'Panda corydoras', 'Corydoras panda', 4.5, 'ordinary'),
  entry('bristlenose-pleco', 'Bristlenose pleco', 'Ancistrus sp.', 12, 'ordinary'),
  entry('otocinclus', 'Otocinclus', 'Otocinclus vittatus', 4, 'slender'),
  entry('kuhli-loach', 'Kuhli loach', 'Pangio kuhlii', 9, 'eel-like'),
  entry('clown-loach', 'Clown loach', 'Chromobotia macracanthus', 20, 'ordinary'),
  entry('siamese-algae-eater', 'Siamese algae eater', 'Crossocheilus oblongus', 14, 'slender'),
  entry('boesemani-rainbowfish', 'Boeseman’s rainbowfish', 'Melanotaenia boesemani', 9, 'deep'),
  entry('marbled-hatchetfish', 'Marbled hatchetfish', 'Carnegiella strigata', 3.5, 'deep'),
  entry('pencilfish', 'Pencilfish', 'Nannostomus beckfordi', 4, 'slender'),
  entry('common-goldfish', 'Common goldfish', 'Carassius auratus', 20, 'ordinary'),
  entry('fancy-goldfish', 'Fancy goldfish', 'Carassius auratus', 12, 'deep'),
  entry('cherry-shrimp', 'Cherry shrimp', 'Neocaridina davidi', 2.5, 'shrimp', true),
  entry('amano-shrimp', 'Amano shrimp', 'Caridina multidentata', 4.5, 'shrimp', true),
  entry('nerite-snail', 'Nerite snail', 'Neritina natalensis', 2.5, 'snail', true),
  entry('mystery-snail', 'Mystery snail', 'Pomacea bridgesii', 5, 'snail', true),
  entry('ramshorn-snail', 'Ramshorn snail', 'Planorbella duryi', 1.5, 'snail', true),
  entry('malaysian-trumpet-snail', 'Malaysian trumpet snail', 'Melanoides tuberculata', 2, 'snail', true),
];

const BY_ID = new Map(CATALOGUE.map((e) => [e.id, e]));

/** Looks up a species by id; undefined when unknown. */
export function findSpecies(id: string): CatalogueEntry | undefined {
  return BY_ID.get(id);
}

/** What the engine's sentences call a group of fish: its common name, its own name, never a catalogue id. */
export function fishGroupName(f: { species?: string; name?: string }): string {
  if (f.name?.trim()) return f.name.trim();
  if (f.species) return findSpecies(f.species)?.commonName ?? 'fish';
  return 'fish';
}

export const SPECIES_IDS: readonly string[] = CATALOGUE.map((e) => e.id);
