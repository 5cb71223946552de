import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { Button } from '@/components/button';
import { FormAlert } from '@/components/form-alert';
import { TextField } from '@/components/text-field';
import { showServerErrors } from '@/lib/form-errors';
import { fieldsOf } from '@/lib/form-field';
import { AppCodeField } from './app-code-field';
import { useFinishSignIn } from '../api/sign-in';

/** The second step of a sign-in: the 6-digit code from the app, or, without the phone, a recovery code. */
export function SecondStepForm({ onSignedIn }: { onSignedIn: () => void }) {
  const [useRecovery, setUseRecovery] = useState(false);
  const finish = useFinishSignIn();
  const form = useForm({ defaultValues: { code: '', recoveryCode: '' } });
  const { errors } = form.formState;
  const field = fieldsOf(form);

  const onSubmit = form.handleSubmit((values) =>
    finish.mutate(useRecovery ? { recoveryCode: values.recoveryCode.trim() } : { code: values.code.trim() }, {
      onSuccess: onSignedIn,
      onError: (error) => showServerErrors(error, form.setError, ['code', 'recoveryCode']),
    }),
  );

  return (
    <form onSubmit={onSubmit} noValidate className="space-y-4">
      <p className="text-body text-ink-700">
        {useRecovery
          ? 'Type one of the recovery codes you kept when you turned on two-step sign-in. Each works once.'
          : 'Open the authenticator app on your phone and type the 6-digit code it shows for Halflight.'}
      </p>
      {useRecovery ? (
        <TextField key="recovery" label="Recovery code" autoComplete="off" {...field('recoveryCode')} />
      ) : (
        <AppCodeField key="code" {...field('code')} />
      )}
      {errors.root?.server && <FormAlert>{errors.root.server.message}</FormAlert>}
      <Button type="submit" className="w-full" pending={finish.isPending} pendingLabel="Checking…">
        Continue
      </Button>
      <Button variant="quiet" className="w-full" onClick={() => setUseRecovery(!useRecovery)}>
        {useRecovery ? 'Use the code from my app instead' : 'I do not have my phone'}
      </Button>
    </form>
  );
}
