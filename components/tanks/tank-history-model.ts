/**
 * The "How this tank has run" form (pure): form text ↔ the stored account of the tank's past
 * (shared/schemas/tank-history.ts). Checked with the same schema the API applies, so a
 * message shows next to its field before anything is sent.
 */
import { tankHistorySchema, type TankHistory, type TankHistoryKind } from '@/shared/schemas/tank-history';
import { parseDecimal } from '@/lib/units-format';

export type HistoryChoice = TankHistoryKind | 'unsaid';

export interface HistoryForm {
  kind: HistoryChoice;
  matureUntil: string;
  speciesId: string | null;
  count: string;
  sharePercent: string;
}

export const HISTORY_CHOICES: readonly { value: HistoryChoice; label: string }[] = [
  { value: 'unsaid', label: 'Not said' },
  { value: 'settled', label: 'Settled for months' },
  { value: 'new', label: 'New, not cycled' },
  { value: 'emptied', label: 'Emptied: fish gone' },
  { value: 'seeded', label: 'New, seeded media' },
];

export function historyForm(h: TankHistory | null, today: string): HistoryForm {
  return {
    kind: h?.kind ?? 'unsaid',
    matureUntil: h?.kind === 'emptied' ? h.matureUntil : today,
    speciesId: h?.kind === 'emptied' ? h.formerFish[0].speciesId : null,
    count: h?.kind === 'emptied' ? String(h.formerFish[0].count) : '',
    sharePercent: h?.kind === 'seeded' ? String(h.sharePercent) : '50',
  };
}

/** The account to store (null = not said), or messages by form field. */
export function historyFromForm(f: HistoryForm, stored: TankHistory | null): { history: TankHistory | null } | { errors: Record<string, string> } {
  if (f.kind === 'unsaid') return { history: null };
  const num = (t: string) => {
    const v = parseDecimal(t);
    return v === null || Number.isNaN(v) ? Number.NaN : v;
  };
  // The form edits the first kind of fish; any others stored before are kept.
  const others = stored?.kind === 'emptied' ? stored.formerFish.slice(1) : [];
  const input =
    f.kind === 'emptied'
      ? { kind: f.kind, matureUntil: f.matureUntil.trim(), formerFish: f.speciesId ? [{ speciesId: f.speciesId, count: num(f.count) }, ...others.filter((o) => o.speciesId !== f.speciesId)] : [] }
      : f.kind === 'seeded'
        ? { kind: f.kind, sharePercent: num(f.sharePercent) }
        : { kind: f.kind };
  const parsed = tankHistorySchema.safeParse(input);
  if (parsed.success) return { history: parsed.data };
  const errors: Record<string, string> = {};
  for (const issue of parsed.error.issues) {
    const path = issue.path.join('.');
    const field = path.startsWith('formerFish.0.count') ? 'count' : path.startsWith('formerFish') ? 'speciesId' : path;
    errors[field] ??= field === 'count' && Number.isNaN(num(f.count)) ? 'Enter how many, as a whole number.' : issue.message;
  }
  return { errors };
}
