/**
 * A small seeded pseudo-random generator, so an ensemble drawn with a seed is the same on
 * every machine and run. Method: mulberry32 (Tommy Ettinger, public domain, 2017) — a 32-bit
 * state advanced by the Weyl constant 0x6D2B79F5 and mixed by two xor-shift-multiply rounds.
 * Its 2^32 period is ample for ensembles of a few thousand draws; it is not for cryptography.
 * Written here rather than imported because the PRNG packages in node_modules arrive only as
 * a dependency of a development tool.
 */

/** A source of uniform numbers in [0, 1). */
export type Random = () => number;

/** Returns a mulberry32 generator; any finite seed is folded to 32 bits. */
export function seededRandom(seed: number): Random {
  if (!Number.isFinite(seed)) throw new RangeError(`seed must be a finite number, got ${seed}`);
  let state = Math.trunc(seed) >>> 0;
  return () => {
    state = (state + 0x6d2b79f5) >>> 0;
    let t = state;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

/** Fisher–Yates shuffle of 0..n−1 (Knuth, TAOCP vol. 2, Algorithm P). */
export function randomPermutation(n: number, random: Random): number[] {
  const out = Array.from({ length: n }, (_, i) => i);
  for (let i = n - 1; i > 0; i--) {
    const j = Math.floor(random() * (i + 1));
    const tmp = out[i];
    out[i] = out[j];
    out[j] = tmp;
  }
  return out;
}

/** A standard normal draw by the Box–Muller transform (Box & Muller 1958). */
export function normalDraw(random: Random): number {
  const u = 1 - random(); // (0, 1]: keeps log finite
  const v = random();
  return Math.sqrt(-2 * Math.log(u)) * Math.cos(2 * Math.PI * v);
}
