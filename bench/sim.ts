/**
 * Benchmark (not a test): one 60-day forecast with 10 events — the engine (odex, restart
 * sampling), odex with dense output, a run continued from a saved state, and mathjs solveODE
 * on the same model at matched accuracy. Errors are against a tight odex reference (rtol
 * 1e-11). Run: npm run bench:sim
 */
import { parseScenario } from '../simulation/scenario';
import { createForecastSession, forecastParsed, type Forecast, type ForecastOptions } from '../simulation/forecast';
import { createMathjsIntegrator } from '../tests/simulation/reference-solver';
import { BENCH_SCENARIO } from './scenarios';

const scenario = parseScenario(BENCH_SCENARIO);
const base: ForecastOptions = { horizonDays: 60, stepDays: 1 };

function time(options: ForecastOptions, runs: number, warmup: number) {
  for (let i = 0; i < warmup; i++) forecastParsed(scenario, options);
  const ms: number[] = [];
  const c0 = process.cpuUsage();
  for (let i = 0; i < runs; i++) {
    const t = performance.now();
    forecastParsed(scenario, options);
    ms.push(performance.now() - t);
  }
  const c = process.cpuUsage(c0);
  ms.sort((a, b) => a - b);
  // Mean CPU time of this process per run: steadier than wall time on a shared machine.
  return { median: ms[Math.floor(runs / 2)], p95: ms[Math.min(runs - 1, Math.floor(runs * 0.95))], cpu: (c.user + c.system) / 1000 / runs };
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
console.log(`engine (odex, restart sampling, rtol 1e-6): median ${fmt(engineTime.median)} ms, p95 ${fmt(engineTime.p95)} ms, CPU ${fmt(engineTime.cpu)} ms, ` +
  `${engine.stats.evaluations} RHS evaluations, ${engine.stats.steps} steps, max rel. error ${engineError.toExponential(2)}`);

for (const [label, options] of [['odex (dense output, rtol 1e-6):    ', { ...base, sampling: 'dense' }]] as [string, ForecastOptions][]) {
  const f = forecastParsed(scenario, options);
  const tm = time(options, 400, 100);
  console.log(`${label} median ${fmt(tm.median)} ms, p95 ${fmt(tm.p95)} ms, CPU ${fmt(tm.cpu)} ms, ${f.stats.evaluations} RHS evaluations, max rel. error ${maxRelativeError(f, reference).toExponential(2)}`);
}

// Continued from the state saved at day 40 (days 40–60 only), as the schedule search uses it.
const saved = createForecastSession(scenario, base).advanceTo(40);
const resumedOpts: ForecastOptions = { ...base, from: saved };
const resumed = forecastParsed(scenario, resumedOpts);
const offset = reference.series.days.indexOf(40);
const refTail = { ...reference, series: { ...reference.series, ...Object.fromEntries((['tanMgN', 'no2MgN', 'no3MgN', 'orgMgN'] as const).map((k) => [k, reference.series[k].slice(offset)])), zones: reference.series.zones.map((z) => ({ ...z, ao: z.ao.slice(offset), no: z.no.slice(offset) })) } };
const resumedTime = time(resumedOpts, 400, 100);
console.log(`continued from day 40 (20 days):     median ${fmt(resumedTime.median)} ms, CPU ${fmt(resumedTime.cpu)} ms, max rel. error ${maxRelativeError(resumed, refTail).toExponential(2)}`);

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
  console.log(`mathjs solveODE (RK45, tol ${matched.tol.toExponential(0)}): median ${fmt(mt.median)} ms, p95 ${fmt(mt.p95)} ms, CPU ${fmt(mt.cpu)} ms, ` +
    `${matched.f.stats.evaluations} RHS evaluations, max rel. error ${matched.error.toExponential(2)}`);
  console.log(`ratio mathjs/engine (median): ${(mt.median / engineTime.median).toFixed(1)}×`);
}
