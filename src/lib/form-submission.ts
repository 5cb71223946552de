import type { FieldValues, FormState, Path, UseFormHandleSubmit, UseFormSetError } from 'react-hook-form';
import { showServerErrors } from './form-errors';

/**
 * What a `FormShell` needs to send a react-hook-form form through one mutation: the submit handler
 * (the form's schema checks the values first), the server's refusal that belongs to no single field,
 * and whether the request is on its way. `send` starts the mutation with the checked values and
 * passes it `onError`, which puts each 400 detail that names one of `fields` beside that field.
 *
 *   const submit = formSubmission(form, ['email'], reset.isPending, (values, onError) =>
 *     reset.mutate(values, { onError }));
 *   <FormShell {...submit} submitLabel="Send me a link" pendingLabel="Sending…">…</FormShell>
 */
export function formSubmission<T extends FieldValues, Checked>(
  form: { handleSubmit: UseFormHandleSubmit<T, Checked>; setError: UseFormSetError<T>; formState: FormState<T> },
  fields: readonly Path<T>[],
  pending: boolean,
  send: (values: Checked, onError: (error: unknown) => void) => void,
) {
  const onError = (error: unknown) => showServerErrors(error, form.setError, fields);
  return {
    onSubmit: form.handleSubmit((values) => send(values, onError)),
    problem: form.formState.errors.root?.server?.message,
    pending,
  };
}
