import { useState } from 'react';
import { useForm } from 'react-hook-form';
import type { Session } from '@shared/schemas/auth';
import type { TwoFactorSetup } from '@shared/schemas/two-factor';
import { Button } from '@/components/button';
import { FormAlert } from '@/components/form-alert';
import { FormShell } from '@/components/form-shell';
import { Signal } from '@/components/signal';
import { TextField } from '@/components/text-field';
import { showServerErrors } from '@/lib/form-errors';
import { fieldsOf } from '@/lib/form-field';
import { formSubmission } from '@/lib/form-submission';
import { AppCodeField } from './app-code-field';
import { useConfirmTwoFactor, useDisableTwoFactor, useRenewRecoveryCodes, useStartTwoFactor } from '../api/two-factor';

/** Two-step sign-in on the account screen: turn it on with an authenticator app, renew codes, turn it off. */
export function TwoFactorPanel({ session }: { session: Session }) {
  const [codes, setCodes] = useState<string[] | null>(null);
  const requiring = session.user.labs.filter(
    (lab) => lab.requireTwoFactor && (lab.role === 'admin' || lab.role === 'reviewer'),
  );
  return (
    <div className="space-y-4">
      <p className="flex items-center gap-2 text-body text-ink-800">
        {session.twoFactor.enabled ? (
          <Signal tone="good">On</Signal>
        ) : (
          <Signal tone={requiring.length ? 'bad' : 'waiting'}>Off</Signal>
        )}
        {session.twoFactor.enabled
          ? `Signing in asks for a code from your phone. ${session.twoFactor.recoveryCodesLeft} recovery codes left.`
          : 'Signing in asks only for your password.'}
      </p>
      {requiring.length > 0 && !session.twoFactor.enabled && (
        <FormAlert tone="note">
          {requiring.map((lab) => lab.labName).join(', ')} require two-step sign-in of admins and reviewers: turn it on
          to keep working there.
        </FormAlert>
      )}
      {codes && <RecoveryCodeList codes={codes} onDone={() => setCodes(null)} />}
      {!codes &&
        (session.twoFactor.enabled ? <ManageTwoFactor onCodes={setCodes} /> : <TurnOnTwoFactor onCodes={setCodes} />)}
    </div>
  );
}

function RecoveryCodeList({ codes, onDone }: { codes: string[]; onDone: () => void }) {
  return (
    <div className="space-y-3 rounded-md border border-glow-300 bg-glow-50 p-4">
      <p className="text-body font-bold text-ink-900">Your recovery codes (shown only now)</p>
      <p className="text-body text-ink-700">
        Keep them somewhere safe, away from your phone. Each one signs you in once if the phone is lost.
      </p>
      <ol aria-label="Recovery codes" className="grid grid-cols-2 gap-2 font-mono text-body text-ink-950">
        {codes.map((code) => (
          <li key={code}>{code}</li>
        ))}
      </ol>
      <Button variant="quiet" onClick={onDone}>
        I have kept them
      </Button>
    </div>
  );
}

function TurnOnTwoFactor({ onCodes }: { onCodes: (codes: string[]) => void }) {
  const start = useStartTwoFactor();
  const confirm = useConfirmTwoFactor();
  const [setup, setSetup] = useState<TwoFactorSetup | null>(null);
  const form = useForm({ defaultValues: { code: '' } });

  if (!setup) {
    return (
      <div className="space-y-2">
        {start.isError && <FormAlert>{start.error.message}</FormAlert>}
        <Button
          pending={start.isPending}
          pendingLabel="Preparing…"
          onClick={() => start.mutate(undefined, { onSuccess: setSetup })}
        >
          Turn on two-step sign-in
        </Button>
      </div>
    );
  }
  const submit = formSubmission(form, ['code'], confirm.isPending, ({ code }, onError) =>
    confirm.mutate(code.trim(), { onSuccess: (answer) => onCodes(answer.recoveryCodes), onError }),
  );
  return (
    <FormShell {...submit} submitLabel="Confirm and turn on" pendingLabel="Checking…">
      <p className="text-body text-ink-700">
        Scan this with an authenticator app on your phone (any app for time-based codes), or type the key by hand. Then
        enter the 6-digit code it shows.
      </p>
      <div className="flex flex-wrap items-center gap-4">
        <img src={setup.qrCode} alt="QR code holding your new sign-in key" className="h-44 w-44 rounded-md" />
        <p className="text-caption text-ink-600">
          Key: <span className="break-all font-mono text-body text-ink-950">{setup.secret}</span>
        </p>
      </div>
      <AppCodeField {...fieldsOf(form)('code')} />
    </FormShell>
  );
}

function ManageTwoFactor({ onCodes }: { onCodes: (codes: string[]) => void }) {
  const renew = useRenewRecoveryCodes();
  const disable = useDisableTwoFactor();
  const form = useForm({ defaultValues: { password: '' } });
  const { errors } = form.formState;
  const run = (action: 'renew' | 'disable') =>
    form.handleSubmit(({ password }) => {
      const onError = (error: Error) => showServerErrors(error, form.setError, ['password']);
      if (action === 'renew') renew.mutate(password, { onSuccess: (answer) => onCodes(answer.recoveryCodes), onError });
      else disable.mutate(password, { onSuccess: () => form.reset(), onError });
    });
  return (
    <form noValidate className="space-y-4" onSubmit={(event) => event.preventDefault()}>
      <TextField
        label="Your password, to confirm"
        type="password"
        autoComplete="current-password"
        {...fieldsOf(form)('password')}
      />
      {errors.root?.server && <FormAlert>{errors.root.server.message}</FormAlert>}
      <div className="flex flex-wrap gap-3">
        <Button variant="quiet" pending={renew.isPending} pendingLabel="Making codes…" onClick={run('renew')}>
          New recovery codes
        </Button>
        <Button variant="danger" pending={disable.isPending} pendingLabel="Turning off…" onClick={run('disable')}>
          Turn off two-step sign-in
        </Button>
      </div>
    </form>
  );
}
