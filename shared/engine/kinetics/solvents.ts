import { STANDARD_TEMPERATURE } from '../core/constants';
import { EngineError } from '../core/engine-error';
import { viscosityAt, type ViscosityCorrelation } from './viscosity-correlation';

export type SolventId =
  | 'water'
  | 'acetonitrile'
  | 'dmf'
  | 'dmso'
  | 'methanol'
  | 'ethanol'
  | 'dichloromethane'
  | '1,2-dichloroethane'
  | 'thf'
  | 'acetone'
  | 'toluene'
  | 'benzene'
  | 'ethyl-acetate'
  | '1,4-dioxane'
  | 'dmac'
  | 'tfe';

export interface SolventProperties {
  id: SolventId;
  name: string;
  /** dynamic viscosity at 25 °C in Pa s (from the correlation); null where none is sourced */
  viscosity: number | null;
  viscositySource: string;
  /** eta(T) with its source and range of validity; null where none is sourced */
  viscosityCorrelation: ViscosityCorrelation | null;
  /** relative permittivity at 25 °C */
  permittivity: number;
  permittivitySource: string;
}

// Permittivities: CRC Handbook "Permittivity (Dielectric Constant) of Liquids" (Haynes
// ed., 2014), the fit eps = A + BT + CT^2 + DT^3 evaluated at 298.15 K, as digitised in
// CalebBell/chemicals (commit 82faef9). One source for all rows keeps them comparable.
const CRC_FIT = 'CRC Handbook, Permittivity of Liquids (2014), fit at 298.15 K (CalebBell/chemicals digitisation)';
// Viscosities: eta(T) from one handbook correlation per row, chosen where it reproduces the
// handbook 25 °C value best (CRC, IAPWS 2008); each row names its table and range of
// validity. Coefficients as digitised in CalebBell/chemicals (commit 82faef9,
// chemicals/Viscosity/*.tsv). Perry's rows use DIPPR eq. 101 in Pa s; Viswanath–Natarajan's
// rows the Vogel form log10(eta/mPa s) = A + B/(C - T).
const VISWANATH = 'Viswanath & Natarajan, Data Book on the Viscosity of Liquids (1989), 3-term Vogel fit';
const PERRY = "Perry's Chemical Engineers' Handbook, 8th ed., Table 2-313 (DIPPR eq. 101)";

function perry(
  coefficients: readonly [number, number, number, number, number],
  minTemperature: number,
  maxTemperature: number,
): ViscosityCorrelation {
  return { form: 'dippr-101', coefficients, minTemperature, maxTemperature, source: PERRY };
}

function viswanath(
  coefficients: readonly [number, number, number],
  minTemperature: number,
  maxTemperature: number,
): ViscosityCorrelation {
  return { form: 'vogel', coefficients, minTemperature, maxTemperature, source: VISWANATH };
}

function describe(correlation: ViscosityCorrelation): string {
  if (correlation.form === 'single-value') return correlation.source;
  return `${correlation.source}, valid ${correlation.minTemperature}–${correlation.maxTemperature} K`;
}

/** The row's viscosity fields from its correlation: eta(25 °C), the source line, the correlation. */
function viscosityFields(
  correlation: ViscosityCorrelation,
): Pick<SolventProperties, 'viscosity' | 'viscositySource' | 'viscosityCorrelation'> {
  return {
    viscosity: viscosityAt(correlation, STANDARD_TEMPERATURE).value,
    viscositySource: describe(correlation),
    viscosityCorrelation: correlation,
  };
}

/** Solvent properties used for diffusion limits (eta at any temperature) and Coulomb terms (25 °C). */
export const SOLVENTS: Readonly<Record<SolventId, SolventProperties>> = {
  water: {
    id: 'water',
    name: 'water',
    // Viswanath–Natarajan reproduces IAPWS 2008 within 0.4 % over 0–50 °C (0.8931 against
    // 0.8900 mPa s at 25 °C); Perry's and VDI's water rows are 1–2.5 % off at 25 °C.
    ...viscosityFields(viswanath([-1.5318, -220.57, 149.39], 270, 380)),
    permittivity: 78.36,
    permittivitySource: CRC_FIT,
  },
  acetonitrile: {
    id: 'acetonitrile',
    name: 'acetonitrile',
    // Perry gives 0.342 mPa s at 25 °C rather than the often-quoted 0.369 (CRC, not verified in
    // any stored copy): three independent handbook correlations give 0.342-0.349 and the
    // remembered Riddick value is 0.341. Viswanath–Natarajan's row is unusable (0.485).
    ...viscosityFields(perry([-10.906, 872.02, 0, 0, 0], 229.32, 436.4)),
    permittivity: 35.69,
    permittivitySource: CRC_FIT,
  },
  dmf: {
    id: 'dmf',
    name: 'N,N-dimethylformamide',
    // Viswanath–Natarajan reproduces the CRC 0.794 mPa s at 25 °C; Perry gives 0.815.
    ...viscosityFields(viswanath([-0.6398, -56.047, 194.25], 270, 320)),
    permittivity: 37.22,
    permittivitySource: CRC_FIT,
  },
  dmso: {
    id: 'dmso',
    name: 'dimethyl sulfoxide',
    ...viscosityFields(viswanath([-1.3585, -323.95, 102.62], 290, 400)),
    permittivity: 46.83,
    permittivitySource: CRC_FIT,
  },
  methanol: {
    id: 'methanol',
    name: 'methanol',
    // Viswanath–Natarajan's range ends at 290 K, below room temperature; Perry instead.
    ...viscosityFields(perry([-25.317, 1789.2, 2.069, 0, 0], 175.47, 337.85)),
    permittivity: 32.61,
    permittivitySource: CRC_FIT,
  },
  // Viswanath–Natarajan's ethanol row is unusable (gives 3.1 mPa s); Perry instead.
  ethanol: {
    id: 'ethanol',
    name: 'ethanol',
    ...viscosityFields(perry([7.875, 781.98, -3.0418, 0, 0], 200, 440)),
    permittivity: 24.85,
    permittivitySource: CRC_FIT,
  },
  dichloromethane: {
    id: 'dichloromethane',
    name: 'dichloromethane',
    ...viscosityFields(perry([-13.071, 940.03, 0.3733, 0, 0], 208.38, 373.93)),
    // Tabulated at 298.0 K; the CRC fit (8.82) is an extrapolation for this row.
    permittivity: 8.93,
    permittivitySource: 'CRC Handbook, Permittivity of Liquids (2014), tabulated at 298.0 K',
  },
  '1,2-dichloroethane': {
    id: '1,2-dichloroethane',
    name: '1,2-dichloroethane',
    // Perry (0.781 mPa s at 25 °C, CRC 0.779) follows VDI below 10 °C where Viswanath–Natarajan departs.
    ...viscosityFields(perry([15.312, -41.12, -3.919, 0, 0], 237.49, 400)),
    permittivity: 10.13,
    permittivitySource: CRC_FIT,
  },
  thf: {
    id: 'thf',
    name: 'tetrahydrofuran',
    ...viscosityFields(perry([-10.321, 900.92, -0.069128, 0, 0], 164.65, 373.15)),
    permittivity: 7.43,
    permittivitySource: CRC_FIT,
  },
  acetone: {
    id: 'acetone',
    name: 'acetone',
    ...viscosityFields(viswanath([-1.6125, -298.48, 26.203], 180, 320)),
    permittivity: 20.49,
    permittivitySource: CRC_FIT,
  },
  toluene: {
    id: 'toluene',
    name: 'toluene',
    ...viscosityFields(perry([-226.08, 6805.7, 37.542, -0.060853, 1], 178.18, 383.78)),
    permittivity: 2.37,
    permittivitySource: CRC_FIT,
  },
  benzene: {
    id: 'benzene',
    name: 'benzene',
    ...viscosityFields(perry([7.5117, 294.68, -2.794, 0, 0], 278.68, 545)),
    permittivity: 2.27,
    permittivitySource: CRC_FIT,
  },
  'ethyl-acetate': {
    id: 'ethyl-acetate',
    name: 'ethyl acetate',
    // Viswanath–Natarajan reproduces the CRC 0.423 mPa s at 25 °C; Perry gives 0.430.
    ...viscosityFields(viswanath([-1.8721, -452.07, -3.4748], 270, 350)),
    permittivity: 5.99,
    permittivitySource: CRC_FIT,
  },
  '1,4-dioxane': {
    id: '1,4-dioxane',
    name: '1,4-dioxane',
    ...viscosityFields(perry([-46.166, 3086.2, 5.104, 0, 0], 284.95, 374.65)),
    permittivity: 2.21,
    permittivitySource: CRC_FIT,
  },
  dmac: {
    id: 'dmac',
    name: 'N,N-dimethylacetamide',
    // No handbook correlation gave a usable value (Viswanath–Natarajan's row gives 1.96 mPa s;
    // Perry and VDI have no row): one value at 25 °C, used unchanged at other temperatures.
    ...viscosityFields({
      form: 'single-value',
      viscosity: 0.945e-3,
      temperature: 298.15,
      source: 'Wikipedia "Dimethylacetamide" infobox, its ref. 2 (25 °C); no handbook correlation gave a usable value',
    }),
    permittivity: 37.78,
    permittivitySource: CRC_FIT,
  },
  tfe: {
    id: 'tfe',
    name: '2,2,2-trifluoroethanol',
    viscosity: null,
    viscositySource: 'no sourced value at 25 °C; enter the viscosity for this solvent',
    viscosityCorrelation: null,
    permittivity: 26.73,
    permittivitySource: CRC_FIT,
  },
};

/**
 * Looks up a solvent of the table by id.
 *
 * @param id - one of the SolventId strings (as received, e.g. from an API)
 * @throws EngineError UNKNOWN_SOLVENT for any other string
 * @example getSolvent('acetonitrile').viscosity // 0.000342 (Pa s)
 */
export function getSolvent(id: string): SolventProperties {
  if (!Object.hasOwn(SOLVENTS, id)) {
    throw new EngineError(
      'UNKNOWN_SOLVENT',
      'solvent',
      `"${id}" is not in the solvent table`,
      `Use one of: ${Object.keys(SOLVENTS).join(', ')}, or enter viscosity and permittivity`,
    );
  }
  return SOLVENTS[id as SolventId];
}
