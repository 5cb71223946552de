import { useState } from 'react';
import type { ReactNode } from 'react';
import { useForm, useWatch } from 'react-hook-form';
import type { DefaultValues, FieldValues, Path, Resolver } from 'react-hook-form';
import { Button } from '@/components/button';
import { FormAlert } from '@/components/form-alert';
import { SelectField } from '@/components/select-field';
import { TextField } from '@/components/text-field';
import { ApiError } from '@/lib/api-client';
import { fieldsOf } from '@/lib/form-field';
import { showServerErrors } from '@/lib/form-errors';
import { toNumber } from './form-number';

/** One input of a measurement form: what it holds, how it is labelled, and how it is typed in. */
export type MeasurementField<V extends FieldValues> = {
  name: Path<V>;
  label: string;
  className?: string;
  placeholder?: string;
  /** A line under the input computed from what is typed so far (e.g. E00 from a wavelength). */
  hint?: (values: Partial<V>) => string | undefined;
} & ({ input: 'number' | 'text' } | { input: 'select'; options: readonly { value: string; label: string }[] });

/**
 * What differs between the library's measurement forms (potentials, lifetimes, E00): the fields,
 * the zod schema from shared/ they are checked with, and how form values become the API's body.
 */
export interface MeasurementFormSpec<V extends FieldValues, Body> {
  /** The form's accessible name when it adds and when it edits. */
  names: { add: string; edit: string };
  submitLabel: string;
  columns: 3 | 4;
  resolver: Resolver<V>;
  fields: readonly MeasurementField<V>[];
  toBody: (values: V) => Body;
  /** The API names fields in SI units (body.value); the form shows them as typed (amount). */
  serverPaths?: Record<string, Path<V>>;
  /** Fields emptied after an addition, so the next value can be typed over the same conditions. */
  clearAfterAdd: readonly Path<V>[];
  /** Said once an addition is saved. */
  savedNote?: string;
}

interface MeasurementFormProps<V extends FieldValues, Body> {
  spec: MeasurementFormSpec<V, Body>;
  defaultValues: DefaultValues<V>;
  editing: boolean;
  pending: boolean;
  /** Saves the body (adding or updating); rejects with the server's error. */
  save: (body: Body) => Promise<unknown>;
  onSaved?: () => void;
  onCancel?: () => void;
}

/** One form for every library measurement, built from its field description. */
export function MeasurementForm<V extends FieldValues, Body>({
  spec,
  defaultValues,
  editing,
  pending,
  save,
  onSaved,
  onCancel,
}: MeasurementFormProps<V, Body>) {
  const form = useForm<V>({ resolver: spec.resolver, defaultValues });
  const { errors } = form.formState;
  const bind = fieldsOf(form);
  const typed = useWatch({ control: form.control }) as Partial<V>;
  const [savedNote, setSavedNote] = useState<ReactNode>(null);

  function placeServerErrors(error: unknown) {
    const renamed =
      error instanceof ApiError && spec.serverPaths
        ? new ApiError(
            error.status,
            error.code,
            error.message,
            error.details.map((detail) => {
              const field = spec.serverPaths?.[detail.path.replace(/^body\./, '')];
              return field ? { ...detail, path: `body.${field}` } : detail;
            }),
          )
        : error;
    showServerErrors(
      renamed,
      form.setError,
      spec.fields.map((field) => field.name),
    );
  }

  const onSubmit = form.handleSubmit(async (values) => {
    setSavedNote(null);
    try {
      await save(spec.toBody(values));
    } catch (error) {
      placeServerErrors(error);
      return;
    }
    if (editing) return onSaved?.();
    // An empty string clears an input; the schema then asks for a value again.
    const cleared = Object.fromEntries(spec.clearAfterAdd.map((name) => [name, '']));
    form.reset({ ...form.getValues(), ...cleared });
    setSavedNote(spec.savedNote ?? null);
    onSaved?.();
  });

  return (
    <form
      onSubmit={onSubmit}
      noValidate
      aria-label={editing ? spec.names.edit : spec.names.add}
      className={`grid gap-3 ${spec.columns === 3 ? 'sm:grid-cols-3' : 'sm:grid-cols-4'}`}
    >
      {spec.fields.map((field) => {
        const common = { label: field.label, className: field.className };
        return field.input === 'select' ? (
          <SelectField key={field.name} {...common} options={field.options} {...bind(field.name)} />
        ) : (
          <TextField
            key={field.name}
            {...common}
            placeholder={field.placeholder}
            inputMode={field.input === 'number' ? 'decimal' : undefined}
            hint={field.hint?.(typed)}
            {...bind(field.name, field.input === 'number' ? { setValueAs: toNumber } : undefined)}
          />
        );
      })}
      <div className={`space-y-2 ${spec.columns === 3 ? 'sm:col-span-3' : 'sm:col-span-4'}`}>
        {errors.root?.server && <FormAlert>{errors.root.server.message}</FormAlert>}
        {savedNote && !errors.root && <FormAlert tone="good">{savedNote}</FormAlert>}
        <div className="flex gap-2">
          <Button type="submit" pending={pending} pendingLabel="Saving…">
            {editing ? 'Save changes' : spec.submitLabel}
          </Button>
          {editing && (
            <Button type="button" variant="quiet" onClick={onCancel}>
              Cancel
            </Button>
          )}
        </div>
      </div>
    </form>
  );
}
