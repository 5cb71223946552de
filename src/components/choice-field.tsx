import type { ComponentPropsWithRef } from 'react';
import { SelectField } from './select-field';

interface ChoiceFieldProps<T extends string> extends Omit<
  ComponentPropsWithRef<'select'>,
  'id' | 'value' | 'onChange'
> {
  label: string;
  value: T;
  /** the values offered, each with what the person reads */
  choices: readonly { value: T; label: string }[];
  onChange: (value: T) => void;
  error?: string;
  hideLabel?: boolean;
}

/**
 * A SelectField over a fixed list of typed values (a model, a weighting, a unit): it hands back
 * the chosen value as its own type, found in `choices`, so no caller casts the select's text.
 */
export function ChoiceField<T extends string>({ value, choices, onChange, ...field }: ChoiceFieldProps<T>) {
  return (
    <SelectField
      {...field}
      value={value}
      options={choices}
      onChange={(event) => {
        const chosen = choices.find((choice) => choice.value === event.target.value);
        if (chosen) onChange(chosen.value);
      }}
    />
  );
}
