import type { CreateStudyBody, StudyFormOptions } from '@shared/schemas/studies';
import type { StudyDetail } from '@shared/schemas/study-detail';

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
const text = (value: number | null | undefined, factor = 1) =>
  value === null || value === undefined ? '' : String(Number((value / factor).toPrecision(8)));
const num = (value: string, factor = 1) => (value.trim() === '' ? null : Number(value.replace(',', '.')) * factor);

export function initialValues(study?: StudyDetail): StudyFormValues {
  return {
    title: study?.title ?? '',
    emitterId: study?.emitter.id ?? '',
    newEmitterName: '',
    quencherId: study?.quencher.id ?? '',
    newQuencherName: '',
    solventId: study ? (study.solventId ?? CUSTOM) : 'acetonitrile',
    customSolventName: study?.customSolventName ?? '',
    customViscosityMilli: text(study?.customViscosity, 1e-3),
    temperature: text(study?.temperature ?? 298.15),
    excitationWavelength: text(study?.excitationWavelength),
    emissionWavelength: text(study?.emissionWavelength),
    windowStart: text(study?.windowStart),
    windowEnd: text(study?.windowEnd),
    atmosphere: study?.atmosphere ?? 'argon',
    degassingMethod: study?.degassingMethod ?? 'sparging',
    tau0Nano: text(study?.tau0, 1e-9),
    tau0UncertaintyNano: text(study?.tau0Uncertainty, 1e-9),
    tau0LifetimeId: study?.tau0LifetimeId ?? '',
    i0: text(study?.i0),
    dataKind: study?.dataKind ?? 'intensity',
    dilutionCorrection: study?.dilutionCorrection ?? false,
    initialVolumeMilli: text(study?.initialVolume, 1e-3),
    stockMilli: text(study?.stockConcentration, 1e-3),
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
    customViscosity: num(values.customViscosityMilli, 1e-3),
    temperature: num(values.temperature) ?? 298.15,
    excitationWavelength: num(values.excitationWavelength),
    emissionWavelength: num(values.emissionWavelength),
    windowStart: num(values.windowStart),
    windowEnd: num(values.windowEnd),
    atmosphere: values.atmosphere as CreateStudyBody['atmosphere'],
    degassingMethod: values.degassingMethod as CreateStudyBody['degassingMethod'],
    // With a lifetime record the server copies its value and uncertainty; only a typed tau0 is sent.
    tau0: lifetime ? null : num(values.tau0Nano, 1e-9),
    tau0Uncertainty: lifetime ? null : num(values.tau0UncertaintyNano, 1e-9),
    tau0LifetimeId: lifetime?.id ?? null,
    i0: num(values.i0),
    dataKind: values.dataKind,
    dilutionCorrection: values.dilutionCorrection,
    initialVolume: num(values.initialVolumeMilli, 1e-3),
    stockConcentration: num(values.stockMilli, 1e-3),
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
