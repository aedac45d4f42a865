import { useRef } from 'react';
import type { TextInput } from 'react-native';
import { useGlobalSearchParams, type Href } from 'expo-router';
import { PASSWORD_MIN_LENGTH, signUpSchema } from '@/shared/schemas/auth';
import { useSignUp } from '@/hooks/use-session';
import { useFormState } from '@/hooks/use-form-state';
import { formErrorsFromRequest, NO_FORM_ERRORS, validateForm } from '@/lib/form-errors';
import { safeNextPath } from '@/lib/safe-next';
import { AuthFrame } from '@/components/auth/auth-frame';
import { Banner } from '@/components/ui/banner';
import { Button } from '@/components/ui/button';
import { TextField } from '@/components/ui/text-field';
import { TextLink } from '@/components/ui/text-link';

const FIELDS = ['displayName', 'email', 'password'] as const;

/**
 * Name, e-mail, password. The answer is the same whether or not the address has an account (the
 * e-mail tells its owner which), so the screen then asks the person to open the e-mailed link.
 */
export function SignUpScreen() {
  const { next } = useGlobalSearchParams<{ next?: string }>();
  const nextPath = safeNextPath(next);
  const signInHref = (nextPath === '/' ? '/sign-in' : `/sign-in?next=${encodeURIComponent(nextPath)}`) as Href;
  const { values, setValue, errors, setErrors } = useFormState({ displayName: '', email: '', password: '' });
  const signUp = useSignUp();
  const emailRef = useRef<TextInput>(null);
  const passwordRef = useRef<TextInput>(null);

  const submit = () => {
    if (signUp.isPending) return;
    const checked = validateForm(signUpSchema, values);
    if (!checked.ok) return setErrors(checked.errors);
    setErrors(NO_FORM_ERRORS);
    signUp.mutate(checked.data, { onError: (e) => setErrors(formErrorsFromRequest(e, FIELDS)) });
  };

  if (signUp.isSuccess) {
    return (
      <AuthFrame testID="screen-sign-up" title="Check your inbox" footer={<TextLink href={signInHref} label="Back to sign in" testID="sign-up-to-sign-in" />}>
        <Banner
          tone="ok"
          title={`We wrote to ${signUp.variables?.email ?? 'you'}`}
          message={signUp.data.message}
          testID="sign-up-sent"
        />
        <Button testID="sign-up-again" label="Use another address" variant="secondary" onPress={() => signUp.reset()} fullWidth />
      </AuthFrame>
    );
  }

  return (
    <AuthFrame
      testID="screen-sign-up"
      title="Create your account"
      lead="Add your tanks, log water tests, and plan changes without a spike."
      footer={<TextLink href={signInHref} label="Already have an account? Sign in" testID="sign-up-to-sign-in" />}
    >
      {errors.banner ? <Banner tone="danger" title="Could not create the account" message={errors.banner} testID="sign-up-banner" /> : null}
      <TextField
        testID="sign-up-name"
        label="Your name"
        hint="Shown to clubs you join."
        value={values.displayName}
        onChangeText={setValue('displayName')}
        error={errors.fields.displayName}
        autoComplete="name"
        returnKeyType="next"
        onSubmitEditing={() => emailRef.current?.focus()}
      />
      <TextField
        ref={emailRef}
        testID="sign-up-email"
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
        testID="sign-up-password"
        label="Password"
        hint={`At least ${PASSWORD_MIN_LENGTH} characters. A short sentence is easy to remember.`}
        value={values.password}
        onChangeText={setValue('password')}
        error={errors.fields.password}
        secureTextEntry
        autoComplete="new-password"
        autoCapitalize="none"
        returnKeyType="go"
        onSubmitEditing={submit}
      />
      <Button testID="sign-up-submit" label="Create account" busy={signUp.isPending} busyLabel="Sending…" onPress={submit} fullWidth />
    </AuthFrame>
  );
}
