import { useEffect, useRef, useState } from 'react';
import { forecastView } from '@/shared/forecast-view';
import type { ForecastView } from '@/shared/schemas/plan';
import { ScenarioError, type ScenarioEvent } from '@/simulation/scenario';
import { tankScenario, type ScenarioTank, type StartState } from '@/shared/tank-scenario';
import { forecast } from '@/simulation/forecast';

export interface LiveForecast {
  view: ForecastView | null;
  /** The engine's refusal, field → message (e.g. an event day past the horizon). */
  fields: Record<string, string> | null;
  /** Engine time of the last run, ms. */
  computeMs: number;
  /** What the forecast started from (null before the first run). */
  startState: StartState | null;
}

/** Performance mark names the bench reads (bench/web.ts). */
export const MARK_INPUT = 'shoalshift:draft-input';
export const MEASURE_COMPUTE = 'shoalshift:forecast-compute';

/** Runs the draft's forecast in the browser; one run per animation frame at most, the newest input wins. */
export function runDraftForecast(tank: ScenarioTank, events: readonly ScenarioEvent[], startDate?: string): LiveForecast {
  const t0 = performance.now();
  let startState: StartState | null = null;
  try {
    // The server's start rule (shared/tank-start.ts) at the plan's start date, so live and saved forecasts start alike.
    const built = tankScenario(tank, { events }, startDate ? { startDate } : {});
    startState = built.startState;
    const f = forecast(built.scenario);
    return { view: forecastView(f), fields: null, computeMs: performance.now() - t0, startState };
  } catch (e) {
    if (e instanceof ScenarioError) return { view: null, fields: e.fields, computeMs: performance.now() - t0, startState };
    throw e;
  }
}

const raf: (cb: () => void) => number =
  typeof requestAnimationFrame === 'function' ? (cb) => requestAnimationFrame(cb) : (cb) => setTimeout(cb, 16) as unknown as number;
const cancelRaf: (id: number) => void = typeof cancelAnimationFrame === 'function' ? cancelAnimationFrame : clearTimeout;

/**
 * The live forecast of a draft: recomputed in the browser (the engine is pure TypeScript) when
 * the tank or events change, throttled to one run per frame so dragging a slider redraws the
 * chart as it moves.
 */
export function useLiveForecast(tank: ScenarioTank | undefined, events: readonly ScenarioEvent[] | undefined, startDate?: string): LiveForecast {
  const [state, setState] = useState<LiveForecast>({ view: null, fields: null, computeMs: 0, startState: null });
  const latest = useRef<{ tank?: ScenarioTank; events?: readonly ScenarioEvent[]; startDate?: string }>({});
  const frame = useRef<number | null>(null);
  latest.current = { tank, events, startDate };

  useEffect(() => {
    if (!tank || !events) return;
    if (frame.current !== null) return; // a run is already booked for this frame; it reads the newest input
    frame.current = raf(() => {
      frame.current = null;
      const { tank: t, events: ev, startDate: day } = latest.current;
      if (!t || !ev) return;
      const result = runDraftForecast(t, ev, day);
      try {
        performance.measure?.(MEASURE_COMPUTE, { start: performance.now() - result.computeMs, end: performance.now() });
      } catch {
        // performance.measure with options is missing on some engines; the figure is optional.
      }
      setState(result);
    });
  }, [tank, events, startDate]);

  useEffect(() => () => {
    if (frame.current !== null) cancelRaf(frame.current);
  }, []);

  return state;
}
