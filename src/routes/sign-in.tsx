import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { useLocation, useNavigate, useSearchParams } from 'react-router-dom';
import { signInSchema } from '@shared/schemas/auth';
import { Button } from '@/components/button';
import { FormAlert } from '@/components/form-alert';
import { TextField } from '@/components/text-field';
import { TextLink } from '@/components/text-link';
import { needsSecondStep, useSignIn } from '@/features/auth/api/sign-in';
import { SecondStepForm } from '@/features/auth/components/second-step-form';
import { showServerErrors } from '@/lib/form-errors';
import { safeReturnAddress } from './session-loaders';
import { paths } from '@/lib/paths';

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
      <div className="space-y-5">
        <header>
          <h1 className="text-title font-black text-ink-950">One more step</h1>
          <p className="text-body text-ink-700">Your password was right. Your account also asks for a code.</p>
        </header>
        <SecondStepForm onSignedIn={goOn} />
      </div>
    );
  }

  return (
    <div className="space-y-5">
      <header>
        <h1 className="text-title font-black text-ink-950">Sign in</h1>
        <p className="text-body text-ink-700">Your lab&apos;s titrations and fits are waiting.</p>
      </header>
      {notice && <FormAlert tone="good">{notice}</FormAlert>}
      <form onSubmit={onSubmit} noValidate className="space-y-4">
        <TextField
          label="E-mail"
          type="email"
          autoComplete="username"
          error={errors.email?.message}
          {...form.register('email')}
        />
        <TextField
          label="Password"
          type="password"
          autoComplete="current-password"
          error={errors.password?.message}
          {...form.register('password')}
        />
        {errors.root?.server && <FormAlert>{errors.root.server.message}</FormAlert>}
        <Button type="submit" className="w-full" pending={signIn.isPending} pendingLabel="Signing in…">
          Sign in
        </Button>
      </form>
      <p className="text-body text-ink-700">
        Forgot it? <TextLink to={paths.forgotPassword()}>Get a link to choose a new password</TextLink>
      </p>
    </div>
  );
}
