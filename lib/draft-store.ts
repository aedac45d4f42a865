/**
 * Plan drafts and the plan editor's UI state (zustand; client state only — saved plans live
 * in TanStack Query). A draft is the keeper's unsaved copy of a plan's events: nothing typed
 * is lost when the chart or the advice panel re-renders.
 */
import { create } from 'zustand';
import type { ScenarioEvent } from '@/simulation/scenario';

export type AdviceTab = 'addition' | 'removal' | 'rescue' | 'calibration' | 'capacity-test';

export interface PlanDraft {
  name: string;
  events: ScenarioEvent[];
  /** The saved plan's `updatedAt` the draft started from. */
  baseUpdatedAt: string;
  dirty: boolean;
}

interface DraftState {
  drafts: Record<string, PlanDraft>;
  /** Index of the event the editor has open, per plan. */
  selected: Record<string, number | null>;
  adviceTab: AdviceTab;
  /** Start a draft from the saved plan unless one already exists for the same saved version. */
  ensureDraft(planId: string, saved: { name: string; events: ScenarioEvent[]; updatedAt: string }): void;
  setEvents(planId: string, events: ScenarioEvent[]): void;
  updateEvent(planId: string, index: number, event: ScenarioEvent): void;
  addEvent(planId: string, event: ScenarioEvent): void;
  removeEvent(planId: string, index: number): void;
  setName(planId: string, name: string): void;
  select(planId: string, index: number | null): void;
  setAdviceTab(tab: AdviceTab): void;
  /** After a save: the draft now equals the saved plan. */
  markSaved(planId: string, updatedAt: string): void;
  discard(planId: string): void;
}

/** The schedule rule lives in shared/ (the server searches by it too); re-exported for the editor. */
export { applySchedule, sortEvents } from '@/shared/plan-schedule';

/**
 * The events a list shows for a plan: the unsaved draft's while there is one (so a count never
 * says "0 events" for a plan being filled in), else the saved ones. A finished plan's lists
 * pass no draft: it shows what it ran.
 */
export function shownEvents(draft: PlanDraft | undefined, saved: readonly ScenarioEvent[]): { events: readonly ScenarioEvent[]; unsaved: boolean } {
  return draft?.dirty ? { events: draft.events, unsaved: true } : { events: saved, unsaved: false };
}

/** "1 event", "3 events". */
export function eventCount(n: number): string {
  return `${n} ${n === 1 ? 'event' : 'events'}`;
}

export const useDraftStore = create<DraftState>((set) => {
  const edit = (planId: string, f: (d: PlanDraft) => Partial<PlanDraft>) =>
    set((s) => {
      const d = s.drafts[planId];
      return d ? { drafts: { ...s.drafts, [planId]: { ...d, ...f(d), dirty: true } } } : s;
    });
  return {
    drafts: {},
    selected: {},
    adviceTab: 'addition',
    ensureDraft: (planId, saved) =>
      set((s) => {
        const d = s.drafts[planId];
        if (d && (d.dirty || d.baseUpdatedAt === saved.updatedAt)) return s;
        return { drafts: { ...s.drafts, [planId]: { name: saved.name, events: saved.events, baseUpdatedAt: saved.updatedAt, dirty: false } } };
      }),
    setEvents: (planId, events) => edit(planId, () => ({ events })),
    updateEvent: (planId, index, event) => edit(planId, (d) => ({ events: d.events.map((e, i) => (i === index ? event : e)) })),
    addEvent: (planId, event) => edit(planId, (d) => ({ events: [...d.events, event] })),
    removeEvent: (planId, index) => edit(planId, (d) => ({ events: d.events.filter((_, i) => i !== index) })),
    setName: (planId, name) => edit(planId, () => ({ name })),
    select: (planId, index) => set((s) => ({ selected: { ...s.selected, [planId]: index } })),
    setAdviceTab: (adviceTab) => set({ adviceTab }),
    markSaved: (planId, updatedAt) =>
      set((s) => {
        const d = s.drafts[planId];
        return d ? { drafts: { ...s.drafts, [planId]: { ...d, baseUpdatedAt: updatedAt, dirty: false } } } : s;
      }),
    discard: (planId) =>
      set((s) => {
        const { [planId]: _gone, ...rest } = s.drafts;
        return { drafts: rest };
      }),
  };
});
