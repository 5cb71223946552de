import { useId } from 'react';
import type { ComponentPropsWithRef } from 'react';
import { fieldMessage } from './field-message';

interface SelectFieldProps extends Omit<ComponentPropsWithRef<'select'>, 'id'> {
  label: string;
  options: readonly { value: string; label: string }[];
  error?: string;
  /** Keep the label for screen readers only, e.g. inside a table row. */
  hideLabel?: boolean;
}

/** A labelled drop-down with its error beneath it. */
export function SelectField({ label, options, error, hideLabel = false, className = '', ...select }: SelectFieldProps) {
  const id = useId();
  return (
    <div className={`flex flex-col gap-1 ${className}`}>
      <label htmlFor={id} className={hideLabel ? 'sr-only' : 'text-body font-bold text-ink-900'}>
        {label}
      </label>
      <select
        id={id}
        aria-invalid={error ? true : undefined}
        aria-describedby={error ? `${id}-error` : undefined}
        className="rounded-md border border-paper-300 bg-white px-2.5 py-1.5 text-body text-ink-950 hover:border-ink-300 disabled:opacity-60"
        {...select}
      >
        {options.map((option) => (
          <option key={option.value} value={option.value}>
            {option.label}
          </option>
        ))}
      </select>
      {error && (
        <p id={`${id}-error`} className="text-caption font-bold text-brick-700">
          {fieldMessage(label, error)}
        </p>
      )}
    </div>
  );
}
