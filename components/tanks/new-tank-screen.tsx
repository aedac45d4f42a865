import { useRouter } from 'expo-router';
import { View } from 'react-native';
import { useCreateTank } from '@/hooks/use-tanks';
import { usePreferences } from '@/hooks/use-preferences';
import { useTheme } from '@/hooks/use-theme';
import { isApiRequestError } from '@/lib/api-client';
import { Screen } from '@/components/ui/screen';
import { Card } from '@/components/ui/card';
import { Banner } from '@/components/ui/banner';
import { Button } from '@/components/ui/button';
import { AppText, Heading } from '@/components/ui/text';
import { TextLink } from '@/components/ui/text-link';
import { TankFormFields } from '@/components/tanks/tank-form-fields';
import { emptyTankForm, formToTankInput, mapTankErrors } from '@/components/tanks/tank-form-model';
import { useTankForm } from '@/components/tanks/use-tank-form';

/** A new tank from a name, a volume and a filter kind; the rest is defaulted and editable. */
export function NewTankScreen() {
  const { space } = useTheme();
  const router = useRouter();
  const units = usePreferences();
  const form = useTankForm(emptyTankForm);
  const create = useCreateTank();

  const submit = () => {
    const result = formToTankInput(form.values, units, 'create');
    if (!result.ok) {
      form.setErrors(result.fields);
      form.setBanner(result.other.length ? result.other.join(' ') : null);
      return;
    }
    create.mutate(result.input, {
      onSuccess: (tank) => router.replace({ pathname: '/tanks/[id]', params: { id: tank.id } }),
      onError: (e) => {
        if (isApiRequestError(e)) {
          const mapped = mapTankErrors(e.fields);
          form.setErrors(mapped.fields);
          form.setBanner(Object.keys(mapped.fields).length === 0 ? e.message : mapped.other.join(' ') || null);
        } else form.setBanner('Something went wrong. Please try again.');
      },
    });
  };

  return (
    <Screen testID="screen-new-tank" title="New tank" width="form">
      <TextLink href="/" label="← All tanks" accessibilityLabel="Back to all tanks" testID="new-tank-back" />
      <View style={{ gap: space.xs }}>
        <Heading>New tank</Heading>
        <AppText tone="textMuted">A name and a volume are enough to start. You can add fish and tests next.</AppText>
      </View>
      <Card style={{ gap: space.lg }}>
        <TankFormFields values={form.values} set={form.set} errors={form.errors} units={units} testIDPrefix="new-tank" />
        {form.banner ? <Banner tone="danger" title="Not saved" message={form.banner} testID="new-tank-error" /> : null}
        <Button label="Create tank" busy={create.isPending} busyLabel="Creating…" onPress={submit} testID="new-tank-submit" fullWidth />
      </Card>
    </Screen>
  );
}
