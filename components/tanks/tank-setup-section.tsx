import { useState } from 'react';
import { View } from 'react-native';
import type { TankDetail } from '@/shared/schemas/tank';
import { usePreferences } from '@/hooks/use-preferences';
import { useUpdateTank } from '@/hooks/use-tanks';
import { useTheme } from '@/hooks/use-theme';
import { isApiRequestError } from '@/lib/api-client';
import { formatNitrogen, formatVolume, nitrogenUnit } from '@/lib/units-format';
import { Banner } from '@/components/ui/banner';
import { Button } from '@/components/ui/button';
import { AppText } from '@/components/ui/text';
import { TankFormFields } from '@/components/tanks/tank-form-fields';
import { formToTankInput, mapTankErrors, tankToForm } from '@/components/tanks/tank-form-model';
import { setupLines } from '@/components/tanks/tank-labels';
import { useTankForm } from '@/components/tanks/use-tank-form';

/** How the tank is built, in words; "Edit" opens the same form a new tank uses, filled in. */
export function TankSetupSection({ tank }: { tank: TankDetail }) {
  const { space } = useTheme();
  const units = usePreferences();
  const [editing, setEditing] = useState(false);
  const b = units.nitrogenBasis;
  const tap = tank.tapWater;
  const lines = setupLines(tank.setup).map((l) => l.replace(/(\d+(?:\.\d+)?) L of/, (_m, v: string) => `${formatVolume(Number(v), units.volumeUnit)} of`));

  if (editing) return <TankSetupEditor tank={tank} onDone={() => setEditing(false)} />;
  return (
    <View style={{ gap: space.sm }}>
      {lines.length === 0 ? <AppText tone="textMuted">No filter or substrate details yet.</AppText> : null}
      {lines.map((line) => (
        <AppText key={line}>{line}</AppText>
      ))}
      <AppText tone="textMuted">
        {`Tap water: total ammonia ${formatNitrogen(tap.tanMgN, 'tanMgN', b)} ${nitrogenUnit('tanMgN', b)}, nitrite ${formatNitrogen(tap.no2MgN, 'no2MgN', b)} ${nitrogenUnit('no2MgN', b)}, nitrate ${formatNitrogen(tap.no3MgN, 'no3MgN', b)} ${nitrogenUnit('no3MgN', b)}`}
      </AppText>
      {tank.notes.trim() ? <AppText>{tank.notes}</AppText> : null}
      <Button variant="secondary" label="Edit the tank" testID="tank-edit" onPress={() => setEditing(true)} />
    </View>
  );
}

function TankSetupEditor({ tank, onDone }: { tank: TankDetail; onDone: () => void }) {
  const { space } = useTheme();
  const units = usePreferences();
  const form = useTankForm(() => tankToForm(tank, units));
  const save = useUpdateTank(tank.id);

  const submit = () => {
    const result = formToTankInput(form.values, units, 'edit', tank);
    if (!result.ok) {
      form.setErrors(result.fields);
      form.setBanner(result.other.length ? result.other.join(' ') : null);
      return;
    }
    save.mutate(result.input, {
      onSuccess: onDone,
      onError: (e) => {
        const mapped = isApiRequestError(e) ? mapTankErrors(e.fields) : { fields: {}, other: [] };
        form.setErrors(mapped.fields);
        form.setBanner(Object.keys(mapped.fields).length ? mapped.other.join(' ') || null : e.message);
      },
    });
  };

  return (
    <View style={{ gap: space.lg }} testID="tank-editor">
      <TankFormFields values={form.values} set={form.set} errors={form.errors} units={units} testIDPrefix="edit-tank" startOpen />
      {form.banner ? <Banner tone="danger" title="Not saved" message={form.banner} /> : null}
      <View style={{ flexDirection: 'row', gap: space.md, flexWrap: 'wrap' }}>
        <Button label="Save changes" busy={save.isPending} busyLabel="Saving…" onPress={submit} testID="edit-tank-submit" />
        <Button variant="secondary" label="Cancel" onPress={onDone} testID="edit-tank-cancel" />
      </View>
    </View>
  );
}
