/**
 * Sample quantiles by linear interpolation between order statistics (Hyndman & Fan 1996,
 * Am. Stat. 50:361, definition 7 — the default of R and NumPy).
 */

/** The q-quantile (0 ≤ q ≤ 1) of values already sorted ascending. */
export function quantileSorted(sorted: ArrayLike<number>, q: number): number {
  const n = sorted.length;
  if (n === 0) throw new RangeError('quantile of an empty sample');
  if (!(q >= 0 && q <= 1)) throw new RangeError(`quantile must lie in [0, 1], got ${q}`);
  const h = (n - 1) * q;
  const lo = Math.floor(h);
  const hi = Math.min(lo + 1, n - 1);
  return sorted[lo] + (h - lo) * (sorted[hi] - sorted[lo]);
}

/**
 * Per-time-point quantiles of an ensemble of equally long series: result[k][t] is the
 * qs[k]-quantile across members at time index t.
 */
export function seriesQuantiles(members: ReadonlyArray<ArrayLike<number>>, qs: readonly number[]): number[][] {
  if (members.length === 0) throw new RangeError('ensemble has no members');
  const length = members[0].length;
  for (const m of members) if (m.length !== length) throw new RangeError('ensemble members differ in length');
  const out = qs.map(() => new Array<number>(length));
  const column = new Float64Array(members.length);
  for (let t = 0; t < length; t++) {
    for (let i = 0; i < members.length; i++) column[i] = members[i][t];
    column.sort();
    for (let k = 0; k < qs.length; k++) out[k][t] = quantileSorted(column, qs[k]);
  }
  return out;
}
