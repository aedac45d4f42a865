import { describe, expect, it } from 'vitest';
import { finiteMax, indexAtX, panelGeometry, tickLabel, xDomainFor, yDomainFor, type PanelInput } from '@/lib/chart-geometry';

const size = { width: 300, height: 140, padding: { top: 10, right: 10, bottom: 20, left: 40 } };
const days = [0, 1, 2, 3, 4];
const base = (over: Partial<PanelInput> = {}): PanelInput => ({
  days,
  series: [{ key: 'tan', values: [0, 0.2, 0.6, 0.3, 0.1] }],
  limits: [{ key: 'tanChronic', value: 0.5, label: 'limit 0.5' }],
  size,
  ...over,
});

/** Numbers in an SVG path string. */
const numbersIn = (d: string) => (d.match(/-?\d+(\.\d+)?(e-?\d+)?/g) ?? []).map(Number);

describe('yDomainFor', () => {
  it('starts at zero and ends above the highest value with headroom, on a nice number', () => {
    const [lo, hi] = yDomainFor([{ key: 'a', values: [0.1, 0.73] }], [], 0.1);
    expect(lo).toBe(0);
    expect(hi).toBeGreaterThanOrEqual(0.73 * 1.1);
    expect(hi).toBeCloseTo(1, 10); // 0.803 made nice with d3's 4-tick step (0.2)
  });

  it('keeps a limit line on the chart even when every value is below it', () => {
    expect(yDomainFor([{ key: 'a', values: [0.01, 0.02] }], [{ key: 'l', value: 1, label: '' }], 0.01)[1]).toBeGreaterThanOrEqual(1.1);
  });

  it('includes the top of the uncertainty band', () => {
    const hi = yDomainFor([{ key: 'a', values: [1, 1], band: { lo: [0.5, 0.5], hi: [3, 3] } }], [], 0.1)[1];
    expect(hi).toBeGreaterThanOrEqual(3.3);
  });

  it('gives a flat-zero forecast the least top instead of an empty domain', () => {
    expect(yDomainFor([{ key: 'a', values: [0, 0, 0] }], [], 2)).toEqual([0, 2]);
  });

  it('ignores NaN and infinite values', () => {
    expect(yDomainFor([{ key: 'a', values: [NaN, Infinity, 0.4] }], [], 0.1)[1]).toBeCloseTo(0.5, 10); // 0.44 made nice (step 0.1)
  });
});

describe('xDomainFor', () => {
  it('spans the first to the last day', () => {
    expect(xDomainFor([0, 0.5, 30])).toEqual([0, 30]);
  });

  it('maps an empty list to one day from zero', () => {
    expect(xDomainFor([])).toEqual([0, 1]);
  });

  it('widens a single day to one day so the scale is never degenerate', () => {
    expect(xDomainFor([7])).toEqual([7, 8]);
  });
});

describe('panelGeometry', () => {
  it('draws one path per series from the left edge to the right edge of the plot', () => {
    const g = panelGeometry(base());
    expect(g.lines).toHaveLength(1);
    const nums = numbersIn(g.lines[0].d);
    expect(nums[0]).toBeCloseTo(40, 6);
    expect(nums[nums.length - 2]).toBeCloseTo(290, 6);
  });

  it('puts zero at the bottom of the plot and higher values higher up', () => {
    const g = panelGeometry(base());
    const nums = numbersIn(g.lines[0].d);
    expect(nums[1]).toBeCloseTo(120, 6); // day 0, value 0 → plot bottom (140 − 20)
    expect(nums[5]).toBeLessThan(nums[3]); // day 2 (0.6) above day 1 (0.2)
  });

  it('places a limit line across the plot at its value, with its label above it', () => {
    const g = panelGeometry(base());
    const [limit] = g.limits;
    const [, top] = g.yDomain;
    expect(limit.y).toBeCloseTo(120 - (0.5 / top) * 110, 6);
    expect([limit.x1, limit.x2]).toEqual([40, 290]);
    expect(limit.labelY).toBeLessThan(limit.y);
    expect(limit.label).toBe('limit 0.5');
  });

  it('closes a band polygon from the upper edge back along the lower edge', () => {
    const g = panelGeometry(base({ series: [{ key: 'tan', values: [0.1, 0.2, 0.3, 0.2, 0.1], band: { lo: [0, 0.1, 0.2, 0.1, 0], hi: [0.2, 0.4, 0.6, 0.4, 0.2] } }] }));
    expect(g.bands).toHaveLength(1);
    expect(g.bands[0].d.endsWith('Z')).toBe(true);
    // 5 points up and 5 back: 10 x,y pairs.
    expect(numbersIn(g.bands[0].d)).toHaveLength(20);
  });

  it('breaks a line at a missing value instead of drawing through NaN', () => {
    const g = panelGeometry(base({ series: [{ key: 'tan', values: [0.1, NaN, 0.3, 0.2, 0.1] }] }));
    expect(g.lines[0].d).not.toMatch(/NaN/);
    expect(g.lines[0].d.match(/M/g)).toHaveLength(2);
  });

  it('answers empty paths and no NaN for a forecast with no days', () => {
    const g = panelGeometry(base({ days: [], series: [{ key: 'tan', values: [] }] }));
    expect(g.lines[0].d).toBe('');
    expect(JSON.stringify(g)).not.toMatch(/NaN|null/);
  });

  it('clamps a zero-size panel to a zero-area plot without NaN', () => {
    const g = panelGeometry(base({ size: { width: 0, height: 0 } }));
    expect(JSON.stringify(g)).not.toMatch(/NaN/);
  });

  it('drops limits that are zero, negative or not numbers', () => {
    const g = panelGeometry(base({ limits: [{ key: 'a', value: 0, label: '' }, { key: 'b', value: NaN, label: '' }, { key: 'c', value: 0.3, label: 'c' }] }));
    expect(g.limits.map((l) => l.key)).toEqual(['c']);
  });

  it('labels y ticks from zero to the top of the domain', () => {
    const g = panelGeometry(base());
    expect(g.yTicks[0]).toMatchObject({ value: 0, label: '0' });
    expect(g.yTicks.at(-1)!.value).toBeLessThanOrEqual(g.yDomain[1]);
    expect(g.xTicks.length).toBeGreaterThanOrEqual(2);
  });

  it('does not change the arrays it was given', () => {
    const input = base();
    const copy = JSON.parse(JSON.stringify(input));
    panelGeometry(input);
    expect(input).toEqual(copy);
  });
});

describe('tickLabel', () => {
  it('prints whole steps without decimals and small steps with enough to tell them apart', () => {
    expect(tickLabel(10, 5)).toBe('10');
    expect(tickLabel(0.2, 0.1)).toBe('0.2');
    expect(tickLabel(0.05, 0.01)).toBe('0.05');
    expect(tickLabel(0, 0.01)).toBe('0');
  });
});

describe('finiteMax and indexAtX', () => {
  it('answers 0 for no finite numbers', () => {
    expect(finiteMax([[NaN], []])).toBe(0);
  });

  it('finds the sample nearest a pixel, and null without samples', () => {
    const g = panelGeometry(base());
    expect(indexAtX(g.plot.left, g, days)).toBe(0);
    expect(indexAtX(g.plot.right, g, days)).toBe(4);
    expect(indexAtX(100, g, [])).toBeNull();
  });
});

describe('measured points (the keeper’s tests on the forecast)', () => {
  it('places each test at its day and value, leaves out tests outside the days, and raises the axis to a high test', () => {
    const g = panelGeometry(base({ points: [{ key: 'tested', at: [{ day: 2, value: 0.6 }, { day: 9, value: 0.1 }, { day: 1, value: 2 }] }] }));
    expect(g.points.map((p) => p.day)).toEqual([2, 1]);
    // The plot spans x 40..290 over days 0..4: day 2 is the middle.
    expect(g.points[0].x).toBeCloseTo(165, 9);
    // A test of 2 lifts the axis above it (it would be clamped at the top otherwise).
    expect(g.yDomain[1]).toBeGreaterThanOrEqual(2.2);
    expect(g.points[1].y).toBeGreaterThan(g.plot.top);
    expect(panelGeometry(base()).points).toEqual([]);
  });
});
