import { router } from 'expo-router';
import { displayNameSchema, passwordSchema } from '@/shared/schemas/auth';
import { z } from 'zod';
import { useAcceptInvite, useInvitePreview } from '@/hooks/use-clubs';
import { useMe } from '@/hooks/use-session';
import { useFormState } from '@/hooks/use-form-state';
import { formErrorsFromRequest, NO_FORM_ERRORS, validateForm } from '@/lib/form-errors';
import { AuthFrame } from '@/components/auth/auth-frame';
import { Banner } from '@/components/ui/banner';
import { Button } from '@/components/ui/button';
import { TextField } from '@/components/ui/text-field';
import { TextLink } from '@/components/ui/text-link';
import { AppText } from '@/components/ui/text';
import { Loading } from '@/components/ui/load-state';

const newAccountSchema = z.object({ displayName: displayNameSchema, password: passwordSchema });

/** Opening an invite link: join with the current account, or make one for the invited address. */
export function InviteScreen({ token }: { token: string }) {
  const preview = useInvitePreview(token);
  const me = useMe();
  const accept = useAcceptInvite(token);
  const { values, setValue, errors, setErrors } = useFormState({ displayName: '', password: '' });
  const joined = (r: { clubId: string }) => router.replace(`/clubs/${r.clubId}`);
  const join = () => {
    if (me.data) return accept.mutate({}, { onSuccess: joined, onError: (e) => setErrors(formErrorsFromRequest(e, [])) });
    const checked = validateForm(newAccountSchema, values);
    if (!checked.ok) return setErrors(checked.errors);
    setErrors(NO_FORM_ERRORS);
    accept.mutate(checked.data, { onSuccess: joined, onError: (e) => setErrors(formErrorsFromRequest(e, ['displayName', 'password'])) });
  };
  const p = preview.data;
  return (
    <AuthFrame testID="screen-invite" title={p ? `Join ${p.clubName}` : 'Club invite'} lead={p ? `${p.invitedBy} invites ${p.email}.` : 'Opening your invite…'}>
      {preview.isPending || me.isPending ? <Loading label="Checking the invite…" /> : null}
      {preview.isError ? (
        <Banner tone="watch" title="This invite does not work" message="It was used already, has expired, or is mistyped. Ask the organizer for a new one." testID="invite-invalid" />
      ) : null}
      {errors.banner ? <Banner tone="danger" title="Could not join" message={errors.banner} testID="invite-error" /> : null}
      {p && me.data ? (
        <>
          <AppText>{`You are signed in as ${me.data.displayName}.`}</AppText>
          <Button label={`Join ${p.clubName}`} onPress={join} busy={accept.isPending} testID="invite-accept" />
        </>
      ) : null}
      {p && me.data === null && p.accountExists ? (
        <>
          <AppText>An account already uses this address. Sign in, then open the link again.</AppText>
          <TextLink href={`/sign-in?next=${encodeURIComponent(`/invite/${token}`)}`} label="Sign in" testID="invite-sign-in" />
        </>
      ) : null}
      {p && me.data === null && !p.accountExists ? (
        <>
          <TextField label="Your name" testID="invite-name" value={values.displayName} onChangeText={setValue('displayName')} error={errors.fields.displayName} autoComplete="name" />
          <TextField
            label="Choose a password"
            hint="At least 8 characters."
            testID="invite-password"
            value={values.password}
            onChangeText={setValue('password')}
            error={errors.fields.password}
            secureTextEntry
            autoComplete="new-password"
            onSubmitEditing={join}
          />
          <Button label="Create account and join" onPress={join} busy={accept.isPending} testID="invite-accept" />
        </>
      ) : null}
    </AuthFrame>
  );
}
