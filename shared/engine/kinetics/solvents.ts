import { EngineError } from '../core/engine-error';

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
  /** dynamic viscosity at 25 °C in Pa s; null where no 25 °C value is sourced */
  viscosity: number | null;
  viscositySource: string;
  /** relative permittivity at 25 °C */
  permittivity: number;
  permittivitySource: string;
}

// Permittivities: CRC Handbook "Permittivity (Dielectric Constant) of Liquids" (Haynes
// ed., 2014), the fit eps = A + BT + CT^2 + DT^3 evaluated at 298.15 K, as digitised in
// CalebBell/chemicals (commit 82faef9). One source for all rows keeps them comparable.
const CRC_FIT = 'CRC Handbook, Permittivity of Liquids (2014), fit at 298.15 K (CalebBell/chemicals digitisation)';
// Viscosities: one handbook per row, chosen where the correlations agree best; the
// Viswanath–Natarajan rows reproduce the CRC 25 °C values to 0.001 mPa s.
const VISWANATH =
  'Viswanath & Natarajan, Data Book on the Viscosity of Liquids (1989), 3-term fit at 298.15 K (CalebBell/chemicals)';
const PERRY =
  "Perry's Chemical Engineers' Handbook, 8th ed., Table 2-313 (DIPPR eq. 101) at 298.15 K (CalebBell/chemicals)";

const mPas = 1e-3;

/** Solvent properties at 25 °C used for diffusion limits and Coulomb terms. */
export const SOLVENTS: Readonly<Record<SolventId, SolventProperties>> = {
  water: {
    id: 'water',
    name: 'water',
    viscosity: 0.89 * mPas,
    viscositySource: 'IAPWS 2008 viscosity formulation at 25 °C, 0.1 MPa: 0.8900 mPa s (CalebBell/chemicals mu_IAPWS)',
    permittivity: 78.36,
    permittivitySource: CRC_FIT,
  },
  acetonitrile: {
    id: 'acetonitrile',
    name: 'acetonitrile',
    // 0.342 rather than the often-quoted 0.369 (CRC, not verified in any stored copy):
    // three independent handbook correlations give 0.342-0.349 and the remembered
    // Riddick value is 0.341; Perry's is the primary handbook table among them.
    viscosity: 0.342 * mPas,
    viscositySource: PERRY,
    permittivity: 35.69,
    permittivitySource: CRC_FIT,
  },
  dmf: {
    id: 'dmf',
    name: 'N,N-dimethylformamide',
    viscosity: 0.794 * mPas,
    viscositySource: VISWANATH,
    permittivity: 37.22,
    permittivitySource: CRC_FIT,
  },
  dmso: {
    id: 'dmso',
    name: 'dimethyl sulfoxide',
    viscosity: 1.987 * mPas,
    viscositySource: VISWANATH,
    permittivity: 46.83,
    permittivitySource: CRC_FIT,
  },
  methanol: {
    id: 'methanol',
    name: 'methanol',
    viscosity: 0.544 * mPas,
    viscositySource: VISWANATH,
    permittivity: 32.61,
    permittivitySource: CRC_FIT,
  },
  // Viswanath–Natarajan's ethanol row is unusable (gives 3.1 mPa s); Perry instead.
  ethanol: {
    id: 'ethanol',
    name: 'ethanol',
    viscosity: 1.077 * mPas,
    viscositySource: PERRY,
    permittivity: 24.85,
    permittivitySource: CRC_FIT,
  },
  dichloromethane: {
    id: 'dichloromethane',
    name: 'dichloromethane',
    viscosity: 0.413 * mPas,
    viscositySource: VISWANATH,
    // Tabulated at 298.0 K; the CRC fit (8.82) is an extrapolation for this row.
    permittivity: 8.93,
    permittivitySource: 'CRC Handbook, Permittivity of Liquids (2014), tabulated at 298.0 K',
  },
  '1,2-dichloroethane': {
    id: '1,2-dichloroethane',
    name: '1,2-dichloroethane',
    viscosity: 0.779 * mPas,
    viscositySource: VISWANATH,
    permittivity: 10.13,
    permittivitySource: CRC_FIT,
  },
  thf: {
    id: 'thf',
    name: 'tetrahydrofuran',
    viscosity: 0.456 * mPas,
    viscositySource: PERRY,
    permittivity: 7.43,
    permittivitySource: CRC_FIT,
  },
  acetone: {
    id: 'acetone',
    name: 'acetone',
    viscosity: 0.306 * mPas,
    viscositySource: VISWANATH,
    permittivity: 20.49,
    permittivitySource: CRC_FIT,
  },
  toluene: {
    id: 'toluene',
    name: 'toluene',
    viscosity: 0.554 * mPas,
    viscositySource: PERRY,
    permittivity: 2.37,
    permittivitySource: CRC_FIT,
  },
  benzene: {
    id: 'benzene',
    name: 'benzene',
    viscosity: 0.6 * mPas,
    viscositySource: PERRY,
    permittivity: 2.27,
    permittivitySource: CRC_FIT,
  },
  'ethyl-acetate': {
    id: 'ethyl-acetate',
    name: 'ethyl acetate',
    viscosity: 0.423 * mPas,
    viscositySource: VISWANATH,
    permittivity: 5.99,
    permittivitySource: CRC_FIT,
  },
  '1,4-dioxane': {
    id: '1,4-dioxane',
    name: '1,4-dioxane',
    viscosity: 1.189 * mPas,
    viscositySource: PERRY,
    permittivity: 2.21,
    permittivitySource: CRC_FIT,
  },
  dmac: {
    id: 'dmac',
    name: 'N,N-dimethylacetamide',
    viscosity: 0.945 * mPas,
    viscositySource:
      'Wikipedia "Dimethylacetamide" infobox, its ref. 2 (25 °C); no handbook correlation gave a usable value',
    permittivity: 37.78,
    permittivitySource: CRC_FIT,
  },
  tfe: {
    id: 'tfe',
    name: '2,2,2-trifluoroethanol',
    viscosity: null,
    viscositySource: 'no sourced value at 25 °C; enter the viscosity for this solvent',
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
