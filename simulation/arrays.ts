/**
 * Small numeric arrays. The engine's vectors hold a handful of numbers and are made once per
 * forecast; plain arrays of doubles are cheaper to create and to collect than Float64Arrays
 * (whose backing stores the garbage collector tracks separately), measured at ~35 % of a
 * forecast's set-up time in bench/advice.ts's schedule search.
 */

/** A zero-filled array of n doubles. */
export const zeros = (n: number): number[] => new Array<number>(n).fill(0);
