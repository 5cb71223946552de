import { REFERENCE_ELECTRODES } from '@shared/engine/electrochem/reference-electrodes';
import { SOLVENTS } from '@shared/engine/kinetics/solvents';
import { formatFixed, formatNumber, UNITS } from '@shared/format';
import { TIME_UNITS, toMicroseconds, toNanoseconds } from '@shared/units/units';

/** Potentials with sign and two decimals, as papers report them: "+1.21 V". */
export const formatVolts = (value: number) => `${formatFixed(value, 2, { signed: true })} ${UNITS.volt}`;
/** Energies with sign: "−0.07 eV". */
export const formatElectronvolts = (value: number, signed = true) =>
  `${formatFixed(value, 2, { signed })} ${UNITS.electronvolt}`;
export const formatKilojoules = (value: number) =>
  `${formatFixed(value, 1, { signed: true })} ${UNITS.kilojoulePerMole}`;

/**
 * Lifetimes stored in s, read in ns below 1 µs and in µs above. An uncertainty passes the value it
 * belongs to as `scaleOf`, so "1.90 µs ± 0.057 µs" keeps one unit.
 */
export function formatLifetime(seconds: number, scaleOf?: number): string {
  // Three significant figures for a value, two for its uncertainty (common practice).
  const digits = scaleOf === undefined ? 3 : 2;
  const [inUnit, unit] =
    (scaleOf ?? seconds) < TIME_UNITS.us ? [toNanoseconds, UNITS.nanosecond] : [toMicroseconds, UNITS.microsecond];
  return `${formatNumber(inUnit(seconds), digits, { trailingZeros: true })} ${unit}`;
}

export const referenceOptions = REFERENCE_ELECTRODES.map((reference) => ({ value: reference, label: reference }));
export const solventOptions = Object.values(SOLVENTS).map((solvent) => ({ value: solvent.id, label: solvent.name }));
export const solventName = (id: string) =>
  Object.hasOwn(SOLVENTS, id) ? SOLVENTS[id as keyof typeof SOLVENTS].name : id;

export const roleHintLabels = { photocatalyst: 'Emitter', quencher: 'Quencher', both: 'Emitter or quencher' } as const;
export const kindLabels = { 'half-wave': 'E1/2 (reversible)', 'half-peak': 'Ep/2', peak: 'Ep (irreversible)' } as const;
export const coupleLabels = { oxidation: 'Oxidation E(M+/M)', reduction: 'Reduction E(M/M−)' } as const;
