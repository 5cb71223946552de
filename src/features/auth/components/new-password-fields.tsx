import type { UseFormRegisterReturn } from 'react-hook-form';
import { TextField } from '@/components/text-field';

interface NewPasswordFieldsProps {
  password: UseFormRegisterReturn;
  confirm: UseFormRegisterReturn;
  errors: { password?: string; confirm?: string };
  /** "New password" when changing one, "Password" when making an account. */
  label?: string;
  hint?: string;
}

/** A new password typed twice; the form's schema checks that both entries match (see sameTwice). */
export function NewPasswordFields({ password, confirm, errors, label = 'New password', hint }: NewPasswordFieldsProps) {
  return (
    <>
      <TextField
        label={label}
        type="password"
        autoComplete="new-password"
        hint={hint}
        error={errors.password}
        {...password}
      />
      <TextField
        label={`${label}, once more`}
        type="password"
        autoComplete="new-password"
        error={errors.confirm}
        {...confirm}
      />
    </>
  );
}
