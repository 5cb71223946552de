import { useCallback, useEffect, useState } from 'react';
import { useForm, useWatch } from 'react-hook-form';
import type { StudyFormOptions } from '@shared/schemas/studies';
import type { FileReading } from '@shared/schemas/file-reading';
import type { UploadMapping, UploadQuestionCode } from '@shared/schemas/study-uploads';
import { Button } from '@/components/button';
import { FormAlert } from '@/components/form-alert';
import { SelectField } from '@/components/select-field';
import { TextField } from '@/components/text-field';
import { describeError } from '@/lib/form-errors';
import { readFile } from '../api/read-file';
import { FileDrop } from './file-drop';
import { FilePreview } from './file-preview';
import { CustomSolventFields, NewCompoundField, StudyConditionsFields } from './study-form-parts';
import { compoundChoices, solventChoices, studySubmit } from './study-form-submit';
import { CUSTOM, initialValues, NEW, type toBody, type StudyFormValues } from './study-form-values';
import { allAcknowledged } from './upload-questions';
import { fittingLifetime, rememberConditions, rememberedConditions } from './study-conditions';

export interface NewStudySubmission {
  body: ReturnType<typeof toBody>;
  file: File | null;
  mapping: UploadMapping | null;
  /** the preview's questions the person has ticked */
  acknowledged: UploadQuestionCode[];
}

interface Props {
  options: StudyFormOptions;
  /** who fills it in and where: conditions are remembered per person and lab */
  memory: { userId: string; labId: string };
  preset?: Partial<StudyFormValues>;
  onSubmit: (submission: NewStudySubmission, onProgress: (fraction: number) => void) => Promise<unknown>;
}

const nameOf = (options: StudyFormOptions, id: string) => options.compounds.find((c) => c.id === id)?.name ?? '';

/**
 * A new study in one screen: emitter, quencher and solvent first; the export dropped or picked
 * right here and previewed (nothing is kept before the confirmation); every other condition
 * folded under "Conditions" with the person's last values. One button creates, keeps the file,
 * takes its points and fits.
 */
export function NewStudyForm({ options, memory, preset, onSubmit }: Props) {
  const {
    register,
    handleSubmit,
    control,
    setError,
    setValue,
    getFieldState,
    formState: { errors, isSubmitting },
  } = useForm<StudyFormValues>({
    defaultValues: { ...initialValues(), ...rememberedConditions(memory.userId, memory.labId), ...preset },
  });
  const values = useWatch({ control }) as StudyFormValues;
  const [file, setFile] = useState<File | null>(null);
  const [reading, setReading] = useState<FileReading | null>(null);
  const [mapping, setMapping] = useState<UploadMapping | null>(null);
  const [acknowledged, setAcknowledged] = useState<UploadQuestionCode[]>([]);
  const [readError, setReadError] = useState<unknown>(null);
  const [progress, setProgress] = useState<number | null>(null);
  const [titleTouched, setTitleTouched] = useState(Boolean(preset?.title));

  // A title from the pair and the solvent until the person writes their own.
  const solventName =
    values.solventId === CUSTOM
      ? values.customSolventName
      : (options.solvents.find((s) => s.id === values.solventId)?.name ?? '');
  const emitterName = values.emitterId === NEW ? values.newEmitterName : nameOf(options, values.emitterId);
  const quencherName = values.quencherId === NEW ? values.newQuencherName : nameOf(options, values.quencherId);
  const suggestedTitle =
    emitterName && quencherName ? `${emitterName} with ${quencherName}${solventName ? ` in ${solventName}` : ''}` : '';
  useEffect(() => {
    if (!titleTouched && suggestedTitle) setValue('title', suggestedTitle);
  }, [suggestedTitle, titleTouched, setValue]);

  // τ0 from the emitter's lifetime record when exactly one fits the solvent (the person can still change it).
  const lifetimes = options.lifetimes.filter((l) => l.compoundId === values.emitterId);
  const fitting = fittingLifetime(options, values.emitterId, values.solventId);
  useEffect(() => {
    if (!getFieldState('tau0LifetimeId').isDirty) setValue('tau0LifetimeId', fitting?.id ?? '');
  }, [fitting?.id, setValue, getFieldState]);

  // Spectra are proposed over the emission window (or wavelength) typed here, as for a kept study.
  const studyReading = {
    windowStart: values.windowStart ?? '',
    windowEnd: values.windowEnd ?? '',
    emissionWavelength: values.emissionWavelength ?? '',
  };
  const readingKey = JSON.stringify(studyReading);
  const [readWith, setReadWith] = useState<string | null>(null);
  const [mappingChosen, setMappingChosen] = useState(false);
  const read = useCallback(
    async (next: File, nextMapping: UploadMapping | null, key: string) => {
      setReadError(null);
      setProgress(0);
      setReadWith(key);
      try {
        const result = await readFile(memory.labId, next, nextMapping, JSON.parse(key), setProgress);
        setReading(result);
        setMapping(result.mapping);
        setAcknowledged([]);
      } catch (error) {
        setReading(null);
        setReadError(error);
      } finally {
        setProgress(null);
      }
    },
    [memory.labId],
  );
  // A window typed after the file was dropped reads the spectra again, unless the person chose the reduction.
  const proposedSpectra = reading?.mapping?.layout === 'spectrum' && !mappingChosen;
  useEffect(() => {
    if (!file || !proposedSpectra || readWith === null || readWith === readingKey) return;
    const timer = setTimeout(() => void read(file, null, readingKey), 600);
    return () => clearTimeout(timer);
  }, [file, proposedSpectra, readWith, readingKey, read]);

  const unitOpen = mapping?.layout === 'series' && mapping.concentrationUnit === null;
  const ready =
    reading !== null &&
    reading.points.length > 0 &&
    reading.problems.length === 0 &&
    allAcknowledged(reading, acknowledged);
  const submit = studySubmit({ handleSubmit, setError }, options, async (body, form) => {
    // A file waiting for a unit or a tick is not dropped quietly: the preview says what it needs.
    if (reading && !ready && (unitOpen || !allAcknowledged(reading, acknowledged)))
      return setError('root.server', {
        message: unitOpen
          ? 'Choose the unit of the file’s concentration column under “Columns and units” first.'
          : 'Tick each check under the file’s preview first, or change the unit there.',
      });
    try {
      await onSubmit({ body, file: reading ? file : null, mapping, acknowledged }, setProgress);
      rememberConditions(memory.userId, memory.labId, form);
    } finally {
      setProgress(null);
    }
  });
  const e = (key: keyof StudyFormValues) => errors[key]?.message;
  const fields = { register, errors };

  return (
    <form onSubmit={submit} noValidate className="space-y-5">
      <fieldset className="grid grid-cols-1 gap-4 md:grid-cols-3">
        <legend className="mb-2 text-lead font-bold text-ink-900">What was measured</legend>
        <SelectField
          label="Emitter (required)"
          options={compoundChoices(options.compounds, 'photocatalyst')}
          error={e('emitterId')}
          {...register('emitterId')}
        />
        <SelectField
          label="Quencher (required)"
          options={compoundChoices(options.compounds, 'quencher')}
          error={e('quencherId')}
          {...register('quencherId')}
        />
        <SelectField
          label="Solvent (required)"
          error={e('solventId')}
          options={solventChoices(options)}
          {...register('solventId')}
        />
        {values.emitterId === NEW && <NewCompoundField {...fields} role="emitter" />}
        {values.quencherId === NEW && <NewCompoundField {...fields} role="quencher" />}
        {values.solventId === CUSTOM && <CustomSolventFields {...fields} />}
        <TextField
          label="Title"
          className="md:col-span-3"
          hint="Made from the emitter, quencher and solvent until you write your own"
          error={e('title')}
          {...register('title', { onChange: () => setTitleTouched(true) })}
        />
      </fieldset>

      <FileDrop
        label="Instrument export"
        fileName={file?.name ?? null}
        progress={progress}
        disabled={isSubmitting}
        onFile={(next) => {
          setFile(next);
          setMappingChosen(false);
          void read(next, null, readingKey);
        }}
      />
      {readError !== null && <FormAlert>{describeError(readError)}</FormAlert>}
      {file && reading && mapping && (
        <FilePreview
          fileName={file.name}
          reading={reading}
          mapping={mapping}
          onMapping={(next) => {
            setMapping(next);
            setMappingChosen(true);
            void read(file, next, readingKey);
          }}
          acknowledged={acknowledged}
          onAcknowledged={setAcknowledged}
        />
      )}

      <details className="rounded-md border border-paper-300 bg-white p-3">
        <summary className="cursor-pointer text-body font-bold text-ink-900">
          Conditions: τ0{' '}
          {values.tau0LifetimeId
            ? 'from the lifetime record'
            : values.tau0Nano
              ? `${values.tau0Nano} ns typed`
              : 'not given (kq needs it)'}
          , {values.temperature} K, {values.atmosphere}, {values.degassingMethod}
        </summary>
        <div className="mt-3 grid grid-cols-1 gap-4 md:grid-cols-3">
          <StudyConditionsFields {...fields} values={values} lifetimes={lifetimes} />
        </div>
      </details>

      {errors.root?.server && <FormAlert>{errors.root.server.message}</FormAlert>}
      <div className="flex flex-wrap items-center gap-3">
        <Button type="submit" pending={isSubmitting} pendingLabel={ready ? 'Creating and fitting…' : 'Creating…'}>
          {ready ? `Create and fit ${reading.pointCount} points` : 'Create study'}
        </Button>
        <span className="text-caption text-ink-600">
          {ready
            ? 'Creates the study, keeps the file as received and fits its points.'
            : unitOpen
              ? 'The file’s points wait for their concentration unit (under “Columns and units”).'
              : reading && reading.points.length > 0 && !allAcknowledged(reading, acknowledged)
                ? 'The file’s points wait for each check above to be ticked.'
                : 'Without a file, add points on the study’s screen (type, paste or upload).'}
        </span>
      </div>
    </form>
  );
}
