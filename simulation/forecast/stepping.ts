/**
 * Stepping a run from event to event: apply the breakpoints due, integrate the segment to the
 * next one (no step straddles a jump), record the samples on the way, and count the work.
 */
import type { Model } from '../model';
import { SolverError, type IntegrationStats, type SampleSink, type SegmentIntegrator } from '../solver';
import type { Breakpoint } from '../timeline';
import { noteDoseFlow, noteFeeding } from './balance';
import { doseFlowOf } from './conditions';
import { applyBreakpoint, type EventScope } from './events';
import { notePeaks, type EventPeaks } from './peaks';

export interface StepperInput {
  scope: EventScope;
  model: Model;
  integrator: SegmentIntegrator;
  breakpoints: readonly Breakpoint[];
  /** sample times and their recorder */
  times: readonly number[];
  record: SampleSink;
  eventPeaks: EventPeaks;
  /** first day of the run (breakpoints before it were applied by the run that saved the state) */
  startDay: number;
  /** samples at an event instant show the water before the events rather than after them */
  sampleBeforeEvents: boolean;
}

export interface Stepper {
  /** Current day (the state is just before this day's events, unless it is the end). */
  readonly day: number;
  /** Samples recorded so far. */
  readonly samples: number;
  /** Integrates to `stop`; events at `stop` are applied only when `final`. */
  advance(stop: number, final: boolean): void;
  /** Records the samples left (those at the end day). */
  recordRest(): void;
  readonly work: IntegrationStats & { segments: number };
}

export function createStepper(input: StepperInput): Stepper {
  const { scope, model, integrator, times, record, eventPeaks } = input;
  const bps = input.breakpoints;
  const y = scope.y;
  const ns = times.length;
  const rhs = model.rhs;
  let bi = 0;
  while (bi < bps.length && bps[bi].time < input.startDay - 1e-9) bi++;
  let t = input.startDay;
  let k = 0;
  let started = false;
  const work = { steps: 0, accepted: 0, rejected: 0, evaluations: 0, segments: 0 };
  const before = input.sampleBeforeEvents;

  const advance = (stop: number, final: boolean) => {
    while (true) {
      if (!final && t >= stop - 1e-9) return;
      if (bi < bps.length && bps[bi].time <= t + 1e-9) {
        // Samples at an event instant show the water after the events ('before': before them).
        if (before) while (k < ns && times[k] <= t + 1e-9) record(k++, y);
        applyBreakpoint(scope, bps[bi++]);
        notePeaks(eventPeaks, model, y, t);
        continue;
      }
      if (!started) {
        notePeaks(eventPeaks, model, y, t);
        started = true;
      }
      if (t >= stop - 1e-9) return;
      const tEnd = bi < bps.length && bps[bi].time < stop ? bps[bi].time : stop;
      let kEnd = k;
      while (kEnd < ns && times[kEnd] < tEnd - 1e-9) kEnd++;
      noteFeeding(scope.ledger, scope.conditions.feedFlows, tEnd - t);
      noteDoseFlow(scope.ledger, doseFlowOf(scope.conditions), scope.tank.volumeL, t, tEnd);
      const segment = integrator.integrate({ f: rhs, from: t, to: tEnd, y, times, first: k, end: kEnd, sink: record });
      work.steps += segment.stats.steps;
      work.accepted += segment.stats.accepted;
      work.rejected += segment.stats.rejected;
      work.evaluations += segment.stats.evaluations;
      work.segments++;
      if (!segment.outcome.ok) throw new SolverError(segment.outcome.message);
      k = kEnd;
      t = tEnd;
    }
  };

  return {
    get day() {
      return t;
    },
    get samples() {
      return k;
    },
    advance,
    recordRest() {
      while (k < ns) record(k++, y);
    },
    work,
  };
}
