/**
 * Presets for filter kinds, media, aeration and planting, and a builder that turns a plain
 * tank description into model zones. Every number here is approximate and from memory
 * unless a source is named: a starting point the keeper can override, and calibration refines.
 */
import type { AerationLevel, MediaType, PlantingLevel, Zone, ZoneKind } from './scenario';

/** A zone as the engine uses it: all factors resolved. */
export interface ResolvedZone {
  id: string;
  kind: ZoneKind;
  areaM2: number;
  flow: number;
  oxygen: number;
  light: number;
}

export interface MediaPreset {
  /** effective colonisable area per litre of bulk media, m²/L */
  areaPerLitre: number;
  /** suitability for flow past the biofilm, 0–1 */
  flow: number;
  /** share of the tank's oxygen reaching the biofilm, 0–1 */
  oxygen: number;
  note: string;
}

/**
 * Specific area of a packed bed of grains of diameter d (mm): 6(1 − ε)/d per m³ of bed
 * (sphere geometry, as in the Carman–Kozeny treatment), porosity ε = 0.4, times the share
 * a keeper's substrate really keeps colonised (fine grains clog) — the share is from memory.
 */
function grainAreaPerLitre(diameterMm: number, usableShare: number): number {
  const porosity = 0.4;
  return ((6 * (1 - porosity)) / (diameterMm / 1000) / 1000) * usableShare;
}

export const MEDIA_PRESETS: Record<MediaType, MediaPreset> = {
  'sponge-coarse': { areaPerLitre: 0.8, flow: 0.9, oxygen: 1, note: '10–20 ppi foam (approximate, from memory)' },
  'sponge-fine': { areaPerLitre: 1.8, flow: 0.7, oxygen: 0.95, note: '30+ ppi foam, clogs sooner (approximate, from memory)' },
  'ceramic-rings': { areaPerLitre: 0.6, flow: 0.9, oxygen: 0.95, note: 'outer surface; pore area mostly unreachable (approximate, from memory)' },
  'plastic-carriers': { areaPerLitre: 0.5, flow: 1, oxygen: 1, note: 'protected area of K1-type carriers ≈ 500 m²/m³ (approximate, from memory)' },
  'lava-rock': { areaPerLitre: 0.4, flow: 0.8, oxygen: 0.95, note: 'approximate, from memory' },
  sand: { areaPerLitre: grainAreaPerLitre(0.5, 0.15), flow: 0.1, oxygen: 0.5, note: '0.5 mm grains; little flow (approximate, from memory)' },
  'fine-gravel': { areaPerLitre: grainAreaPerLitre(2, 0.3), flow: 0.2, oxygen: 0.6, note: '2 mm grains (approximate, from memory)' },
  gravel: { areaPerLitre: grainAreaPerLitre(5, 0.5), flow: 0.3, oxygen: 0.7, note: '5 mm grains (approximate, from memory)' },
  'coarse-gravel': { areaPerLitre: grainAreaPerLitre(10, 0.6), flow: 0.4, oxygen: 0.8, note: '10 mm grains (approximate, from memory)' },
};

export const FILTER_KINDS = ['hang-on-back', 'canister', 'sponge', 'internal', 'sump', 'trickle'] as const;
export type FilterKind = (typeof FILTER_KINDS)[number];

export interface FilterPreset {
  flow: number;
  oxygen: number;
  defaultMedia: MediaType;
  /** aeration this filter gives the tank by itself */
  aeration: AerationLevel;
  note: string;
}

export const FILTER_PRESETS: Record<FilterKind, FilterPreset> = {
  'hang-on-back': { flow: 0.8, oxygen: 1, defaultMedia: 'sponge-coarse', aeration: 'surface-agitation', note: 'open, splashing return (approximate, from memory)' },
  canister: { flow: 1, oxygen: 0.85, defaultMedia: 'ceramic-rings', aeration: 'gentle', note: 'sealed, strong flow; oxygen only what the water brings (approximate, from memory)' },
  sponge: { flow: 0.5, oxygen: 1, defaultMedia: 'sponge-coarse', aeration: 'air-stone', note: 'air-driven, gentle flow (approximate, from memory)' },
  internal: { flow: 0.7, oxygen: 0.9, defaultMedia: 'sponge-coarse', aeration: 'surface-agitation', note: 'approximate, from memory' },
  sump: { flow: 1, oxygen: 0.95, defaultMedia: 'plastic-carriers', aeration: 'strong', note: 'approximate, from memory' },
  trickle: { flow: 0.9, oxygen: 1, defaultMedia: 'plastic-carriers', aeration: 'strong', note: 'wet/dry: media in air (approximate, from memory)' },
};

/** Share of oxygen saturation the tank water holds at each aeration level (from memory). */
export const AERATION_OXYGEN_SHARE: Record<AerationLevel, number> = {
  none: 0.6,
  gentle: 0.75,
  'surface-agitation': 0.85,
  'air-stone': 0.92,
  strong: 0.97,
};

/** Multiplier of the `plantUptakeHeavy` parameter per planting level (from memory). */
export const PLANTING_UPTAKE_SHARE: Record<PlantingLevel, number> = { none: 0, light: 0.25, moderate: 0.5, heavy: 1 };

/** Default suitability of each zone kind when a zone is given by area alone (from memory). */
export const ZONE_KIND_DEFAULTS: Record<ZoneKind, { flow: number; oxygen: number; light: number }> = {
  filter: { flow: 0.9, oxygen: 0.95, light: 0 },
  substrate: { flow: 0.3, oxygen: 0.7, light: 0.2 },
  surfaces: { flow: 0.3, oxygen: 0.95, light: 0.6 },
};

/** Resolves a scenario zone (area or media; factors optional) to engine numbers. */
export function resolveZone(zone: Zone): ResolvedZone {
  const kindDefaults = ZONE_KIND_DEFAULTS[zone.kind];
  const media = zone.media ? MEDIA_PRESETS[zone.media.type] : undefined;
  const areaM2 = zone.areaM2 ?? (zone.media && media ? zone.media.volumeL * media.areaPerLitre : 0);
  return {
    id: zone.id,
    kind: zone.kind,
    areaM2,
    flow: zone.flow ?? media?.flow ?? kindDefaults.flow,
    oxygen: zone.oxygen ?? media?.oxygen ?? kindDefaults.oxygen,
    light: zone.light ?? kindDefaults.light,
  };
}

/** Inner glass of a tank (4 walls + bottom) from its volume, for a cube: 5·V^(2/3) (m², V in m³). */
export function glassAreaM2(volumeL: number): number {
  return 5 * Math.pow(volumeL / 1000, 2 / 3);
}

/** Footprint of a cube-shaped tank of the volume, m² — used when none is given. */
export function footprintM2(volumeL: number): number {
  return Math.pow(volumeL / 1000, 2 / 3);
}

/** Rock and wood: colonisable area per litre of hardscape volume, m²/L (rough pieces; from memory). */
export const HARDSCAPE_AREA_PER_LITRE = 0.12;
/** Hardscape volume as a share of tank volume for the simple levels (from memory). */
export const HARDSCAPE_SHARE = { none: 0, some: 0.05, lots: 0.15 } as const;

/** A keeper's plain description of a tank's surfaces. */
export interface TankDescription {
  volumeL: number;
  filter: { kind: FilterKind; mediaVolumeL: number; media?: MediaType; surfaceSkimmer?: boolean };
  /** Substrate, or "bare" for a bare-bottom tank. */
  substrate: 'bare' | { grain: Extract<MediaType, 'sand' | 'fine-gravel' | 'gravel' | 'coarse-gravel'>; depthCm: number; footprintM2?: number };
  /** Rock and wood: a level, or litres of hardscape. */
  hardscape: keyof typeof HARDSCAPE_SHARE | { litres: number };
  /** Substrate active depth, cm (parameter `substrateActiveDepth`). */
  activeDepthCm?: number;
}

const AERATION_ORDER: readonly AerationLevel[] = ['none', 'gentle', 'surface-agitation', 'air-stone', 'strong'];

/**
 * Builds zones (filter, substrate unless bare, surfaces = glass + hardscape) and the aeration
 * level from a description. A surface skimmer lifts aeration one level (it clears the surface
 * film that slows gas exchange).
 */
export function zonesFromDescription(d: TankDescription): { zones: Zone[]; aeration: AerationLevel } {
  if (!(d.volumeL > 0)) throw new RangeError('volumeL must be above 0');
  const filterPreset = FILTER_PRESETS[d.filter.kind];
  const filterMedia = MEDIA_PRESETS[d.filter.media ?? filterPreset.defaultMedia];
  const zones: Zone[] = [
    {
      id: 'filter',
      kind: 'filter',
      media: { type: d.filter.media ?? filterPreset.defaultMedia, volumeL: d.filter.mediaVolumeL },
      flow: Math.min(filterPreset.flow, filterMedia.flow),
      oxygen: Math.min(filterPreset.oxygen, filterMedia.oxygen),
      light: 0,
    },
  ];
  const footprint = d.substrate === 'bare' ? footprintM2(d.volumeL) : (d.substrate.footprintM2 ?? footprintM2(d.volumeL));
  if (d.substrate !== 'bare') {
    const activeCm = Math.min(d.substrate.depthCm, d.activeDepthCm ?? 2);
    const grain = MEDIA_PRESETS[d.substrate.grain];
    const bedLitres = footprint * activeCm * 10; // m² × cm → L
    zones.push({ id: 'substrate', kind: 'substrate', areaM2: bedLitres * grain.areaPerLitre, flow: grain.flow, oxygen: grain.oxygen, light: 0.1 });
  }
  const glass = glassAreaM2(d.volumeL) - (d.substrate === 'bare' ? 0 : footprint);
  const hardscapeLitres = typeof d.hardscape === 'string' ? HARDSCAPE_SHARE[d.hardscape] * d.volumeL : d.hardscape.litres;
  const rock = hardscapeLitres * HARDSCAPE_AREA_PER_LITRE;
  // Glass: lit, low flow; hardscape: partly shaded, a little more flow. Area-weighted mix.
  const area = glass + rock;
  zones.push({
    id: 'surfaces',
    kind: 'surfaces',
    areaM2: area,
    flow: (glass * 0.25 + rock * 0.4) / area,
    oxygen: 0.95,
    light: (glass * 0.7 + rock * 0.4) / area,
  });
  let aerationIndex = AERATION_ORDER.indexOf(filterPreset.aeration);
  if (d.filter.surfaceSkimmer) aerationIndex = Math.min(aerationIndex + 1, AERATION_ORDER.length - 1);
  return { zones, aeration: AERATION_ORDER[aerationIndex] };
}
