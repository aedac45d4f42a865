/**
 * The crowding warning while a fish event is typed (pure): the tank's fish on the event's
 * day (its fish now, then the plan's other events up to that day) plus the fish being typed,
 * judged by `stockingWarning` (simulation/stocking.ts).
 */
import { fishGroupSchema, type FishGroup, type ScenarioEvent } from '@/simulation/scenario';
import { fishMassOnDayG, groupsMassG, stockingWarning } from '@/simulation/stocking';
import { fieldsToGroups, type GroupFields } from '@/components/plans/fish-groups';
import { parseDecimal } from '@/lib/units-format';

export interface StockingContext {
  volumeL: number;
  /** The tank's size in the keeper's units, e.g. "120 L". */
  volumeText: string;
  /** The tank's fish now (shared/tank-scenario.ts `fishFromLivestock`). */
  startFish: readonly FishGroup[];
  /** The plan's events. */
  events: readonly ScenarioEvent[];
}

/** The typed rows that are already complete fish groups. */
export function typedGroups(fields: GroupFields): FishGroup[] {
  return fieldsToGroups(fields, 'sized').flatMap((g) => {
    const parsed = fishGroupSchema.safeParse(g);
    return parsed.success ? [parsed.data] : [];
  });
}

/** The warning for the event being typed, or null; `editing` (the saved copy of it) is left out of the plan. */
export function eventStocking(ctx: StockingContext, fields: GroupFields, editing: ScenarioEvent | null): string | null {
  const added = groupsMassG(typedGroups(fields));
  if (added === 0) return null;
  const day = parseDecimal(fields.day ?? '') ?? 0;
  const others = ctx.events.filter((e) => e !== editing);
  const before = fishMassOnDayG(ctx.startFish, others, Number.isFinite(day) ? day : 0);
  return stockingWarning(before + added, ctx.volumeL, ctx.volumeText);
}
