import { useRef } from 'react';
import type { TextInput } from 'react-native';
import { useGlobalSearchParams, type Href } from 'expo-router';
import { signInSchema } from '@/shared/schemas/auth';
import { useSignIn } from '@/hooks/use-session';
import { useFormState } from '@/hooks/use-form-state';
import { formErrorsFromRequest, NO_FORM_ERRORS, validateForm } from '@/lib/form-errors';
import { safeNextPath } from '@/lib/safe-next';
import { AuthFrame } from '@/components/auth/auth-frame';
import { Banner } from '@/components/ui/banner';
import { Button } from '@/components/ui/button';
import { TextField } from '@/components/ui/text-field';
import { TextLink } from '@/components/ui/text-link';

const FIELDS = ['email', 'password'] as const;

/** E-mail and password. On success the auth layout moves on to `?next=` or home. */
export function SignInScreen() {
  const { next } = useGlobalSearchParams<{ next?: string }>();
  const nextPath = safeNextPath(next);
  const signUpHref = (nextPath === '/' ? '/sign-up' : `/sign-up?next=${encodeURIComponent(nextPath)}`) as Href;
  const { values, setValue, errors, setErrors } = useFormState({ email: '', password: '' });
  const signIn = useSignIn();
  const passwordRef = useRef<TextInput>(null);

  const submit = () => {
    if (signIn.isPending) return;
    const checked = validateForm(signInSchema, values);
    if (!checked.ok) return setErrors(checked.errors);
    setErrors(NO_FORM_ERRORS);
    signIn.mutate(checked.data, { onError: (e) => setErrors(formErrorsFromRequest(e, FIELDS)) });
  };

  return (
    <AuthFrame
      testID="screen-sign-in"
      title="Sign in"
      lead="Plan stocking changes and watch your water tests."
      footer={
        <>
          <TextLink href="/forgot-password" label="Forgot your password?" testID="sign-in-forgot" />
          <TextLink href={signUpHref} label="New here? Create an account" testID="sign-in-to-sign-up" />
        </>
      }
    >
      {errors.banner ? <Banner tone="danger" title="Could not sign you in" message={errors.banner} testID="sign-in-banner" /> : null}
      <TextField
        testID="sign-in-email"
        label="E-mail"
        value={values.email}
        onChangeText={setValue('email')}
        error={errors.fields.email}
        autoComplete="email"
        inputMode="email"
        keyboardType="email-address"
        autoCapitalize="none"
        autoCorrect={false}
        returnKeyType="next"
        onSubmitEditing={() => passwordRef.current?.focus()}
      />
      <TextField
        ref={passwordRef}
        testID="sign-in-password"
        label="Password"
        value={values.password}
        onChangeText={setValue('password')}
        error={errors.fields.password}
        secureTextEntry
        autoComplete="current-password"
        autoCapitalize="none"
        returnKeyType="go"
        onSubmitEditing={submit}
      />
      <Button testID="sign-in-submit" label="Sign in" busy={signIn.isPending} busyLabel="Signing in…" onPress={submit} fullWidth />
    </AuthFrame>
  );
}
