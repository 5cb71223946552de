import { lazy, Suspense, useEffect, useRef, useState } from 'react';
import type { FormEvent } from 'react';
import { useLocation, useNavigate, useSearchParams } from 'react-router-dom';
import { FormAlert } from '@/components/form-alert';
import { FormShell } from '@/components/form-shell';
import { TextField } from '@/components/text-field';
import { TextLink } from '@/components/text-link';
import { needsSecondStep, useSignIn } from '@/features/auth/api/sign-in';
import { checkWithSchema } from '@/lib/check-with-schema';
import { serverFieldErrors } from '@/lib/form-errors';
import { focusHeading, whenHeadingAppears } from '@/lib/screen-heading';
import { safeReturnAddress } from './session-loaders';
import { paths } from '@/lib/paths';
import { PublicScreen } from './public-screen';

/** A message another screen leaves for this one, e.g. after a new password was set. */
function noticeFrom(state: unknown): string | null {
  return typeof state === 'object' && state !== null && 'notice' in state && typeof state.notice === 'string'
    ? state.notice
    : null;
}

const fields = ['email', 'password'] as const;
type Field = (typeof fields)[number];
type Problems = Partial<Record<Field | 'form', string>>;

// The shared schema arrives with the first check, not with the screen: the first load stays small.
const loadSignInSchema = () => import('@shared/schemas/auth').then((module) => module.signInSchema);
// Only accounts with two-step sign-in see the code form: it (and its form library) loads when asked for.
const SecondStepForm = lazy(() =>
  import('@/features/auth/components/second-step-form').then((module) => ({ default: module.SecondStepForm })),
);

/**
 * Sign in with e-mail and password, then back to where the person was going. The one form without
 * react-hook-form: two fields, checked with the shared schema, so the first screen of every visit
 * loads neither the form library nor the schema library.
 */
export function SignInRoute() {
  const [params] = useSearchParams();
  const { state } = useLocation();
  const navigate = useNavigate();
  const signIn = useSignIn();
  const [problems, setProblems] = useState<Problems>({});
  const fieldsArea = useRef<HTMLDivElement>(null);
  const notice = noticeFrom(state);
  const [secondStep, setSecondStep] = useState(false);
  const goOn = () => void navigate(safeReturnAddress(params.get('next')), { replace: true });

  // The address stays the same for the code step: move focus to its heading here.
  useEffect(() => (secondStep ? whenHeadingAppears(focusHeading) : undefined), [secondStep]);

  function show(found: Problems) {
    setProblems(found);
    const first = fields.find((field) => found[field]);
    const input = first ? fieldsArea.current?.querySelector<HTMLElement>(`[name="${first}"]`) : null;
    input?.focus();
  }

  async function onSubmit(event: FormEvent<HTMLFormElement>) {
    event.preventDefault();
    const data = new FormData(event.currentTarget);
    const checked = await checkWithSchema(loadSignInSchema, {
      email: String(data.get('email') ?? ''),
      password: String(data.get('password') ?? ''),
    });
    if (!checked.ok) return show(checked.errors);
    setProblems({});
    signIn.mutate(checked.data, {
      onSuccess: (answer) => (needsSecondStep(answer) ? setSecondStep(true) : goOn()),
      onError: (error) => {
        const sorted = serverFieldErrors(error, fields);
        show({ ...sorted.fields, ...(sorted.form ? { form: sorted.form } : {}) });
      },
    });
  }

  if (secondStep) {
    return (
      <PublicScreen title="One more step" lead="Your password was right. Your account also asks for a code.">
        <Suspense fallback={<p className="text-body text-ink-700">Opening the code form…</p>}>
          <SecondStepForm onSignedIn={goOn} />
        </Suspense>
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
        onSubmit={(event) => void onSubmit(event)}
        problem={problems.form}
        submitLabel="Sign in"
        pendingLabel="Signing in…"
        pending={signIn.isPending}
        wide
      >
        <div ref={fieldsArea} className="space-y-4">
          <TextField label="E-mail" name="email" type="email" autoComplete="username" error={problems.email} />
          <TextField
            label="Password"
            name="password"
            type="password"
            autoComplete="current-password"
            error={problems.password}
          />
        </div>
      </FormShell>
    </PublicScreen>
  );
}
