import { useForm, useWatch } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { Button } from '@/components/button';
import { FormAlert } from '@/components/form-alert';
import { TextField } from '@/components/text-field';
import { plannerFormSchema } from './planner-form-schema';
import { plannerDefaults } from './planner-form-schema';
import type { PlannerFormInput, PlannerFormValues } from './planner-form-schema';
import { fieldsOf } from '@/lib/form-field';

interface PlannerFormProps {
  onPlan: (values: PlannerFormValues) => void;
  pending: boolean;
  serverError?: string;
}

/** The starting point of a titration, in the units people pipette with. */
export function PlannerForm({ onPlan, pending, serverError }: PlannerFormProps) {
  const { register, handleSubmit, control, formState } = useForm<PlannerFormInput, unknown, PlannerFormValues>({
    resolver: zodResolver(plannerFormSchema),
    defaultValues: plannerDefaults,
  });
  const field = fieldsOf({ register, formState });
  const mode = useWatch({ control, name: 'mode' });
  return (
    <form onSubmit={handleSubmit(onPlan)} noValidate className="space-y-4" aria-label="Titration to plan">
      <div className="grid grid-cols-3 gap-3">
        <TextField label="Starting volume (mL)" inputMode="decimal" {...field('initialVolumeMl')} />
        <TextField label="Emitter (µM)" inputMode="decimal" {...field('emitterMicromolar')} />
        <TextField label="Quencher stock (mM)" inputMode="decimal" {...field('stockMillimolar')} />
      </div>
      <fieldset className="space-y-2">
        <legend className="text-body font-bold text-ink-900">Concentrations to reach</legend>
        <label className="mr-6 inline-flex items-center gap-2 text-body">
          <input type="radio" value="even" {...register('mode')} /> Evenly spaced
        </label>
        <label className="inline-flex items-center gap-2 text-body">
          <input type="radio" value="targets" {...register('mode')} /> My own list
        </label>
        {mode === 'even' ? (
          <div className="grid grid-cols-2 gap-3">
            <TextField label="Highest [Q] (mM)" inputMode="decimal" {...field('maximumMillimolar')} />
            <TextField label="Number of additions" inputMode="numeric" {...field('count')} />
          </div>
        ) : (
          <TextField
            label="Target [Q] values (mM)"
            hint="Separate with spaces, semicolons or new lines, lowest first."
            {...field('targetsMillimolar')}
          />
        )}
      </fieldset>
      <div className="grid grid-cols-2 gap-3">
        <TextField
          label="Pipette step (µL, optional)"
          inputMode="decimal"
          hint="Round each volume to what you can pipette."
          {...field('pipetteStepMicrolitres')}
        />
        <TextField label="Quencher name (optional)" {...field('quencherName')} />
      </div>
      <label className="flex items-center gap-2 text-body text-ink-900">
        <input type="checkbox" {...register('stockContainsEmitter')} /> The stock also holds the emitter at the starting
        concentration
      </label>
      {serverError && <FormAlert>{serverError}</FormAlert>}
      <Button type="submit" pending={pending} pendingLabel="Working it out…">
        Work out the additions
      </Button>
    </form>
  );
}
