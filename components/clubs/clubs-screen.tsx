import { View } from 'react-native';
import { createClubSchema } from '@/shared/schemas/club';
import { useClubList, useCreateClub } from '@/hooks/use-clubs';
import { useFormState } from '@/hooks/use-form-state';
import { useTheme } from '@/hooks/use-theme';
import { formErrorsFromRequest, NO_FORM_ERRORS, validateForm } from '@/lib/form-errors';
import { Screen } from '@/components/ui/screen';
import { Card } from '@/components/ui/card';
import { Button } from '@/components/ui/button';
import { Banner } from '@/components/ui/banner';
import { TextField } from '@/components/ui/text-field';
import { TextLink } from '@/components/ui/text-link';
import { AppText, Heading } from '@/components/ui/text';
import { Loading, LoadError } from '@/components/ui/load-state';
import { ROLE_LABEL } from './role-labels';

/** The person's clubs, a way in to lessons, and starting a new club. */
export function ClubsScreen() {
  const { space } = useTheme();
  const clubs = useClubList();
  const create = useCreateClub();
  const { values, setValue, errors, setErrors } = useFormState({ name: '' });
  const submit = () => {
    const checked = validateForm(createClubSchema, values);
    if (!checked.ok) return setErrors(checked.errors);
    setErrors(NO_FORM_ERRORS);
    create.mutate(checked.data.name, { onSuccess: () => setValue('name')(''), onError: (e) => setErrors(formErrorsFromRequest(e, ['name'])) });
  };
  return (
    <Screen testID="screen-clubs" title="Clubs">
      <Heading>Clubs</Heading>
      <TextLink href="/lessons" label="Lessons from your clubs →" testID="clubs-to-lessons" />
      {clubs.isPending ? <Loading label="Loading your clubs…" /> : null}
      {clubs.isError ? <LoadError title="Could not load your clubs" error={clubs.error} onRetry={() => void clubs.refetch()} retrying={clubs.isFetching} /> : null}
      {clubs.data?.clubs.length === 0 ? <AppText testID="clubs-empty">You are not in a club yet. Start one below, or open an invite link.</AppText> : null}
      <View style={{ gap: space.md }}>
        {clubs.data?.clubs.map((c) => (
          <Card key={c.id} testID={`club-card-${c.id}`} style={{ gap: space.xs }}>
            <TextLink href={`/clubs/${c.id}`} label={c.name} variant="title" testID="club-link" />
            <AppText tone="textMuted">{`${ROLE_LABEL[c.myRole]} · ${c.memberCount} member${c.memberCount === 1 ? '' : 's'}`}</AppText>
          </Card>
        ))}
      </View>
      <Card testID="club-create" style={{ gap: space.md }}>
        <Heading level={2}>Start a club</Heading>
        <AppText tone="textMuted">You become its organizer and can invite people by e-mail.</AppText>
        {errors.banner ? <Banner tone="danger" title="The club was not created" message={errors.banner} /> : null}
        <TextField label="Club name" testID="club-create-name" value={values.name} onChangeText={setValue('name')} error={errors.fields.name} onSubmitEditing={submit} />
        <Button label="Create club" onPress={submit} busy={create.isPending} testID="club-create-submit" />
      </Card>
    </Screen>
  );
}
