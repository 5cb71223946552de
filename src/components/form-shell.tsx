import type { FormEventHandler, ReactNode } from 'react';
import { Button } from './button';
import { FormAlert } from './form-alert';

interface FormShellProps {
  onSubmit: FormEventHandler<HTMLFormElement>;
  children: ReactNode;
  /** The server's refusal that belongs to no single field (react-hook-form's `errors.root.server`). */
  problem?: ReactNode;
  /** Said once the form has done its work. */
  done?: ReactNode;
  submitLabel: string;
  pendingLabel: string;
  pending: boolean;
  disabled?: boolean;
  /** The submit button spans the form (the narrow sign-in card) instead of sitting at its start. */
  wide?: boolean;
  'aria-label'?: string;
}

/** The frame every stacked form shares: its fields, the server's message, the outcome, one submit button. */
export function FormShell({
  onSubmit,
  children,
  problem,
  done,
  submitLabel,
  pendingLabel,
  pending,
  disabled,
  wide = false,
  'aria-label': label,
}: FormShellProps) {
  return (
    <form onSubmit={onSubmit} noValidate aria-label={label} className="space-y-4">
      {children}
      {problem && <FormAlert>{problem}</FormAlert>}
      {done && <FormAlert tone="good">{done}</FormAlert>}
      <Button
        type="submit"
        className={wide ? 'w-full' : undefined}
        pending={pending}
        pendingLabel={pendingLabel}
        disabled={disabled}
      >
        {submitLabel}
      </Button>
    </form>
  );
}
