import { forgotPasswordSchema } from '@/shared/schemas/auth';
import { useForgotPassword } from '@/hooks/use-session';
import { useFormState } from '@/hooks/use-form-state';
import { formErrorsFromRequest, NO_FORM_ERRORS, validateForm } from '@/lib/form-errors';
import { AuthFrame } from '@/components/auth/auth-frame';
import { Banner } from '@/components/ui/banner';
import { Button } from '@/components/ui/button';
import { TextField } from '@/components/ui/text-field';
import { TextLink } from '@/components/ui/text-link';

const FIELDS = ['email'] as const;

/** Asks for a reset link. The answer is the same whether or not the address has an account. */
export function ForgotPasswordScreen() {
  const { values, setValue, errors, setErrors } = useFormState({ email: '' });
  const forgot = useForgotPassword();

  const submit = () => {
    if (forgot.isPending) return;
    const checked = validateForm(forgotPasswordSchema, values);
    if (!checked.ok) return setErrors(checked.errors);
    setErrors(NO_FORM_ERRORS);
    forgot.mutate(checked.data, { onError: (e) => setErrors(formErrorsFromRequest(e, FIELDS)) });
  };

  return (
    <AuthFrame
      testID="screen-forgot-password"
      title="Reset your password"
      lead="Enter the e-mail you signed up with. We will send a link to choose a new password."
      footer={<TextLink href="/sign-in" label="Back to sign in" testID="forgot-to-sign-in" />}
    >
      {forgot.isSuccess ? (
        <Banner
          tone="ok"
          title="Check your inbox"
          message={`If ${forgot.variables?.email ?? 'that address'} has an account, a reset link is on its way. It works once; ask again if it expires.`}
          testID="forgot-sent"
        />
      ) : null}
      {errors.banner ? <Banner tone="danger" title="Could not send the link" message={errors.banner} testID="forgot-banner" /> : null}
      <TextField
        testID="forgot-email"
        label="E-mail"
        value={values.email}
        onChangeText={setValue('email')}
        error={errors.fields.email}
        autoComplete="email"
        inputMode="email"
        keyboardType="email-address"
        autoCapitalize="none"
        autoCorrect={false}
        returnKeyType="send"
        onSubmitEditing={submit}
      />
      <Button
        testID="forgot-submit"
        label={forgot.isSuccess ? 'Send another link' : 'Send reset link'}
        busy={forgot.isPending}
        busyLabel="Sending…"
        onPress={submit}
        fullWidth
      />
    </AuthFrame>
  );
}
