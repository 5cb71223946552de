import { useForm, useWatch } from 'react-hook-form';
import {
  createStudySchema,
  degassingMethods,
  studyAtmospheres,
  type CreateStudyBody,
  type StudyFormOptions,
} from '@shared/schemas/studies';
import type { StudyDetail } from '@shared/schemas/study-detail';
import { Button } from '@/components/button';
import { FormAlert } from '@/components/form-alert';
import { SelectField } from '@/components/select-field';
import { TextField } from '@/components/text-field';
import { ApiError } from '@/lib/api-client';
import { describeError } from '@/lib/form-errors';
import { CUSTOM, fieldOfPath, initialValues, NEW, toBody, type StudyFormValues } from './study-form-values';

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
  const pick = (role: 'photocatalyst' | 'quencher') => [
    { value: '', label: '— pick —' },
    ...compounds
      .filter((c) => c.roleHint === role || c.roleHint === 'both')
      .map((c) => ({ value: c.id, label: c.name })),
    ...compounds
      .filter((c) => c.roleHint !== role && c.roleHint !== 'both')
      .map((c) => ({ value: c.id, label: `${c.name} (listed as ${c.roleHint})` })),
    { value: NEW, label: '+ a new compound…' },
  ];
  const lifetimes = (options?.lifetimes ?? []).filter((l) => l.compoundId === values.emitterId);

  const place = (issues: Array<{ path: string; message: string }>) => {
    let placed = false;
    for (const issue of issues) {
      const field = fieldOfPath[issue.path.replace(/^body\./, '')];
      if (field) {
        setError(field, { message: issue.message });
        placed = true;
      }
    }
    if (!placed)
      setError('root.server', { message: issues.map((issue) => `${issue.path}: ${issue.message}`).join('; ') });
  };
  const submit = handleSubmit(async (form) => {
    const body = toBody(form, options);
    const checked = createStudySchema.safeParse(body);
    if (!checked.success)
      return place(checked.error.issues.map((issue) => ({ path: issue.path.join('.'), message: issue.message })));
    try {
      await onSubmit(body);
    } catch (error) {
      if (error instanceof ApiError && error.details.length) place(error.details);
      else setError('root.server', { message: describeError(error) });
    }
  });
  const e = (key: keyof StudyFormValues) => errors[key]?.message;

  return (
    <form onSubmit={submit} noValidate className="grid grid-cols-1 gap-4 md:grid-cols-3">
      <TextField label="Title" className="md:col-span-3" error={e('title')} {...register('title')} />
      <SelectField label="Emitter" options={pick('photocatalyst')} error={e('emitterId')} {...register('emitterId')} />
      {values.emitterId === NEW ? (
        <TextField
          label="New emitter name"
          hint="Added to the lab's compound library"
          error={e('newEmitterName')}
          {...register('newEmitterName')}
        />
      ) : (
        <div />
      )}
      <div className="hidden md:block" />
      <SelectField label="Quencher" options={pick('quencher')} error={e('quencherId')} {...register('quencherId')} />
      {values.quencherId === NEW ? (
        <TextField
          label="New quencher name"
          hint="Added to the lab's compound library"
          error={e('newQuencherName')}
          {...register('newQuencherName')}
        />
      ) : (
        <div />
      )}
      <div className="hidden md:block" />
      <SelectField
        label="Solvent"
        error={e('solventId')}
        options={[
          ...(options?.solvents ?? []).map((s) => ({ value: s.id, label: s.name })),
          { value: CUSTOM, label: 'another solvent…' },
        ]}
        {...register('solventId')}
      />
      {values.solventId === CUSTOM ? (
        <>
          <TextField label="Solvent name" error={e('customSolventName')} {...register('customSolventName')} />
          <TextField
            label="Viscosity (mPa s)"
            hint="At the study temperature; sets the diffusion limit"
            error={e('customViscosityMilli')}
            {...register('customViscosityMilli')}
          />
        </>
      ) : (
        <TextField
          label="Viscosity override (mPa s)"
          hint="Leave empty to use the handbook η at the study temperature"
          error={e('customViscosityMilli')}
          {...register('customViscosityMilli')}
          className="md:col-span-2"
        />
      )}
      <TextField label="Temperature (K)" error={e('temperature')} {...register('temperature')} />
      <TextField label="Excitation λ (nm)" error={e('excitationWavelength')} {...register('excitationWavelength')} />
      <TextField
        label="Emission λ (nm)"
        hint="Or an integration window below"
        error={e('emissionWavelength')}
        {...register('emissionWavelength')}
      />
      <TextField label="Window from (nm)" error={e('windowStart')} {...register('windowStart')} />
      <TextField label="Window to (nm)" error={e('windowEnd')} {...register('windowEnd')} />
      <SelectField
        label="Atmosphere"
        options={studyAtmospheres.map((value) => ({ value, label: value }))}
        {...register('atmosphere')}
      />
      <SelectField
        label="Degassing"
        options={degassingMethods.map((value) => ({ value, label: value }))}
        {...register('degassingMethod')}
      />
      <SelectField
        label="τ0 from a lifetime record"
        options={[
          { value: '', label: 'enter τ0 by hand' },
          ...lifetimes.map((l) => ({
            value: l.id,
            label: `${(l.value * 1e9).toPrecision(4)} ns, ${l.solvent}, ${l.atmosphere}, ${l.temperature} K`,
          })),
        ]}
        error={e('tau0LifetimeId')}
        {...register('tau0LifetimeId')}
      />
      {!values.tau0LifetimeId && (
        <>
          <TextField label="τ0 (ns)" error={e('tau0Nano')} {...register('tau0Nano')} />
          <TextField
            label="τ0 uncertainty (ns)"
            error={e('tau0UncertaintyNano')}
            {...register('tau0UncertaintyNano')}
          />
        </>
      )}
      <SelectField
        label="The series holds"
        options={[
          { value: 'intensity', label: 'intensities' },
          { value: 'ratio', label: 'I0/I ratios' },
        ]}
        {...register('dataKind')}
      />
      <TextField
        label="I0 (without a blank)"
        hint="Only when the series has no point at zero quencher"
        error={e('i0')}
        {...register('i0')}
      />
      <fieldset className="rounded-md border border-paper-300 p-3 md:col-span-3">
        <legend className="px-1 text-body font-bold text-ink-900">Corrections</legend>
        <div className="grid grid-cols-1 gap-3 md:grid-cols-4">
          <label className="flex items-center gap-2 text-body">
            <input type="checkbox" {...register('dilutionCorrection')} /> Dilution (needs volumes added)
          </label>
          <TextField
            label="Starting volume V0 (mL)"
            error={e('initialVolumeMilli')}
            {...register('initialVolumeMilli')}
          />
          <TextField label="Stock concentration (mM)" error={e('stockMilli')} {...register('stockMilli')} />
          <label className="flex items-center gap-2 text-body">
            <input type="checkbox" {...register('stockContainsEmitter')} /> Stock also holds the emitter
          </label>
          <label className="flex items-center gap-2 text-body md:col-span-4">
            <input type="checkbox" {...register('innerFilterCorrection')} /> Inner filter (needs absorbances at λex and
            λem)
          </label>
        </div>
      </fieldset>
      <label className="flex flex-col gap-1 text-body font-bold text-ink-900 md:col-span-3">
        Notes
        <textarea
          rows={3}
          className="rounded-md border border-paper-300 px-3 py-2 font-normal"
          {...register('notes')}
        />
      </label>
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
