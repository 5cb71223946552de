import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { useLocation, useNavigate, useSearchParams } from 'react-router-dom';
import { signInSchema } from '@shared/schemas/auth';
import { FormAlert } from '@/components/form-alert';
import { FormShell } from '@/components/form-shell';
import { TextField } from '@/components/text-field';
import { TextLink } from '@/components/text-link';
import { needsSecondStep, useSignIn } from '@/features/auth/api/sign-in';
import { SecondStepForm } from '@/features/auth/components/second-step-form';
import { showServerErrors } from '@/lib/form-errors';
import { safeReturnAddress } from './session-loaders';
import { paths } from '@/lib/paths';
import { PublicScreen } from './public-screen';
import { fieldsOf } from '@/lib/form-field';

/** A message another screen leaves for this one, e.g. after a new password was set. */
function noticeFrom(state: unknown): string | null {
  return typeof state === 'object' && state !== null && 'notice' in state && typeof state.notice === 'string'
    ? state.notice
    : null;
}

/** Sign in with e-mail and password, then back to where the person was going. */
export function SignInRoute() {
  const [params] = useSearchParams();
  const { state } = useLocation();
  const navigate = useNavigate();
  const signIn = useSignIn();
  const form = useForm({ resolver: zodResolver(signInSchema), defaultValues: { email: '', password: '' } });
  const { errors } = form.formState;
  const field = fieldsOf(form);
  const notice = noticeFrom(state);
  const [secondStep, setSecondStep] = useState(false);
  const goOn = () => navigate(safeReturnAddress(params.get('next')), { replace: true });

  const onSubmit = form.handleSubmit((values) =>
    signIn.mutate(values, {
      onSuccess: (answer) => (needsSecondStep(answer) ? setSecondStep(true) : goOn()),
      onError: (error) => showServerErrors(error, form.setError, ['email', 'password']),
    }),
  );

  if (secondStep) {
    return (
      <PublicScreen title="One more step" lead="Your password was right. Your account also asks for a code.">
        <SecondStepForm onSignedIn={goOn} />
      </PublicScreen>
    );
  }

  return (
    <PublicScreen
      title="Sign in"
      lead="Your lab's titrations and fits are waiting."
      footer={
        <>
          Forgot it? <TextLink to={paths.forgotPassword()}>Get a link to choose a new password</TextLink>
        </>
      }
    >
      {notice && <FormAlert tone="good">{notice}</FormAlert>}
      <FormShell
        onSubmit={onSubmit}
        problem={errors.root?.server?.message}
        submitLabel="Sign in"
        pendingLabel="Signing in…"
        pending={signIn.isPending}
        wide
      >
        <TextField label="E-mail" type="email" autoComplete="username" {...field('email')} />
        <TextField label="Password" type="password" autoComplete="current-password" {...field('password')} />
      </FormShell>
    </PublicScreen>
  );
}
