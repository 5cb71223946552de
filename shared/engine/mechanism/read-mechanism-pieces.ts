import { formatEstimate, formatNumber, UNITS } from '../../format';
import { EngineError } from '../core/engine-error';
import { studentTQuantile975 } from '../stats/student-t';
import {
  PIECE_TITLES,
  type AbsorptionEvidence,
  type DiffusionEvidence,
  type EvidenceEstimate,
  type LifetimeEvidence,
  type MechanismEvidenceInput,
  type MechanismPiece,
  type TemperatureEvidence,
  type WavelengthEvidence,
} from './mechanism-evidence';

const kJ = (joules: number) => joules / 1000;
const perMolar = (estimate: { value: number; standardError: number }) =>
  formatEstimate(estimate.value, estimate.standardError, UNITS.perMolar);
/** Differs from zero at the 95 % level (two-sided t test on the estimate). */
const beyondZero = (estimate: EvidenceEstimate) =>
  estimate.value > studentTQuantile975(Math.max(1, estimate.degreesOfFreedom)) * estimate.standardError;

function checkEstimate(estimate: { value: number; standardError: number }, field: string) {
  if (!Number.isFinite(estimate.value) || !Number.isFinite(estimate.standardError) || estimate.standardError < 0)
    throw new EngineError('INVALID_ARGUMENT', field, `${field} needs a finite value and a standard error ≥ 0`);
}

/**
 * Lifetime against intensity (Lakowicz, Principles of Fluorescence Spectroscopy, 3rd ed., 2006,
 * ch. 8, from memory: collisions shorten the excited state, so tau0/tau = I0/I; a dark
 * ground-state complex removes emitters without touching the lifetime of the rest, so I0/I rises
 * above tau0/tau; lifetimes are the most definitive test). The slopes count as equal within
 * t(0.975, Welch df) √(SE_I² + SE_τ²), as compareStaticDynamic does.
 */
function readLifetime(evidence: LifetimeEvidence): MechanismPiece {
  const { intensityKsv, lifetimeKsv, combined } = evidence;
  checkEstimate(lifetimeKsv, 'lifetime.lifetimeKsv');
  const like = evidence.intercept === 'free' ? 'both lines with a free intercept' : 'both lines through 1';
  const base = { kind: 'lifetime' as const, title: PIECE_TITLES.lifetime };
  const numbers: MechanismPiece['numbers'] = [];
  if (intensityKsv)
    numbers.push({
      label: 'K_SV from I0/I',
      value: intensityKsv.value,
      standardError: intensityKsv.standardError,
      unit: UNITS.perMolar,
    });
  numbers.push({
    label: 'K_SV from τ0/τ',
    value: lifetimeKsv.value,
    standardError: lifetimeKsv.standardError,
    unit: UNITS.perMolar,
  });
  if (combined) {
    numbers.push({
      label: 'K_D (combined fit)',
      value: combined.kD.value,
      standardError: combined.kD.standardError,
      unit: UNITS.perMolar,
    });
    numbers.push({
      label: 'K_S (combined fit)',
      value: combined.kS.value,
      standardError: combined.kS.standardError,
      unit: UNITS.perMolar,
    });
  }
  const lifetimeFalls = beyondZero(lifetimeKsv);
  if (!intensityKsv) {
    if (!combined)
      return {
        ...base,
        reading: 'unclear',
        summary: `K_SV from lifetimes is ${perMolar(lifetimeKsv)}, but the study's fit is not a straight line to compare it with: fit a line to I0/I.`,
        numbers,
      };
    checkEstimate(combined.kS, 'lifetime.combined.kS');
    // Lakowicz ch. 8: I0/I = (1 + K_D[Q])(1 + K_S[Q]), K_D the lifetime slope; K_S > 0 is the static part.
    const staticPart = beyondZero(combined.kS);
    return {
      ...base,
      reading: staticPart ? (lifetimeFalls ? 'both' : 'static') : 'dynamic',
      summary: staticPart
        ? `The combined fit gives a static part K_S = ${perMolar(combined.kS)} beside K_D = ${perMolar(combined.kD)}; lifetimes give ${perMolar(lifetimeKsv)}.`
        : `The combined fit finds no static part beyond its uncertainty (K_S = ${perMolar(combined.kS)}); K_D = ${perMolar(combined.kD)}, lifetimes give ${perMolar(lifetimeKsv)}.`,
      numbers,
    };
  }
  checkEstimate(intensityKsv, 'lifetime.intensityKsv');
  const difference = intensityKsv.value - lifetimeKsv.value;
  const varianceI = intensityKsv.standardError ** 2;
  const varianceT = lifetimeKsv.standardError ** 2;
  const standardError = Math.sqrt(varianceI + varianceT);
  // Welch–Satterthwaite degrees of freedom for the difference of two independent slopes.
  const denominator =
    (varianceI * varianceI) / Math.max(1, intensityKsv.degreesOfFreedom) +
    (varianceT * varianceT) / Math.max(1, lifetimeKsv.degreesOfFreedom);
  const df =
    denominator > 0
      ? (varianceI + varianceT) ** 2 / denominator
      : intensityKsv.degreesOfFreedom + lifetimeKsv.degreesOfFreedom;
  const halfWidth = studentTQuantile975(Math.max(1, df)) * standardError;
  numbers.push({ label: 'I0/I minus τ0/τ slope', value: difference, standardError, unit: UNITS.perMolar });
  const pair = `K_SV ${perMolar(intensityKsv)} from intensities against ${perMolar(lifetimeKsv)} from lifetimes (${like})`;
  if (!beyondZero(intensityKsv) && !lifetimeFalls)
    return {
      ...base,
      reading: 'unclear',
      summary: `${pair}: neither falls beyond its uncertainty, so there is no quenching to compare.`,
      numbers,
    };
  if (Math.abs(difference) <= halfWidth)
    return {
      ...base,
      reading: 'dynamic',
      summary: `${pair}: equal within error, so every quenched emitter was quenched in the excited state (dynamic).`,
      numbers,
    };
  if (difference < 0)
    return {
      ...base,
      reading: 'unclear',
      summary: `${pair}: the lifetimes fall faster than the intensities, which no simple mechanism gives; check both data sets.`,
      numbers,
    };
  if (!lifetimeFalls)
    return {
      ...base,
      reading: 'static',
      summary: `${pair}: the intensity falls while the lifetime does not, so the quenching is static (a dark ground-state complex).`,
      numbers,
    };
  const staticPart =
    combined && beyondZero(combined.kS) ? `; the combined fit puts K_S at ${perMolar(combined.kS)}` : '';
  return {
    ...base,
    reading: 'both',
    summary: `${pair}: the intensity falls faster than the lifetime, so a static part adds to the dynamic one${staticPart}.`,
    numbers,
  };
}

/** The series' own verdict (analyseTemperatureSeries: Lakowicz ch. 8, dynamic rises with T/eta, static falls). */
function readTemperature(evidence: TemperatureEvidence): MechanismPiece {
  checkEstimate(evidence.kSvActivationEnergy, 'temperature.kSvActivationEnergy');
  const range =
    evidence.temperatures.length > 0
      ? `${Math.min(...evidence.temperatures)}–${Math.max(...evidence.temperatures)} K`
      : '';
  const energies = `apparent activation energy of K_SV ${formatEstimate(kJ(evidence.kSvActivationEnergy.value), kJ(evidence.kSvActivationEnergy.standardError), UNITS.kilojoulePerMole)} against ${formatNumber(kJ(evidence.diffusionActivationEnergy))} ${UNITS.kilojoulePerMole} for T/η`;
  const over = `${evidence.temperatures.length} temperatures, ${range}`;
  const says = {
    dynamic: `K_SV rises with temperature in step with T/η over ${over} (${energies}): collisional quenching.`,
    static: `K_SV falls as the temperature rises over ${over} (${energies}): a complex that comes apart on warming (static).`,
    'mixed-or-unclear': `No clean trend over ${over} (${energies}).`,
  } as const;
  return {
    kind: 'temperature',
    title: PIECE_TITLES.temperature,
    reading: evidence.verdict === 'mixed-or-unclear' ? 'unclear' : evidence.verdict,
    summary: says[evidence.verdict],
    numbers: [
      {
        label: 'Ea of K_SV',
        value: kJ(evidence.kSvActivationEnergy.value),
        standardError: kJ(evidence.kSvActivationEnergy.standardError),
        unit: UNITS.kilojoulePerMole,
      },
      {
        label: 'Ea of T/η',
        value: kJ(evidence.diffusionActivationEnergy),
        standardError: null,
        unit: UNITS.kilojoulePerMole,
      },
    ],
  };
}

/** One emitter quenched one way has one K_SV across its emission (Lakowicz ch. 8; analyseSpectrumMatrix). */
function readWavelength(evidence: WavelengthEvidence): MechanismPiece {
  const base = { kind: 'wavelength' as const, title: PIECE_TITLES.wavelength };
  const h = evidence.homogeneity;
  const numbers: MechanismPiece['numbers'] = [
    { label: 'Spectral components', value: evidence.significantComponents, standardError: null, unit: '' },
  ];
  if (h) {
    numbers.unshift(
      {
        label: 'K_SV, mean of the bands',
        value: h.weightedMean,
        standardError: h.weightedMeanStandardError,
        unit: UNITS.perMolar,
      },
      { label: `χ² (${h.degreesOfFreedom} degrees of freedom)`, value: h.chiSquare, standardError: null, unit: '' },
      { label: 'p', value: h.pValue, standardError: null, unit: '' },
    );
  }
  const test = h
    ? `χ² = ${formatNumber(h.chiSquare)} with ${h.degreesOfFreedom} degrees of freedom, p = ${formatNumber(h.pValue, 2)}`
    : '';
  const grows = evidence.flags.includes('NEW_COMPONENT_GROWS');
  if (grows || evidence.flags.includes('KSV_VARIES_WITH_WAVELENGTH'))
    return {
      ...base,
      reading: 'two-emitters',
      summary: grows
        ? `A new emission grows with the quencher (${evidence.significantComponents} spectral components): an exciplex or an emitting product.`
        : `K_SV changes across the emission (${test}): two emitting species, or an exciplex.`,
      numbers,
    };
  if (!h)
    return {
      ...base,
      reading: 'unclear',
      summary: `Fewer than two bands of ${evidence.bandWidth} nm carry a K_SV; try narrower bands.`,
      numbers,
    };
  return {
    ...base,
    reading: 'neutral',
    summary: `K_SV is the same across the emission (${test}) with ${evidence.significantComponents} spectral component${evidence.significantComponents === 1 ? '' : 's'}: one emitter.`,
    numbers,
  };
}

/** A ground-state complex often changes the absorption; collisions do not (Lakowicz ch. 8, from memory). */
function readAbsorption(evidence: AbsorptionEvidence): MechanismPiece {
  const k = evidence.associationConstant;
  return {
    kind: 'absorption',
    title: PIECE_TITLES.absorption,
    reading: evidence.changed ? 'static' : 'neutral',
    summary: evidence.changed
      ? `${evidence.detail} A ground-state complex forms${k ? ` (K_a = ${perMolar(k)})` : ''}: static quenching is possible.`
      : `${evidence.detail} No ground-state complex shows in the absorption (a weakly absorbing one can still hide).`,
    numbers: k ? [{ label: 'K_a', value: k.value, standardError: k.standardError, unit: UNITS.perMolar }] : [],
  };
}

/**
 * kq above the diffusion limit k_diff = 8RT/3eta(T) (beyond the 95 % interval) cannot come from
 * collisions alone: a static part inflating K_SV, or quenching at long range (Lakowicz ch. 8, from
 * memory; common practice).
 */
function readDiffusion(evidence: DiffusionEvidence): MechanismPiece {
  checkEstimate(evidence.kq, 'diffusion.kq');
  if (!(evidence.diffusionLimit > 0))
    throw new EngineError('NON_POSITIVE_VALUE', 'diffusion.diffusionLimit', 'the diffusion limit must be positive');
  const ratio = evidence.kq.value / evidence.diffusionLimit;
  const kq = formatEstimate(evidence.kq.value, evidence.kq.standardError, UNITS.perMolarPerSecond);
  const limit = `${formatNumber(evidence.diffusionLimit)} ${UNITS.perMolarPerSecond} at ${formatNumber(evidence.temperature, 5)} K`;
  const above = evidence.kq.interval95.lower > evidence.diffusionLimit;
  return {
    kind: 'diffusion',
    title: PIECE_TITLES.diffusion,
    reading: above ? 'static-or-long-range' : 'neutral',
    summary: above
      ? `kq = ${kq} is ${formatNumber(ratio, 2)} times k_diff = ${limit}: faster than collisions allow, so a static part or quenching at long range.`
      : `kq = ${kq} is ${formatNumber(ratio, 2)} of k_diff = ${limit}: within what collisions allow.`,
    numbers: [
      {
        label: 'kq',
        value: evidence.kq.value,
        standardError: evidence.kq.standardError,
        unit: UNITS.perMolarPerSecond,
      },
      {
        label: 'k_diff at the study’s temperature',
        value: evidence.diffusionLimit,
        standardError: null,
        unit: UNITS.perMolarPerSecond,
      },
      { label: 'kq / k_diff', value: ratio, standardError: null, unit: '' },
    ],
  };
}

/**
 * Reads each piece of mechanism evidence that exists into what it says, in plain words with its
 * numbers; the rules and their sources are beside each reader (Lakowicz, Principles of
 * Fluorescence Spectroscopy, 3rd ed., 2006, ch. 8, from memory; common practice elsewhere).
 *
 * @throws EngineError INVALID_ARGUMENT, NON_POSITIVE_VALUE on estimates that are not numbers
 * @example readMechanismPieces({ lifetime: null, temperature: null, wavelength: null, absorption: null, diffusion: null }) // []
 */
export function readMechanismPieces(input: MechanismEvidenceInput): MechanismPiece[] {
  const pieces: MechanismPiece[] = [];
  if (input.lifetime) pieces.push(readLifetime(input.lifetime));
  if (input.temperature) pieces.push(readTemperature(input.temperature));
  if (input.wavelength) pieces.push(readWavelength(input.wavelength));
  if (input.absorption) pieces.push(readAbsorption(input.absorption));
  if (input.diffusion) pieces.push(readDiffusion(input.diffusion));
  return pieces;
}
