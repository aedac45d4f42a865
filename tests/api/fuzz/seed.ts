/**
 * One seed for every property in this folder, printed so a failure can be replayed:
 * `FUZZ_SEED=<n> npx vitest run --project api tests/api/fuzz`.
 */
export const FUZZ_SEED = process.env.FUZZ_SEED ? Number(process.env.FUZZ_SEED) : Date.now() % 2_147_483_647;
console.log(`[fuzz] seed ${FUZZ_SEED} (replay with FUZZ_SEED=${FUZZ_SEED})`);

/** Cases run so far in this file, for the report line at the end. */
export const caseCounter = { n: 0 };
