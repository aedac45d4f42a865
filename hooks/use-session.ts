import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { ApiRequestError, apiRequest } from '@/lib/api-client';
import { sessionKeys } from '@/lib/query-keys';
import {
  meSchema,
  signUpSentSchema,
  type ConfirmSignUpInput,
  type ForgotPasswordInput,
  type Me,
  type ResetPasswordInput,
  type SignInInput,
  type SignUpInput,
} from '@/shared/schemas/auth';

/** Who is signed in rarely changes under us; a 401 elsewhere resets it at once (lib/query-client). */
export const ME_STALE_MS = 5 * 60_000;

/** GET /api/me; a 401 is an answer ("nobody"), not an error. */
export async function fetchMe(signal?: AbortSignal): Promise<Me | null> {
  try {
    return await apiRequest('/api/me', { schema: meSchema, signal });
  } catch (e) {
    if (e instanceof ApiRequestError && e.status === 401) return null;
    throw e;
  }
}

/** The signed-in person, `null` when signed out, `undefined` while the first answer is on its way. */
export function useMe() {
  return useQuery({ queryKey: sessionKeys.me(), queryFn: ({ signal }) => fetchMe(signal), staleTime: ME_STALE_MS });
}

/** After a change of who is signed in, drop everything cached for the previous person. */
function useStartSession() {
  const queryClient = useQueryClient();
  return (me: Me) => {
    queryClient.removeQueries({ predicate: (q) => q.queryKey[0] !== sessionKeys.all[0] });
    queryClient.setQueryData(sessionKeys.me(), me);
  };
}

export function useSignIn() {
  const startSession = useStartSession();
  return useMutation({
    mutationFn: (input: SignInInput) => apiRequest('/api/auth/sign-in', { method: 'POST', body: input, schema: meSchema }),
    onSuccess: startSession,
  });
}

/** Asks for the e-mailed link that finishes a sign-up; nobody is signed in yet. */
export function useSignUp() {
  return useMutation({
    mutationFn: (input: SignUpInput) => apiRequest('/api/auth/sign-up', { method: 'POST', body: input, schema: signUpSentSchema }),
  });
}

/** Opens the e-mailed link: makes the account and signs it in. */
export function useConfirmSignUp() {
  const startSession = useStartSession();
  return useMutation({
    mutationFn: (input: ConfirmSignUpInput) => apiRequest('/api/auth/confirm-sign-up', { method: 'POST', body: input, schema: meSchema }),
    onSuccess: startSession,
  });
}

export function useSignOut() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: () => apiRequest('/api/auth/sign-out', { method: 'POST' }),
    onSuccess: () => {
      queryClient.removeQueries({ predicate: (q) => q.queryKey[0] !== sessionKeys.all[0] });
      queryClient.setQueryData(sessionKeys.me(), null);
    },
  });
}

export function useForgotPassword() {
  return useMutation({
    mutationFn: (input: ForgotPasswordInput) => apiRequest('/api/auth/forgot-password', { method: 'POST', body: input }),
  });
}

export function useResetPassword() {
  return useMutation({
    mutationFn: (input: ResetPasswordInput) => apiRequest('/api/auth/reset-password', { method: 'POST', body: input }),
  });
}
