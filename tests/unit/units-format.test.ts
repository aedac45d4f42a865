import { describe, expect, it } from 'vitest';
import {
  formatNitrogen,
  formatTemperature,
  formatVolume,
  nitrogenToMgN,
  nitrogenUnit,
  parseDecimal,
  temperatureInputText,
  temperatureToCelsius,
  trimNumber,
  unitsSummary,
  volumeInputText,
  volumeToLitres,
} from '@/lib/units-format';
import { LITRES_PER_US_GALLON } from '@/simulation/units';

describe('volumes', () => {
  it('shows litres as they are and US gallons at 3.785411784 L each (NIST Handbook 44, MODEL.md §4.6)', () => {
    expect(formatVolume(120, 'L')).toBe('120 L');
    expect(formatVolume(7.25, 'L')).toBe('7.3 L');
    expect(formatVolume(120, 'USgal')).toBe('31.7 US gal'); // 120 / 3.785411784 = 31.70
    expect(formatVolume(LITRES_PER_US_GALLON * 55, 'USgal')).toBe('55 US gal');
  });

  it('turns typed gallons back into litres exactly', () => {
    expect(volumeToLitres(10, 'USgal')).toBeCloseTo(37.85411784, 10);
    expect(volumeToLitres(10, 'L')).toBe(10);
    expect(volumeInputText(volumeToLitres(29, 'USgal'), 'USgal')).toBe('29');
  });
});

describe('temperatures', () => {
  it('uses °F = °C·9/5 + 32 (MODEL.md §4.6)', () => {
    expect(formatTemperature(25, 'C')).toBe('25 °C');
    expect(formatTemperature(25, 'F')).toBe('77 °F');
    expect(formatTemperature(24.5, 'F')).toBe('76.1 °F');
    expect(temperatureToCelsius(77, 'F')).toBeCloseTo(25, 12);
    expect(temperatureToCelsius(0, 'F')).toBeCloseTo(-17.7778, 4);
    expect(temperatureInputText(26, 'F')).toBe('78.8');
  });
});

describe('nitrogen', () => {
  it('shows stored mg N/L as N unchanged', () => {
    expect(formatNitrogen(0.25, 'tanMgN', 'N')).toBe('0.25');
    expect(formatNitrogen(null, 'no2MgN', 'N')).toBe('—');
    expect(nitrogenUnit('no3MgN', 'N')).toBe('mg/L as N');
  });

  it('converts to the ion with the MODEL.md §4.6 factors (NH4+ 0.7765, NO2− 0.3045, NO3− 0.2259)', () => {
    expect(formatNitrogen(0.7765, 'tanMgN', 'ion')).toBe('1');
    expect(formatNitrogen(0.3045, 'no2MgN', 'ion')).toBe('1');
    expect(formatNitrogen(0.2259 * 40, 'no3MgN', 'ion')).toBe('40');
    expect(nitrogenUnit('tanMgN', 'ion')).toBe('mg/L NH4+');
    expect(nitrogenUnit('no2MgN', 'ion')).toBe('mg/L NO2−');
    expect(nitrogenUnit('no3MgN', 'ion')).toBe('mg/L NO3−');
  });

  it('turns a typed ion value into mg N/L', () => {
    expect(nitrogenToMgN(50, 'no3MgN', 'ion')).toBeCloseTo(50 * 0.2259, 3);
    expect(nitrogenToMgN(1, 'no2MgN', 'ion')).toBeCloseTo(0.3045, 4);
    expect(nitrogenToMgN(0.5, 'tanMgN', 'N')).toBe(0.5);
  });
});

describe('typed numbers', () => {
  it.each([
    ['0.25', 0.25],
    [' 0,5 ', 0.5],
    ['7', 7],
    ['.5', 0.5],
    ['', null],
    ['   ', null],
  ])('reads %j as %s', (text, value) => {
    expect(parseDecimal(text)).toBe(value);
  });

  it.each(['abc', '1.2.3', '1e3', '0x10', '5 mg'])('reads %j as not a number', (text) => {
    expect(parseDecimal(text)).toBeNaN();
  });

  it('trims trailing zeros but keeps integers whole', () => {
    expect(trimNumber(31.7, 2)).toBe('31.7');
    expect(trimNumber(120, 1)).toBe('120');
    expect(trimNumber(100, 0)).toBe('100');
  });

  it('summarises the units in a line', () => {
    expect(unitsSummary({ volumeUnit: 'USgal', temperatureUnit: 'F', nitrogenBasis: 'ion' })).toBe('US gal · °F · as the ion');
  });
});
