import { useFieldArray, useForm, useWatch } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import type { Scenario } from '@shared/schemas/scenarios';
import { Button } from '@/components/button';
import { FormAlert } from '@/components/form-alert';
import { SelectField } from '@/components/select-field';
import { TextField } from '@/components/text-field';
import { ComponentRow } from './component-row';
import { emptyComponent, scenarioFormSchema, toScenarioForm } from './scenario-form-schema';
import type { ScenarioFormValues } from './scenario-form-schema';
import { fieldsOf } from '@/lib/form-field';

interface ScenarioFormProps {
  scenario?: Scenario;
  emitterOptions: readonly { value: string; label: string }[];
  quencherOptions: readonly { value: string; label: string }[];
  solventOptions: readonly { value: string; label: string }[];
  onSave: (values: ScenarioFormValues) => void;
  pending: boolean;
  serverError?: string;
}

const blank: ScenarioFormValues = {
  name: '',
  emitterId: '',
  solvent: 'acetonitrile',
  tau0Nanoseconds: '',
  tau0Source: '',
  notes: '',
  components: [{ ...emptyComponent }],
};

/** The reaction as run: catalyst, solvent, its unquenched lifetime, and every component at its concentration. */
export function ScenarioForm(props: ScenarioFormProps) {
  const { register, control, handleSubmit, formState } = useForm<ScenarioFormValues>({
    resolver: zodResolver(scenarioFormSchema),
    defaultValues: props.scenario ? toScenarioForm(props.scenario) : blank,
  });
  const { fields, append, remove } = useFieldArray({ control, name: 'components' });
  const errors = formState.errors;
  const field = fieldsOf({ register, formState });
  const kinds = useWatch({ control, name: 'components' }).map((row) => row.kind);
  return (
    <form onSubmit={handleSubmit(props.onSave)} noValidate className="space-y-4" aria-label="Reaction scenario">
      <div className="grid grid-cols-2 gap-3">
        <TextField label="Name" {...field('name')} />
        <SelectField
          label="Emitter (catalyst)"
          options={[{ value: '', label: 'Choose…' }, ...props.emitterOptions]}
          {...field('emitterId')}
        />
        <SelectField label="Solvent" options={props.solventOptions} {...field('solvent')} />
        <div className="grid grid-cols-2 gap-3">
          <TextField label="τ0 (ns)" inputMode="decimal" {...field('tau0Nanoseconds')} />
          <TextField label="τ0 from" hint="Lifetime record, paper or notebook page" {...register('tau0Source')} />
        </div>
      </div>
      <div className="space-y-3">
        <h3 className="text-body font-black text-ink-900">Components at reaction conditions</h3>
        {fields.map((field, index) => (
          <ComponentRow
            key={field.id}
            index={index}
            kind={kinds[index] ?? 'compound'}
            register={register}
            errors={errors}
            quencherOptions={props.quencherOptions}
            share={props.scenario?.shares[index]}
            onRemove={() => remove(index)}
          />
        ))}
        {errors.components?.root?.message && <FormAlert>{errors.components.root.message}</FormAlert>}
        <div className="flex gap-2">
          <Button variant="quiet" onClick={() => append({ ...emptyComponent })}>
            Add a component
          </Button>
          <Button variant="quiet" onClick={() => append({ ...emptyComponent, kind: 'oxygen' })}>
            Add dissolved O₂
          </Button>
        </div>
      </div>
      <TextField label="Notes" {...register('notes')} />
      {props.serverError && <FormAlert>{props.serverError}</FormAlert>}
      <Button type="submit" pending={props.pending} pendingLabel="Saving…">
        Save and estimate
      </Button>
    </form>
  );
}
