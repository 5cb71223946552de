import type { FieldErrors, UseFormRegister } from 'react-hook-form';
import { degassingMethods, studyAtmospheres, type StudyFormOptions } from '@shared/schemas/studies';
import { toNanoseconds } from '@shared/units/units';
import { SelectField } from '@/components/select-field';
import { TextField } from '@/components/text-field';
import type { StudyFormValues } from './study-form-values';

/*
 * The fields the two study forms (the one-screen new study and the settings of an existing one)
 * share: those that appear for a new compound or another solvent, and every condition of the
 * measurement. Their choices and submit handler are in study-form-submit.ts.
 */

interface FieldsProps {
  register: UseFormRegister<StudyFormValues>;
  errors: FieldErrors<StudyFormValues>;
  values: StudyFormValues;
}

/** The name field of a compound to add to the library, when "a new compound" is picked. */
export function NewCompoundField({
  register,
  errors,
  role,
}: Omit<FieldsProps, 'values'> & { role: 'emitter' | 'quencher' }) {
  const key = role === 'emitter' ? 'newEmitterName' : 'newQuencherName';
  return (
    <TextField
      label={`New ${role} name`}
      hint="Added to the lab's compound library"
      error={errors[key]?.message}
      {...register(key)}
    />
  );
}

/** Name and viscosity of a solvent outside the engine's table. */
export function CustomSolventFields({ register, errors }: Omit<FieldsProps, 'values'>) {
  return (
    <>
      <TextField label="Solvent name" error={errors.customSolventName?.message} {...register('customSolventName')} />
      <TextField
        label="Viscosity (mPa s)"
        hint="At the study temperature; sets the diffusion limit"
        error={errors.customViscosityMilli?.message}
        {...register('customViscosityMilli')}
      />
    </>
  );
}

/**
 * Every condition of the measurement: τ0 (from a lifetime record of the emitter or typed),
 * temperature, wavelengths, atmosphere, what the series holds, I0, corrections and notes. Laid
 * out in the three-column grid of the form around it.
 */
export function StudyConditionsFields({
  register,
  errors,
  values,
  lifetimes,
}: FieldsProps & { lifetimes: StudyFormOptions['lifetimes'] }) {
  const e = (key: keyof StudyFormValues) => errors[key]?.message;
  return (
    <>
      <SelectField
        label="τ0 from a lifetime record"
        options={[
          { value: '', label: 'enter τ0 by hand' },
          ...lifetimes.map((l) => ({
            value: l.id,
            label: `${toNanoseconds(l.value).toPrecision(4)} ns, ${l.solvent}, ${l.atmosphere}, ${l.temperature} K`,
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
      <TextField label="Temperature (K)" error={e('temperature')} {...register('temperature')} />
      <TextField label="Excitation λ (nm)" error={e('excitationWavelength')} {...register('excitationWavelength')} />
      <TextField
        label="Emission λ (nm)"
        hint="Or an integration window"
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
            <input type="checkbox" {...register('dilutionCorrection')} /> Dilution correction (needs volumes added)
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
            <input type="checkbox" {...register('innerFilterCorrection')} /> Inner-filter correction (needs absorbances
            at λex and λem)
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
    </>
  );
}
