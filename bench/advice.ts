/**
 * Advice benchmark (issue 4): medians over repeated runs, after one warm-up run each.
 * Targets: fastest safe schedule for adding 40 fish ≤ 150 ms; 64-member ensemble of a
 * 60-day forecast ≤ 100 ms; calibration on 30 readings ≤ 1 s.
 * Run: npm run bench:advice
 */
import { parseScenario } from '../simulation/scenario';
import { fastestSafeSchedule } from '../simulation/advice/addition-schedule';
import { calibrate, scaledScenario } from '../simulation/advice/calibration';
import { runEnsemble } from '../simulation/advice/ensemble';
import { roundToKit } from '../simulation/advice/kit-error';
import { forecastParsed } from '../simulation/forecast';

function median(xs: number[]): number {
  const s = [...xs].sort((a, b) => a - b);
  return s.length % 2 ? s[(s.length - 1) / 2] : (s[s.length / 2 - 1] + s[s.length / 2]) / 2;
}

/**
 * Median wall time, and the median of this process's CPU time (user + system) per run: on a
 * machine shared with other work the CPU figure is the steadier one (it leaves out time spent
 * waiting for a core).
 */
function time(label: string, target: number, runs: number, fn: () => unknown): void {
  fn(); // warm-up
  const ms: number[] = [];
  const cpu: number[] = [];
  for (let i = 0; i < runs; i++) {
    const c0 = process.cpuUsage();
    const t0 = performance.now();
    fn();
    ms.push(performance.now() - t0);
    const c = process.cpuUsage(c0);
    cpu.push((c.user + c.system) / 1000);
  }
  const m = median(ms);
  const mc = median(cpu);
  console.log(
    `${label.padEnd(52)} median ${m.toFixed(1).padStart(7)} ms wall, ${mc.toFixed(1).padStart(7)} ms CPU  (target ≤ ${target} ms, ${runs} runs) ${m <= target ? 'ok' : 'OVER'}`,
  );
}

// An invented 200 L tank with 10 platies; 40 more to add.
const tank = {
  volumeL: 200,
  temperatureC: 25,
  ph: 7.4,
  chlorideMgL: 25,
  zones: [
    { id: 'filter', kind: 'filter' as const, media: { type: 'sponge-coarse' as const, volumeL: 1.5 } },
    { id: 'gravel', kind: 'substrate' as const, media: { type: 'gravel' as const, volumeL: 20 } },
  ],
};
const mature = parseScenario({ tank, start: { kind: 'mature' }, fish: [{ species: 'platy', count: 10 }] });
time('fastest safe schedule, 40 platies', 150, 7, () => fastestSafeSchedule({ scenario: mature, fish: { species: 'platy', count: 40 } }));

const withAddition = { ...mature, events: [{ type: 'add-fish' as const, day: 0, fish: { species: 'platy', count: 40 } }] };
time('64-member ensemble, 60-day forecast (daily output)', 100, 7, () => runEnsemble(withAddition, { members: 64 }, { horizonDays: 60, stepDays: 1 }));

// A new 100 L tank cycled with 1 mg N/L a day; 30 readings (TAN and nitrite) every 1.5 days.
const cycling = parseScenario({
  tank: { volumeL: 100, temperatureC: 25, ph: 7.6, zones: [{ id: 'filter', kind: 'filter', media: { type: 'sponge-coarse', volumeL: 1 } }] },
  start: { kind: 'new' },
  events: [{ type: 'ammonia-dose', day: 0, amount: { unit: 'mgN-per-L', value: 1 }, repeatEveryDays: 1, repeatCount: 40 }],
});
const day0 = forecastParsed(cycling, { horizonDays: 0.01, stepDays: 0.01 });
const base = { start: day0.series.zones.map((z) => ({ zoneId: z.zoneId, ao: z.ao[0], no: z.no[0] })), water: { tanMgN: 0, no2MgN: 0, no3MgN: 0, orgMgN: 0 } };
const truth = forecastParsed(scaledScenario(cycling, base, 3, 0.5), { horizonDays: 45, stepDays: 0.5 });
const kit = { stepMgN: 0.25, relativeError: 0.1 };
const readings = Array.from({ length: 30 }, (_, i) => {
  const d = 1.5 * (i + 1);
  const k = truth.series.days.indexOf(d);
  return { day: d, tanMgN: roundToKit(kit, truth.series.tanMgN[k]), no2MgN: roundToKit(kit, truth.series.no2MgN[k]) };
});
time('calibration, 30 readings, bands to 1 day past the log', 1000, 5, () => calibrate({ scenario: cycling, readings, members: 64, forecastDays: 1 }));
time('calibration, 30 readings + prior and calibrated bands (30 d)', 1000, 5, () => calibrate({ scenario: cycling, readings }));
