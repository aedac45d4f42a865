/**
 * Command line: `npm run forecast -- scenario.json [--horizon 60] [--step 1] [--csv] [--before]`.
 * Prints the forecast as JSON (or the series as CSV). The engine (simulation/) does no I/O;
 * reading the file and printing are this command's.
 */
import { readFileSync } from 'node:fs';
import { ScenarioError } from '../simulation/scenario';
import { forecast, type Forecast } from '../simulation/forecast';
import { SolverError } from '../simulation/solver';

const HELP = `Shoalshift forecast — nitrogen cycle of one tank over a timeline of events.

Usage: npm run forecast -- <scenario.json> [options]

Options:
  --horizon <days>   forecast length (default: scenario "horizonDays", else 60)
  --step <days>      output interval (default 1)
  --before           samples on an event day show the water before that day's events
  --csv              print the series as CSV instead of JSON
  --help             this text

Scenario format (JSON; concentrations in mg/L as N; days from 0; see
simulation/scenario.ts for every field, default and limit):
  tank:     volumeL, temperatureC, ph, khDegrees?, phModel? ("fixed" | "carbonate"),
            tapWater? {tanMgN, no2MgN, no3MgN, khDegrees?}, aeration?, lightHoursPerDay?,
            plants? ("none"|"light"|"moderate"|"heavy"), chlorideMgL?,
            zones: [{ id, kind: "filter"|"substrate"|"surfaces",
                      areaM2 | media: {type, volumeL}, flow?, oxygen?, light? }]
  start:    {kind:"new", inoculumMgNPerLPerDay?} | {kind:"mature", loadMgNPerDay?}
            | {kind:"explicit", capacities:[{zoneId, aoMgNPerDay, noMgNPerDay}]}
            | {kind:"starved", formerFish:[fish] | loadMgNPerDay, starvedDays}  (mature, then no fish)
            | {kind:"seeded", share 0–1, loadMgNPerDay?}  (new tank, filter with mature media)
  initialWater?: {tanMgN?, no2MgN?, no3MgN?, orgMgN?}
  fish?:    [{species? (catalogue id) | name, count, lengthCm?, shape?, massG?}]
  feeding?: {mode:"body-mass", percentPerDay?, proteinShare?} | {mode:"grams", gramsPerDay, proteinShare?}
  events?:  add-fish {day, fish:[group, …]} · remove-fish {day, fish:[{species|name, count}, …]}
            · move-fish {day, direction:"in"|"out", otherTank?, fish:[group, …]} · feeding {day, feeding}
            (a fish group as under fish?, at most 20 per event; the older one-group forms
             fish:{…} and remove-fish {day, species|name, count} are still read)
            · water-change {day, percent} · temperature {day, temperatureC}
            · ammonia-dose {day, amount:{unit:"mgN-per-L", value} | {unit:"ammonium-chloride-g", grams}
                            | {unit:"ammonia-solution-mL", mL, percentNH3, densityGPerMl?},
                            repeatEveryDays?, repeatCount?,
                            timesPerDay? (1–8: each dose in equal parts 24/n h apart),
                            delivery? ("pulses" | "continuous": spread evenly over the dose's day)}
            · filter-clean {day, zoneId, action:"rinse"|"replace", shareLost}
            · medication {day, durationDays, oxidationMultiplier}
            · aeration-loss {day, durationDays, oxygenShare}

Example:
{
  "tank": { "volumeL": 100, "temperatureC": 25, "ph": 7.6,
            "zones": [ { "id": "filter", "kind": "filter", "media": { "type": "ceramic-rings", "volumeL": 1 } },
                       { "id": "surfaces", "kind": "surfaces", "areaM2": 1.2 } ] },
  "start": { "kind": "new" },
  "events": [ { "type": "ammonia-dose", "day": 0, "amount": { "unit": "mgN-per-L", "value": 1 },
                "repeatEveryDays": 1, "repeatCount": 30 } ]
}

Forecasts are estimates: water tests decide. Ammonia solutions are irritants — gloves and
eye protection. Fish health questions belong to a qualified aquatic veterinarian.
`;

function toCsv(f: Forecast): string {
  const s = f.series;
  const cols: [string, number[]][] = [
    ['day', s.days],
    ['tan_mgN_L', s.tanMgN],
    ['free_nh3_mg_L', s.freeNh3MgL],
    ['no2_mgN_L', s.no2MgN],
    ['no3_mgN_L', s.no3MgN],
    ['org_mgN_L', s.orgMgN],
    ['ph', s.ph],
    ['temperature_C', s.temperatureC],
    ...(s.khDegrees ? ([['kh_dKH', s.khDegrees]] as [string, number[]][]) : []),
    ...s.zones.flatMap((z): [string, number[]][] => [
      [`${z.zoneId}_ao_mgN_d`, z.ao],
      [`${z.zoneId}_no_mgN_d`, z.no],
    ]),
    ['load_mgN_d', s.loadMgNPerDay],
  ];
  const lines = [cols.map((c) => c[0]).join(',')];
  for (let i = 0; i < s.days.length; i++) lines.push(cols.map((c) => Number(c[1][i].toPrecision(6))).join(','));
  return lines.join('\n') + '\n';
}

function main(argv: string[]): number {
  if (argv.length === 0 || argv.includes('--help') || argv.includes('-h')) {
    process.stdout.write(HELP);
    return argv.length === 0 ? 1 : 0;
  }
  const numberAfter = (flag: string) => {
    const i = argv.indexOf(flag);
    if (i < 0) return undefined;
    const v = Number(argv[i + 1]);
    if (!Number.isFinite(v)) throw new Error(`${flag} needs a number`);
    return v;
  };
  const file = argv.find((a, i) => !a.startsWith('--') && !['--horizon', '--step'].includes(argv[i - 1]));
  if (!file) throw new Error('Give a scenario file (see --help).');
  const scenario: unknown = JSON.parse(readFileSync(file, 'utf8'));
  const result = forecast(scenario as never, {
    horizonDays: numberAfter('--horizon'),
    stepDays: numberAfter('--step'),
    eventSampling: argv.includes('--before') ? 'before' : 'after',
  });
  process.stdout.write(argv.includes('--csv') ? toCsv(result) : JSON.stringify(result, null, 2) + '\n');
  return 0;
}

try {
  process.exitCode = main(process.argv.slice(2));
} catch (e) {
  if (e instanceof ScenarioError) {
    process.stderr.write(`${e.message}\n${JSON.stringify(e.fields, null, 2)}\n`);
  } else if (e instanceof SolverError || e instanceof Error) {
    process.stderr.write(`${e.message}\n`);
  }
  process.exitCode = 2;
}
