import { useForm, useWatch } from 'react-hook-form';
import type { CreateStudyBody, StudyFormOptions } from '@shared/schemas/studies';
import type { StudyDetail } from '@shared/schemas/study-detail';
import { Button } from '@/components/button';
import { FormAlert } from '@/components/form-alert';
import { SelectField } from '@/components/select-field';
import { TextField } from '@/components/text-field';
import { CustomSolventFields, NewCompoundField, StudyConditionsFields } from './study-form-parts';
import { compoundChoices, solventChoices, studySubmit } from './study-form-submit';
import { CUSTOM, initialValues, NEW, type StudyFormValues } from './study-form-values';

interface Props {
  options: StudyFormOptions | undefined;
  study?: StudyDetail;
  /** Values to start a new study with, e.g. from the planner or a scenario's missing pair. */
  preset?: Partial<StudyFormValues>;
  submitLabel: string;
  onSubmit: (body: CreateStudyBody) => Promise<unknown>;
}

/** Study settings: compounds (or new ones by name), solvent and conditions, tau0, corrections. Errors sit beside fields. */
export function StudyForm({ options, study, preset, submitLabel, onSubmit }: Props) {
  const {
    register,
    handleSubmit,
    control,
    setError,
    formState: { errors, isSubmitting },
  } = useForm<StudyFormValues>({
    defaultValues: { ...initialValues(study), ...preset },
  });
  const values = useWatch({ control }) as StudyFormValues;
  const compounds = options?.compounds ?? [];
  const lifetimes = (options?.lifetimes ?? []).filter((l) => l.compoundId === values.emitterId);
  const submit = studySubmit({ handleSubmit, setError }, options, onSubmit);
  const e = (key: keyof StudyFormValues) => errors[key]?.message;
  const fields = { register, errors };

  return (
    <form onSubmit={submit} noValidate className="grid grid-cols-1 gap-4 md:grid-cols-3">
      <TextField label="Title" className="md:col-span-3" error={e('title')} {...register('title')} />
      <SelectField
        label="Emitter"
        options={compoundChoices(compounds, 'photocatalyst')}
        error={e('emitterId')}
        {...register('emitterId')}
      />
      {values.emitterId === NEW ? <NewCompoundField {...fields} role="emitter" /> : <div />}
      <div className="hidden md:block" />
      <SelectField
        label="Quencher"
        options={compoundChoices(compounds, 'quencher')}
        error={e('quencherId')}
        {...register('quencherId')}
      />
      {values.quencherId === NEW ? <NewCompoundField {...fields} role="quencher" /> : <div />}
      <div className="hidden md:block" />
      <SelectField
        label="Solvent"
        error={e('solventId')}
        options={solventChoices(options)}
        {...register('solventId')}
      />
      {values.solventId === CUSTOM ? (
        <CustomSolventFields {...fields} />
      ) : (
        <TextField
          label="Viscosity override (mPa s)"
          hint="Leave empty to use the handbook η at the study temperature"
          error={e('customViscosityMilli')}
          {...register('customViscosityMilli')}
          className="md:col-span-2"
        />
      )}
      <StudyConditionsFields {...fields} values={values} lifetimes={lifetimes} />
      {errors.root?.server && (
        <div className="md:col-span-3">
          <FormAlert>{errors.root.server.message}</FormAlert>
        </div>
      )}
      <div className="md:col-span-3">
        <Button type="submit" pending={isSubmitting} pendingLabel="Saving…">
          {submitLabel}
        </Button>
      </div>
    </form>
  );
}
