import { useId } from 'react';
import type { ComponentPropsWithRef } from 'react';
import { fieldMessage } from './field-message';

interface TextFieldProps extends Omit<ComponentPropsWithRef<'input'>, 'id'> {
  label: string;
  error?: string;
  hint?: string;
}

/** A labelled input with its hint and its error right beneath it. */
export function TextField({ label, error, hint, className = '', ...input }: TextFieldProps) {
  const id = useId();
  const describedBy = [hint && `${id}-hint`, error && `${id}-error`].filter(Boolean).join(' ') || undefined;
  return (
    <div className={`flex flex-col gap-1 ${className}`}>
      <label htmlFor={id} className="text-body font-bold text-ink-900">
        {label}
      </label>
      <input
        id={id}
        aria-invalid={error ? true : undefined}
        aria-describedby={describedBy}
        className={`rounded-md border bg-white px-3 py-2 text-body text-ink-950 placeholder:text-ink-300 ${
          error ? 'border-brick-500' : 'border-paper-300 hover:border-ink-300'
        }`}
        {...input}
      />
      {hint && (
        <p id={`${id}-hint`} className="text-caption text-ink-500">
          {hint}
        </p>
      )}
      {error && (
        <p id={`${id}-error`} className="text-caption font-bold text-brick-700">
          {fieldMessage(label, error)}
        </p>
      )}
    </div>
  );
}
