import { describe, expect, it } from 'vitest';
import { escapeCsvCell, parseReadingsCsv, readingsToCsv, unescapeCsvCell } from '../../server/services/readings-csv';
import { CSV_COLUMNS } from '@/shared/schemas/reading';

describe('formula-injection escaping (OWASP CSV injection)', () => {
  it.each(['=1+1', '+SUM(A1)', '-2', '@cmd', '\tx', '\rx'])('prefixes %j with an apostrophe, and import takes it off', (cell) => {
    expect(escapeCsvCell(cell)).toBe(`'${cell}`);
    expect(unescapeCsvCell(escapeCsvCell(cell))).toBe(cell);
  });

  it('leaves ordinary cells and ordinary apostrophes alone', () => {
    expect(escapeCsvCell('after feeding')).toBe('after feeding');
    expect(escapeCsvCell('0.25')).toBe('0.25');
    expect(unescapeCsvCell("'tis fine")).toBe("'tis fine");
  });
});

describe('readingsToCsv / parseReadingsCsv', () => {
  const reading = {
    id: '00000000-0000-4000-8000-000000000001',
    takenAt: '2026-03-01T08:00:00.000Z',
    tanMgN: 0.3883,
    no2MgN: null,
    no3MgN: 9.036,
    ph: 7.4,
    temperatureC: 25,
    khDkh: null,
    basis: 'ion' as const,
    note: '=cmd|" /C calc"!A0, and a comma',
  };

  it('writes the header and quotes cells with commas, escaping formulas', () => {
    const csv = readingsToCsv([reading]);
    const [header, row] = csv.split('\r\n');
    expect(header).toBe(CSV_COLUMNS.join(','));
    expect(row.startsWith('2026-03-01T08:00:00.000Z,ion,')).toBe(true);
    expect(row).toContain(`"'=cmd|"" /C calc""!A0, and a comma"`);
  });

  it('reads its own output back to the same values, in the row basis', () => {
    const { rows, errors } = parseReadingsCsv(readingsToCsv([reading]), 10);
    expect(errors).toEqual([]);
    // 0.3883 mg N/L as NH4+ = 0.3883 / 0.7765 ≈ 0.5; 9.036 mg N/L as NO3− ≈ 40 (MODEL.md §4.6 factors).
    expect(rows[0].tan).toBeCloseTo(0.5, 3);
    expect(rows[0].no3).toBeCloseTo(40, 2);
    expect(rows[0]).toMatchObject({ line: 2, basis: 'ion', no2: null, ph: 7.4, khDkh: null, note: reading.note });
  });

  it('reports the data row count even past the cap, without parsing rows', () => {
    const text = ['taken_at,basis', '2026-01-01T00:00:00Z,N', '2026-01-02T00:00:00Z,N', '2026-01-03T00:00:00Z,N'].join('\n');
    expect(parseReadingsCsv(text, 2)).toMatchObject({ rows: [], dataRowCount: 3 });
  });

  it('accepts a byte-order mark and upper-case headers', () => {
    const { rows, errors } = parseReadingsCsv('\uFEFFTAKEN_AT,Basis,Nitrate\n2026-01-01T00:00:00Z,N,5\n', 10);
    expect(errors).toEqual([]);
    expect(rows[0].no3).toBe(5);
  });
});
