import { useState } from 'react';
import { View } from 'react-native';
import type { TankDetail } from '@/shared/schemas/tank';
import { useUpdateTank } from '@/hooks/use-tanks';
import { useTheme } from '@/hooks/use-theme';
import { isApiRequestError } from '@/lib/api-client';
import { AppText } from '@/components/ui/text';
import { Banner } from '@/components/ui/banner';
import { Button } from '@/components/ui/button';
import { TextField } from '@/components/ui/text-field';
import { ChoiceGroup } from '@/components/settings/choice-group';
import { SpeciesPicker } from '@/components/tanks/species-picker';
import { HISTORY_CHOICES, historyForm, historyFromForm, type HistoryForm } from '@/components/tanks/tank-history-model';

const HINTS: Record<HistoryForm['kind'], string> = {
  unsaid: 'Forecasts assume a settled tank when it holds fish, a new one when it holds none.',
  settled: 'Its nitrifiers match the fish it holds now.',
  new: 'Set up recently: hardly any nitrifiers yet.',
  emptied: 'The filter was mature with the fish below until the date, and has had no fish since: its nitrifiers starve.',
  seeded: 'A new tank whose filter holds media taken from a mature filter.',
};

/** How the tank has run, as the keeper tells it: one of the four accounts the start rule reads. */
export function TankHistorySection({ tank }: { tank: TankDetail }) {
  const { space } = useTheme();
  const save = useUpdateTank(tank.id);
  const [form, setForm] = useState<HistoryForm>(() => historyForm(tank.history, new Date().toISOString().slice(0, 10)));
  const [errors, setErrors] = useState<Record<string, string>>({});
  const set = (patch: Partial<HistoryForm>) => {
    setForm((f) => ({ ...f, ...patch }));
    save.reset();
  };
  const submit = () => {
    const out = historyFromForm(form, tank.history);
    if ('errors' in out) return setErrors(out.errors);
    setErrors({});
    save.mutate(
      { history: out.history },
      { onError: (e) => setErrors(isApiRequestError(e) && Object.keys(e.fields).length ? Object.fromEntries(Object.entries(e.fields).map(([k, v]) => [k.replace(/^history\./, ''), v])) : { _: e.message }) },
    );
  };
  return (
    <View style={{ gap: space.md }} testID="tank-history">
      <ChoiceGroup label="How this tank has run" hint={HINTS[form.kind]} testID="tank-history-kind" value={form.kind} onChange={(kind) => set({ kind })} choices={HISTORY_CHOICES} />
      {form.kind === 'emptied' ? (
        <View style={{ gap: space.sm }}>
          <TextField label="Filter mature until (date)" hint="The day the last fish left, e.g. 2026-12-01." testID="tank-history-until" value={form.matureUntil} onChangeText={(matureUntil) => set({ matureUntil })} error={errors.matureUntil} autoComplete="off" />
          <SpeciesPicker
            label="Fish it fed"
            value={{ speciesId: form.speciesId, customName: '' }}
            onChange={(c) => set({ speciesId: c.speciesId })}
            error={errors.speciesId}
            allowCustom={false}
            testID="tank-history-species"
          />
          <TextField label="How many of them" testID="tank-history-count" value={form.count} onChangeText={(count) => set({ count })} error={errors.count} inputMode="numeric" keyboardType="number-pad" />
        </View>
      ) : null}
      {form.kind === 'seeded' ? (
        <TextField label="Share of the filter's media from a mature filter (%)" testID="tank-history-share" value={form.sharePercent} onChangeText={(sharePercent) => set({ sharePercent })} error={errors.sharePercent} inputMode="numeric" keyboardType="number-pad" />
      ) : null}
      {errors._ ? <Banner tone="danger" title="Not saved" message={errors._} testID="tank-history-error" /> : null}
      {save.isSuccess ? <AppText tone="textMuted" testID="tank-history-saved">Saved: the next forecasts start from it.</AppText> : null}
      <Button label="Save how it has run" busy={save.isPending} busyLabel="Saving…" onPress={submit} testID="tank-history-save" />
    </View>
  );
}
