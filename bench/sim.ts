/**
 * Benchmark (not a test): one 60-day forecast with 10 events, odex engine vs mathjs
 * solveODE on the same model at matched accuracy. Run: npm run bench:sim
 */
import { parseScenario } from '../shared/schemas/scenario';
import { forecastParsed, type Forecast, type ForecastOptions } from '../simulation/forecast';
import { createMathjsIntegrator } from '../simulation/reference-solver';
import { BENCH_SCENARIO } from './scenarios';

const scenario = parseScenario(BENCH_SCENARIO);
const base: ForecastOptions = { horizonDays: 60, stepDays: 1 };

function time(options: ForecastOptions, runs: number, warmup: number) {
  for (let i = 0; i < warmup; i++) forecastParsed(scenario, options);
  const ms: number[] = [];
  for (let i = 0; i < runs; i++) {
    const t = performance.now();
    forecastParsed(scenario, options);
    ms.push(performance.now() - t);
  }
  ms.sort((a, b) => a - b);
  return { median: ms[Math.floor(runs / 2)], p95: ms[Math.min(runs - 1, Math.floor(runs * 0.95))] };
}

/** Largest relative deviation over all reported series (floor 1e-3 on the denominator). */
function maxRelativeError(f: Forecast, ref: Forecast): number {
  const pairs: [number[], number[]][] = [
    [f.series.tanMgN, ref.series.tanMgN],
    [f.series.no2MgN, ref.series.no2MgN],
    [f.series.no3MgN, ref.series.no3MgN],
    [f.series.orgMgN, ref.series.orgMgN],
    ...f.series.zones.flatMap((z, i): [number[], number[]][] => [
      [z.ao, ref.series.zones[i].ao],
      [z.no, ref.series.zones[i].no],
    ]),
  ];
  let m = 0;
  for (const [a, b] of pairs) for (let i = 0; i < a.length; i++) m = Math.max(m, Math.abs(a[i] - b[i]) / Math.max(Math.abs(b[i]), 1e-3));
  return m;
}

const reference = forecastParsed(scenario, { ...base, tolerances: { relative: 1e-11, concentration: 1e-13, capacityPerLitre: 1e-15 } });
const fmt = (x: number) => x.toFixed(3);

const engine = forecastParsed(scenario, base);
const engineError = maxRelativeError(engine, reference);
const engineTime = time(base, 400, 100);
console.log(`scenario: ${scenario.name} (${scenario.events.length} events, ${engine.stats.segments} segments)`);
console.log(`odex (restart sampling, rtol 1e-6): median ${fmt(engineTime.median)} ms, p95 ${fmt(engineTime.p95)} ms, ` +
  `${engine.stats.evaluations} RHS evaluations, ${engine.stats.steps} steps, max rel. error ${engineError.toExponential(2)}`);

const denseOpts: ForecastOptions = { ...base, sampling: 'dense' };
const dense = forecastParsed(scenario, denseOpts);
const denseTime = time(denseOpts, 400, 100);
console.log(`odex (dense output, rtol 1e-6):     median ${fmt(denseTime.median)} ms, p95 ${fmt(denseTime.p95)} ms, ` +
  `${dense.stats.evaluations} RHS evaluations, max rel. error ${maxRelativeError(dense, reference).toExponential(2)}`);

// mathjs: loosest tolerance whose error is no worse than the engine's (matched accuracy).
let matched: { tol: number; f: Forecast; error: number } | undefined;
for (const tol of [1e-3, 3e-4, 1e-4, 3e-5, 1e-5, 3e-6, 1e-6, 3e-7, 1e-7]) {
  const options: ForecastOptions = { ...base, integrator: (n, t) => createMathjsIntegrator(n, t, { tol }) };
  const f = forecastParsed(scenario, options);
  const error = maxRelativeError(f, reference);
  console.log(`  mathjs tol ${tol.toExponential(0)}: max rel. error ${error.toExponential(2)}, ${f.stats.evaluations} RHS evaluations`);
  if (error <= engineError) {
    matched = { tol, f, error };
    break;
  }
}
if (!matched) {
  console.log('mathjs did not reach the engine accuracy within the tolerances tried.');
} else {
  const options: ForecastOptions = { ...base, integrator: (n, t) => createMathjsIntegrator(n, t, { tol: matched.tol }) };
  const mt = time(options, 15, 3);
  console.log(`mathjs solveODE (RK45, tol ${matched.tol.toExponential(0)}): median ${fmt(mt.median)} ms, p95 ${fmt(mt.p95)} ms, ` +
    `${matched.f.stats.evaluations} RHS evaluations, max rel. error ${matched.error.toExponential(2)}`);
  console.log(`ratio mathjs/odex (median): ${(mt.median / engineTime.median).toFixed(1)}×`);
}
