import { EngineError } from '../core/engine-error';
import { coulombWorkTerm } from './coulomb-work-term';
import { electronTransferDrivingForce, type DrivingForce } from './electron-transfer-driving-force';

export type QuenchingPathway = 'oxidative' | 'reductive';

export interface QuenchingDrivingForces {
  /** excited catalyst gives an electron to the quencher; null without E(PC+/PC) and E(Q/Q-) */
  oxidative: DrivingForce | null;
  /** quencher gives an electron to the excited catalyst; null without E(Q+/Q) and E(PC/PC-) */
  reductive: DrivingForce | null;
  /** the pathway with the more negative dG_ET */
  favoured: QuenchingPathway;
  /** the pinned pathway when one was pinned and computed, else the favoured one */
  highlighted: QuenchingPathway;
}

interface Partner {
  /** E(X+/X), V */
  oxidation?: number;
  /** E(X/X-), V */
  reduction?: number;
  /** charge number before transfer, default 0 */
  charge?: number;
}

/**
 * Both electron-transfer quenching routes of an excited catalyst, each by
 * electronTransferDrivingForce: oxidative dG = E(PC+/PC) - E(Q/Q-) - E00 + w, reductive
 * dG = E(Q+/Q) - E(PC/PC-) - E00 + w. The Coulomb term is added only when a solvent
 * permittivity is given (IUPAC Gold Book GT07388 charges: products minus reactants).
 *
 * @param input.catalyst - ground-state potentials (V), charge, and e00 (eV)
 * @param input.quencher - ground-state potentials (V, same reference and solvent), charge
 * @param input.coulomb - optional { permittivity, distance (m, default 7 Å) }
 * @param input.pinned - optional pathway the user expects
 * @throws EngineError MISSING_POTENTIAL when neither pathway has both potentials
 * @example quenchingDrivingForces({ catalyst: { oxidation: 1.29, reduction: -1.33, e00: 2.10 }, quencher: { reduction: -0.74 } }).favoured // 'oxidative'
 */
export function quenchingDrivingForces(input: {
  catalyst: Partner & { e00: number };
  quencher: Partner;
  coulomb?: { permittivity: number; distance?: number };
  pinned?: QuenchingPathway;
}): QuenchingDrivingForces {
  const { catalyst, quencher, coulomb, pinned } = input;
  // One electron from donor to acceptor, the catalyst excited either way; null without both potentials.
  const transfer = (donor: Partner, acceptor: Partner) =>
    donor.oxidation !== undefined && acceptor.reduction !== undefined
      ? electronTransferDrivingForce({
          donorOxidation: donor.oxidation,
          acceptorReduction: acceptor.reduction,
          e00: catalyst.e00,
          workTerm: coulomb
            ? coulombWorkTerm({ donorCharge: donor.charge ?? 0, acceptorCharge: acceptor.charge ?? 0, ...coulomb })
            : 0,
        })
      : null;
  const oxidative = transfer(catalyst, quencher);
  const reductive = transfer(quencher, catalyst);
  if (!oxidative && !reductive) {
    throw new EngineError(
      'MISSING_POTENTIAL',
      'quencher',
      'neither route can be computed',
      'Oxidative quenching needs E(PC+/PC) and E(Q/Q-); reductive quenching needs E(Q+/Q) and E(PC/PC-)',
    );
  }
  const favoured: QuenchingPathway =
    oxidative && (!reductive || oxidative.electronvolts <= reductive.electronvolts) ? 'oxidative' : 'reductive';
  const pinnedAvailable = pinned !== undefined && (pinned === 'oxidative' ? oxidative : reductive) !== null;
  return { oxidative, reductive, favoured, highlighted: pinnedAvailable ? pinned : favoured };
}
