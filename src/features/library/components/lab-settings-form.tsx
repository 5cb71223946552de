import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { labSettingsUpdateSchema } from '@shared/schemas/lab-settings';
import type { LabSettings } from '@shared/schemas/library-views';
import { Button } from '@/components/button';
import { FormAlert } from '@/components/form-alert';
import { SelectField } from '@/components/select-field';
import { showServerErrors } from '@/lib/form-errors';
import { useUpdateLabSettings } from '../api/update-lab-settings';
import { referenceOptions, solventOptions } from './library-format';
import { fieldsOf } from '@/lib/form-field';

/** Admins choose the reference in which every potential of the lab is read; stored values never change. */
export function LabSettingsForm({ labId, settings }: { labId: string; settings: LabSettings }) {
  const update = useUpdateLabSettings(labId);
  const form = useForm({ resolver: zodResolver(labSettingsUpdateSchema), defaultValues: settings });
  const { errors } = form.formState;
  const field = fieldsOf(form);
  const onSubmit = form.handleSubmit((values) =>
    update.mutate(values, {
      onError: (error) => showServerErrors(error, form.setError, ['displayReference', 'displaySolvent']),
    }),
  );
  return (
    <form onSubmit={onSubmit} noValidate aria-label="Display reference" className="grid max-w-xl gap-3 sm:grid-cols-2">
      <SelectField label="Display reference electrode" options={referenceOptions} {...field('displayReference')} />
      <SelectField label="Usual solvent" options={solventOptions} {...field('displaySolvent')} />
      <div className="space-y-2 sm:col-span-2">
        {errors.root?.server && <FormAlert>{errors.root.server.message}</FormAlert>}
        {update.isSuccess && (
          <FormAlert tone="good">Saved. Potentials are now read against {update.data.displayReference}.</FormAlert>
        )}
        <Button type="submit" pending={update.isPending} pendingLabel="Saving…">
          Save settings
        </Button>
      </div>
    </form>
  );
}
