import { describe, expect, it } from 'vitest';
import { historyForm, historyFromForm } from '@/components/tanks/tank-history-model';
import { fitAdvice } from '@/shared/fit-advice';

describe('the "How this tank has run" form', () => {
  it('turns each choice into the stored account and back', () => {
    const f = historyForm(null, '2026-12-04');
    expect(historyFromForm(f, null)).toEqual({ history: null });
    expect(historyFromForm({ ...f, kind: 'settled' }, null)).toEqual({ history: { kind: 'settled' } });
    expect(historyFromForm({ ...f, kind: 'seeded', sharePercent: '40' }, null)).toEqual({ history: { kind: 'seeded', sharePercent: 40 } });
    const emptied = { kind: 'emptied' as const, matureUntil: '2026-11-20', formerFish: [{ speciesId: 'platy', count: 8 }] };
    expect(historyFromForm(historyForm(emptied, '2026-12-04'), emptied)).toEqual({ history: emptied });
  });

  it('puts a message on the field it is about', () => {
    const f = { ...historyForm(null, '2026-12-04'), kind: 'emptied' as const, matureUntil: '2026-02-30', count: 'lots' };
    const out = historyFromForm(f, null);
    expect('errors' in out && Object.keys(out.errors).sort()).toEqual(['matureUntil', 'speciesId']);
    const out2 = historyFromForm({ ...f, matureUntil: '2026-11-01', speciesId: 'platy' }, null);
    expect('errors' in out2 && out2.errors).toEqual({ count: 'Enter how many, as a whole number.' });
    const out3 = historyFromForm({ ...f, kind: 'seeded', sharePercent: '150' }, null);
    expect('errors' in out3 && out3.errors).toEqual({ sharePercent: 'At most 100 %.' });
  });
});

describe('fitAdvice: why a fit is no better, and which test would help', () => {
  const loose = { ao: 2, no: 0.2, growth: null };
  it('says nothing for a good fit that pins every capacity', () => {
    const tests = [0, 3, 6, 9].map((day) => ({ day, tanMgN: 0.5, no2MgN: 0.25 }));
    expect(fitAdvice(tests, { verdict: 'good', standardErrors: { ao: 0.2, no: 0.3, growth: null } })).toEqual([]);
  });

  it('explains all-zero tests and asks for a capacity test', () => {
    const tests = [0, 5, 10].map((day) => ({ day, tanMgN: 0, no2MgN: 0 }));
    expect(fitAdvice(tests, { verdict: 'fair', standardErrors: loose }).join(' ')).toMatch(/Every test used reads 0.*capacity test/i);
  });

  it('names a poor fit, a missing nitrite value and a short span', () => {
    const lines = fitAdvice([{ day: 0, tanMgN: 2 }, { day: 2, tanMgN: 1 }], { verdict: 'poor', standardErrors: loose });
    expect(lines[0]).toMatch(/further from the model than colour-chart kits explain/);
    expect(lines.join(' ')).toMatch(/ammonia-eating capacity uncertain/);
    expect(lines.join(' ')).toMatch(/None of the tests used has a nitrite value/);
    expect(lines.join(' ')).toMatch(/span only 2 days/);
  });
});
