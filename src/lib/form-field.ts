import { get } from 'react-hook-form';
import type { FieldError, FieldPath, FieldValues, FormState, RegisterOptions, UseFormRegister } from 'react-hook-form';

/**
 * Ties a TextField or SelectField to one react-hook-form field: its registration and the message
 * to show beside it. `const field = fieldsOf(form)`, then `<TextField label="E-mail" {...field('email')} />`.
 */
export function fieldsOf<T extends FieldValues>(form: {
  register: UseFormRegister<T>;
  formState: FormState<NoInfer<T>>;
}) {
  const { errors } = form.formState;
  return <N extends FieldPath<T>>(name: N, options?: RegisterOptions<T, N>) => ({
    ...form.register(name, options),
    error: (get(errors, name) as FieldError | undefined)?.message,
  });
}
