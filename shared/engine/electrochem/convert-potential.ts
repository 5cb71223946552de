import { EngineError } from '../core/engine-error';
import { requireFinite } from '../core/validate';
import {
  AQUEOUS_REFERENCES,
  isAqueousReference,
  NON_AQUEOUS_REFERENCES,
  REFERENCE_ELECTRODES,
  type ReferenceElectrode,
  type SourcedConstant,
} from './reference-electrodes';

export interface PotentialWarning {
  code: 'JUNCTION_POTENTIAL' | 'PREFER_FERROCENE_REFERENCE';
  message: string;
}

/** What convertPotential takes (units and meanings in its doc comment). */
export interface PotentialConversionInput {
  value: number;
  from: string;
  to: string;
  solvent?: string;
}

export interface ConvertedPotential {
  /** V against `to` */
  value: number;
  from: ReferenceElectrode;
  to: ReferenceElectrode;
  /** the constants used, each with its source */
  constants: (SourcedConstant & { reference: ReferenceElectrode })[];
  warnings: PotentialWarning[];
}

/**
 * Converts a potential between reference electrodes: E(vs new) = E(vs old) + [E_old -
 * E_new], both against SHE. Fc+/Fc and Ag/Ag+ are tied to SCE by constants measured in
 * a named solvent. Crossing between aqueous and non-aqueous references adds a warning
 * (the constants carry an unknown liquid-junction potential), and reporting a
 * non-aqueous result against an aqueous reference adds IUPAC's advice to use Fc+/Fc
 * (Gritzner & Kuta, Pure Appl. Chem. 1984, 56, 461 — citation from memory).
 *
 * @param input.value - potential in V against `from`
 * @param input.from - reference of the value
 * @param input.to - reference wanted
 * @param input.solvent - solvent id (e.g. 'acetonitrile'); required for Fc+/Fc and Ag/Ag+
 * @throws EngineError UNKNOWN_REFERENCE_ELECTRODE, REFERENCE_NOT_AVAILABLE_FOR_SOLVENT, NON_FINITE_VALUE
 * @example convertPotential({ value: 1.29, from: 'SCE', to: 'Fc+/Fc', solvent: 'acetonitrile' }).value // 0.91
 */
export function convertPotential(input: PotentialConversionInput): ConvertedPotential {
  const value = requireFinite(input.value, 'value');
  const from = knownReference(input.from, 'from');
  const to = knownReference(input.to, 'to');
  const nonAqueousSolvent = input.solvent !== undefined && input.solvent !== 'water';
  const constants: ConvertedPotential['constants'] = [];
  const fromVsShe = potentialVsShe(from, input.solvent, constants);
  const toVsShe = from === to ? fromVsShe : potentialVsShe(to, input.solvent, constants);
  const warnings: PotentialWarning[] = [];
  if (isAqueousReference(from) !== isAqueousReference(to)) {
    warnings.push({
      code: 'JUNCTION_POTENTIAL',
      message:
        'This conversion links an aqueous reference to one in an organic solvent; the constant includes a ' +
        'liquid-junction potential that is not known exactly, so expect errors of a few tens of millivolts.',
    });
  }
  if (nonAqueousSolvent && isAqueousReference(to)) {
    warnings.push({
      code: 'PREFER_FERROCENE_REFERENCE',
      message:
        'For potentials measured in organic solvents IUPAC recommends reporting against Fc+/Fc measured in the same solution.',
    });
  }
  const distinct = constants.filter(
    (constant, i) =>
      constants.findIndex((other) => other.reference === constant.reference && other.value === constant.value) === i,
  );
  return { value: value + fromVsShe - toVsShe, from, to, constants: distinct, warnings };
}

function knownReference(reference: string, field: string): ReferenceElectrode {
  if (!(REFERENCE_ELECTRODES as readonly string[]).includes(reference)) {
    throw new EngineError(
      'UNKNOWN_REFERENCE_ELECTRODE',
      field,
      `"${reference}" is not a known reference electrode`,
      `Use one of: ${REFERENCE_ELECTRODES.join(', ')}`,
    );
  }
  return reference as ReferenceElectrode;
}

function potentialVsShe(
  reference: ReferenceElectrode,
  solvent: string | undefined,
  used: ConvertedPotential['constants'],
): number {
  if (isAqueousReference(reference)) {
    if (reference !== 'SHE') used.push({ reference, ...AQUEOUS_REFERENCES[reference] });
    return AQUEOUS_REFERENCES[reference].value;
  }
  const forSolvent =
    solvent !== undefined && Object.hasOwn(NON_AQUEOUS_REFERENCES, solvent)
      ? NON_AQUEOUS_REFERENCES[solvent]
      : undefined;
  const constant = forSolvent?.[reference];
  if (!constant) {
    throw new EngineError(
      'REFERENCE_NOT_AVAILABLE_FOR_SOLVENT',
      'solvent',
      solvent === undefined ? `${reference} needs a solvent` : `no sourced ${reference} constant for "${solvent}"`,
      `Sourced: ${Object.entries(NON_AQUEOUS_REFERENCES)
        .filter(([, r]) => r[reference])
        .map(([s]) => s)
        .join(', ')}`,
    );
  }
  used.push({ reference, value: constant.value, source: `${constant.source}; vs SCE` });
  used.push({ reference: 'SCE', ...AQUEOUS_REFERENCES.SCE });
  return AQUEOUS_REFERENCES.SCE.value + constant.value;
}
