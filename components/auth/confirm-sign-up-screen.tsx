import { confirmSignUpSchema } from '@/shared/schemas/auth';
import { useConfirmSignUp } from '@/hooks/use-session';
import { formErrorsFromRequest } from '@/lib/form-errors';
import { AuthFrame } from '@/components/auth/auth-frame';
import { Banner } from '@/components/ui/banner';
import { Button } from '@/components/ui/button';
import { TextLink } from '@/components/ui/text-link';

/**
 * Finishes a sign-up from the e-mailed link (`?token=`). A button, not an automatic request, so
 * a mail scanner opening the link does not make the account. On success the auth layout's gate
 * moves the new keeper home.
 */
export function ConfirmSignUpScreen({ token }: { token: string }) {
  const confirm = useConfirmSignUp();
  const tokenProblem = confirmSignUpSchema.shape.token.safeParse(token).success ? null : 'This sign-up link is not complete.';
  const errors = confirm.error ? formErrorsFromRequest(confirm.error, ['token']) : null;
  const linkProblem = tokenProblem ?? errors?.fields.token ?? null;

  return (
    <AuthFrame
      testID="screen-confirm-sign-up"
      title="Finish creating your account"
      lead="One step left: this makes your account and signs you in."
      footer={<TextLink href="/sign-in" label="Back to sign in" testID="confirm-sign-up-to-sign-in" />}
    >
      {linkProblem ? (
        <Banner tone="danger" title="This link cannot be used" message={linkProblem} testID="confirm-sign-up-link-problem">
          <TextLink href="/sign-up" label="Sign up again" testID="confirm-sign-up-again" />
        </Banner>
      ) : null}
      {errors?.banner ? <Banner tone="danger" title="Could not create the account" message={errors.banner} testID="confirm-sign-up-banner" /> : null}
      <Button
        testID="confirm-sign-up-submit"
        label="Create my account"
        busy={confirm.isPending}
        busyLabel="Creating account…"
        onPress={() => {
          if (!confirm.isPending) confirm.mutate({ token });
        }}
        disabled={tokenProblem !== null}
        fullWidth
      />
    </AuthFrame>
  );
}
