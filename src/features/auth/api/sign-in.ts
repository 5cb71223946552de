import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { Session, SignInInput } from '@shared/schemas/auth';
import type { SecondStepInput, SecondStepNeeded } from '@shared/schemas/two-factor';
import { apiClient, setCsrfToken } from '@/lib/api-client';
import { authKeys } from './auth-keys';

/**
 * POST /api/session. The answer carries a fresh CSRF token tied to the new session: either the
 * signed-in session, or (two-step sign-in on) a note that the code from the app comes next.
 */
export async function signIn(input: SignInInput): Promise<Session | SecondStepNeeded> {
  const answer = await apiClient.post<Session | SecondStepNeeded>('/api/session', input);
  setCsrfToken(answer.csrfToken);
  return answer;
}

/** POST /api/session/second-step: the code from the app, or one recovery code. */
export async function finishSignIn(input: SecondStepInput): Promise<Session> {
  const session = await apiClient.post<Session>('/api/session/second-step', input);
  setCsrfToken(session.csrfToken);
  return session;
}

export const needsSecondStep = (answer: Session | SecondStepNeeded): answer is SecondStepNeeded =>
  'twoFactorRequired' in answer;

function useSignedIn() {
  const queryClient = useQueryClient();
  return (session: Session) => {
    // Whatever was cached belonged to whoever was here before.
    queryClient.clear();
    queryClient.setQueryData(authKeys.session(), session);
  };
}

export function useSignIn() {
  const signedIn = useSignedIn();
  return useMutation({
    mutationFn: signIn,
    onSuccess: (answer) => {
      if (!needsSecondStep(answer)) signedIn(answer);
    },
  });
}

export function useFinishSignIn() {
  const signedIn = useSignedIn();
  return useMutation({ mutationFn: finishSignIn, onSuccess: signedIn });
}
