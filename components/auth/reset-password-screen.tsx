import { PASSWORD_MIN_LENGTH, resetPasswordSchema } from '@/shared/schemas/auth';
import { useResetPassword } from '@/hooks/use-session';
import { useFormState } from '@/hooks/use-form-state';
import { formErrorsFromRequest, NO_FORM_ERRORS, validateForm } from '@/lib/form-errors';
import { AuthFrame } from '@/components/auth/auth-frame';
import { Banner } from '@/components/ui/banner';
import { Button } from '@/components/ui/button';
import { TextField } from '@/components/ui/text-field';
import { TextLink } from '@/components/ui/text-link';

// `token` is not an input here, but its message is kept apart to offer a new link.
const FIELDS = ['password', 'token'] as const;

/** Sets a new password with the token from the e-mailed link (`?token=`). */
export function ResetPasswordScreen({ token }: { token: string }) {
  const { values, setValue, errors, setErrors } = useFormState({ password: '' });
  const reset = useResetPassword();
  const tokenProblem = resetPasswordSchema.shape.token.safeParse(token).success ? null : 'This reset link is not complete.';

  const submit = () => {
    if (reset.isPending) return;
    const checked = validateForm(resetPasswordSchema, { token, password: values.password });
    if (!checked.ok) return setErrors(checked.errors);
    setErrors(NO_FORM_ERRORS);
    reset.mutate(checked.data, { onError: (e) => setErrors(formErrorsFromRequest(e, FIELDS)) });
  };

  if (reset.isSuccess) {
    return (
      <AuthFrame testID="screen-reset-password" title="Password changed">
        <Banner tone="ok" title="Your new password is set" message="Sign in with it now." testID="reset-done" />
        <TextLink href="/sign-in" label="Sign in" testID="reset-to-sign-in" />
      </AuthFrame>
    );
  }

  // A token problem (missing, expired, used) cannot be fixed on this page: offer a new link.
  const linkProblem = tokenProblem ?? errors.fields.token ?? null;
  return (
    <AuthFrame
      testID="screen-reset-password"
      title="Choose a new password"
      footer={<TextLink href="/sign-in" label="Back to sign in" testID="reset-back" />}
    >
      {linkProblem ? (
        <Banner tone="danger" title="This link cannot be used" message={linkProblem} testID="reset-link-problem">
          <TextLink href="/forgot-password" label="Ask for a new link" testID="reset-new-link" />
        </Banner>
      ) : null}
      {errors.banner ? <Banner tone="danger" title="Could not change the password" message={errors.banner} testID="reset-banner" /> : null}
      <TextField
        testID="reset-password"
        label="New password"
        hint={`At least ${PASSWORD_MIN_LENGTH} characters.`}
        value={values.password}
        onChangeText={setValue('password')}
        error={errors.fields.password}
        secureTextEntry
        autoComplete="new-password"
        autoCapitalize="none"
        returnKeyType="go"
        onSubmitEditing={submit}
        editable={!tokenProblem}
      />
      <Button
        testID="reset-submit"
        label="Save new password"
        busy={reset.isPending}
        busyLabel="Saving…"
        onPress={submit}
        disabled={tokenProblem !== null}
        fullWidth
      />
    </AuthFrame>
  );
}
