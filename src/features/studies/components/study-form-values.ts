import type { CreateStudyBody, StudyFormOptions } from '@shared/schemas/studies';
import type { StudyDetail } from '@shared/schemas/study-detail';
import { fromSi, toSi, type Unit } from '@shared/units/units';

/** The form keeps text as typed, in the units chemists type (ns, mPa s, mL, mM); SI at submit. */
export interface StudyFormValues {
  title: string;
  emitterId: string;
  newEmitterName: string;
  quencherId: string;
  newQuencherName: string;
  solventId: string;
  customSolventName: string;
  customViscosityMilli: string;
  temperature: string;
  excitationWavelength: string;
  emissionWavelength: string;
  windowStart: string;
  windowEnd: string;
  atmosphere: string;
  degassingMethod: string;
  tau0Nano: string;
  tau0UncertaintyNano: string;
  tau0LifetimeId: string;
  i0: string;
  dataKind: 'intensity' | 'ratio';
  dilutionCorrection: boolean;
  initialVolumeMilli: string;
  stockMilli: string;
  stockContainsEmitter: boolean;
  innerFilterCorrection: boolean;
  notes: string;
}

export const NEW = '__new__';
export const CUSTOM = '__custom__';
/** A stored SI value as form text in `unit` (none: as stored). */
const text = (value: number | null | undefined, unit?: Unit) =>
  value === null || value === undefined ? '' : String(Number((unit ? fromSi(value, unit) : value).toPrecision(8)));
/** Form text in `unit` (none: already SI) as the SI value; empty is null. */
const num = (value: string, unit?: Unit) => {
  if (value.trim() === '') return null;
  const typed = Number(value.replace(',', '.'));
  return unit ? toSi(typed, unit) : typed;
};

export function initialValues(study?: StudyDetail): StudyFormValues {
  return {
    title: study?.title ?? '',
    emitterId: study?.emitter.id ?? '',
    newEmitterName: '',
    quencherId: study?.quencher.id ?? '',
    newQuencherName: '',
    solventId: study ? (study.solventId ?? CUSTOM) : 'acetonitrile',
    customSolventName: study?.customSolventName ?? '',
    customViscosityMilli: text(study?.customViscosity, 'mPa s'),
    temperature: text(study?.temperature ?? 298.15),
    excitationWavelength: text(study?.excitationWavelength),
    emissionWavelength: text(study?.emissionWavelength),
    windowStart: text(study?.windowStart),
    windowEnd: text(study?.windowEnd),
    atmosphere: study?.atmosphere ?? 'argon',
    degassingMethod: study?.degassingMethod ?? 'sparging',
    tau0Nano: text(study?.tau0, 'ns'),
    tau0UncertaintyNano: text(study?.tau0Uncertainty, 'ns'),
    tau0LifetimeId: study?.tau0LifetimeId ?? '',
    i0: text(study?.i0),
    dataKind: study?.dataKind ?? 'intensity',
    dilutionCorrection: study?.dilutionCorrection ?? false,
    initialVolumeMilli: text(study?.initialVolume, 'mL'),
    stockMilli: text(study?.stockConcentration, 'mM'),
    stockContainsEmitter: study?.stockContainsEmitter ?? false,
    innerFilterCorrection: study?.innerFilterCorrection ?? false,
    notes: study?.notes ?? '',
  };
}

/** Form text -> API body in SI units (s, Pa s, L, mol/L); the shared zod schema then checks it. */
export function toBody(values: StudyFormValues, options: StudyFormOptions | undefined): CreateStudyBody {
  const lifetime = options?.lifetimes.find((entry) => entry.id === values.tau0LifetimeId);
  const custom = values.solventId === CUSTOM;
  return {
    title: values.title,
    ...(values.emitterId === NEW ? { newEmitterName: values.newEmitterName } : { emitterId: values.emitterId || null }),
    ...(values.quencherId === NEW
      ? { newQuencherName: values.newQuencherName }
      : { quencherId: values.quencherId || null }),
    solventId: custom ? null : values.solventId,
    customSolventName: custom ? values.customSolventName || null : null,
    customViscosity: num(values.customViscosityMilli, 'mPa s'),
    temperature: num(values.temperature) ?? 298.15,
    excitationWavelength: num(values.excitationWavelength),
    emissionWavelength: num(values.emissionWavelength),
    windowStart: num(values.windowStart),
    windowEnd: num(values.windowEnd),
    atmosphere: values.atmosphere as CreateStudyBody['atmosphere'],
    degassingMethod: values.degassingMethod as CreateStudyBody['degassingMethod'],
    // With a lifetime record the server copies its value and uncertainty; only a typed tau0 is sent.
    tau0: lifetime ? null : num(values.tau0Nano, 'ns'),
    tau0Uncertainty: lifetime ? null : num(values.tau0UncertaintyNano, 'ns'),
    tau0LifetimeId: lifetime?.id ?? null,
    i0: num(values.i0),
    dataKind: values.dataKind,
    dilutionCorrection: values.dilutionCorrection,
    initialVolume: num(values.initialVolumeMilli, 'mL'),
    stockConcentration: num(values.stockMilli, 'mM'),
    stockContainsEmitter: values.stockContainsEmitter,
    innerFilterCorrection: values.innerFilterCorrection,
    notes: values.notes,
  };
}

/** API field -> form field, for errors beside the right input. */
export const fieldOfPath: Record<string, keyof StudyFormValues> = {
  title: 'title',
  emitterId: 'emitterId',
  newEmitterName: 'newEmitterName',
  quencherId: 'quencherId',
  newQuencherName: 'newQuencherName',
  solventId: 'solventId',
  customSolventName: 'customSolventName',
  customViscosity: 'customViscosityMilli',
  temperature: 'temperature',
  excitationWavelength: 'excitationWavelength',
  emissionWavelength: 'emissionWavelength',
  windowStart: 'windowStart',
  windowEnd: 'windowEnd',
  tau0: 'tau0Nano',
  tau0Uncertainty: 'tau0UncertaintyNano',
  tau0LifetimeId: 'tau0LifetimeId',
  i0: 'i0',
  initialVolume: 'initialVolumeMilli',
  stockConcentration: 'stockMilli',
  notes: 'notes',
};
