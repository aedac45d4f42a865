import { describe, expect, it } from 'vitest';
import { planSummary, setupLines, speciesDisplayName } from '@/components/tanks/tank-labels';
import { findSpecies, SPECIES_IDS } from '@/simulation/catalogue';

describe('speciesDisplayName', () => {
  it('prefers the keeper’s own name', () => {
    expect(speciesDisplayName({ customName: '  Spotty ', speciesId: 'zebra-danio' })).toBe('Spotty');
  });

  it('uses the starter catalogue’s common name for a known id', () => {
    const [id] = SPECIES_IDS;
    expect(speciesDisplayName({ customName: null, speciesId: id })).toBe(findSpecies(id)?.commonName);
  });

  it('reads an id the catalogue does not know as words', () => {
    expect(speciesDisplayName({ customName: null, speciesId: 'not-in-catalogue-fish' })).toBe('Not in catalogue fish');
  });

  it('has a defined answer when both are missing', () => {
    expect(speciesDisplayName({ customName: '', speciesId: null })).toBe('Unnamed animal');
  });
});

describe('setupLines', () => {
  it('answers only the assumed weekly water change for an empty setup', () => {
    expect(setupLines({})).toEqual(['Water change: 25 % every 7 days (assumed)']);
  });

  it('gives the keeper\'s own water change, or says there is none', () => {
    expect(setupLines({ routineWaterChange: { percent: 40, everyDays: 1 } })).toEqual(['Water change: 40 % every day']);
    expect(setupLines({ routineWaterChange: { percent: 0, everyDays: 7 } })).toEqual(['No routine water changes']);
  });

  it('describes filter and media, substrate depth, plants, hardscape, aeration and light', () => {
    expect(
      setupLines({
        filter: { kind: 'canister', mediaVolumeL: 1.5, media: 'ceramic-rings', surfaceSkimmer: true },
        substrate: { grain: 'sand', depthCm: 5 },
        plants: 'heavy',
        hardscape: 'lots',
        aeration: 'air-stone',
        lightHoursPerDay: 8,
      }),
    ).toEqual([
      'Canister filter, 1.5 L of ceramic rings, surface skimmer',
      'Sand, 5 cm deep',
      'Plants: heavy',
      'Rock and wood: lots',
      'Aeration: air stone',
      'Light: 8 h a day',
      'Water change: 25 % every 7 days (assumed)',
    ]);
  });

  it('names a bare bottom and skips "none" plants and hardscape', () => {
    expect(setupLines({ substrate: 'bare', plants: 'none', hardscape: 'none' })).toEqual(['Bare bottom', 'Water change: 25 % every 7 days (assumed)']);
  });

  it('still gives the media volume when the media type is not known', () => {
    expect(setupLines({ filter: { kind: 'sponge', mediaVolumeL: 0.5 } })).toEqual(['Sponge filter, 0.5 L of media', 'Water change: 25 % every 7 days (assumed)']);
  });
});

describe('planSummary', () => {
  it('counts steps and the fish a plan adds and removes', () => {
    expect(
      planSummary([
        { type: 'add-fish', day: 0, fish: [{ species: 'harlequin-rasbora', count: 6 }] },
        { type: 'add-fish', day: 10, fish: [{ species: 'harlequin-rasbora', count: 6 }] },
        { type: 'water-change', day: 3, percent: 30 },
        { type: 'remove-fish', day: 12, fish: [{ species: 'harlequin-rasbora', count: 2 }] },
        { type: 'move-fish', day: 14, direction: 'out', fish: [{ species: 'zebra-danio', count: 3 }] },
      ]),
    ).toBe('5 steps · adds 12 fish · removes 5 fish');
  });

  it('says a plan with one step and no fish changes in plain words', () => {
    expect(planSummary([{ type: 'water-change', day: 0, percent: 25 }])).toBe('1 step');
  });
});
