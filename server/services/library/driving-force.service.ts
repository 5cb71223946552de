import {
  DEFAULT_ENCOUNTER_DISTANCE,
  energyTransferFeasibility,
  getSolvent,
  quenchingDrivingForces,
  SOLVENTS,
} from '@shared/engine';
import type { DrivingForceResult, MissingInput, Pathway } from '@shared/schemas/driving-force';
import type { LabContext } from '../../domain/lab-context';
import { AppError } from '../../lib/app-error';
import { Compound, type ExcitedStateEnergy, type RedoxPotential } from '../../models';
import { pickPotential } from './display-potential.service';
import { pickEnergy } from './excited-state.service';
import { findCompound, labDisplaySettings } from './library-access.service';
import { measurementsOf } from './measurement-store.service';

interface Query {
  emitterId: string;
  quencherId: string;
  solvent: string;
  pinned?: Pathway;
  distance?: number;
}

const label = { oxidation: 'ground-state oxidation potential', reduction: 'ground-state reduction potential' } as const;

/**
 * Names each number a pathway lacks, for which compound, and which pathways it blocks. Each row:
 * whether it is there, whose it is, which quantity, the pathways that need it and what to say.
 */
function missingInputs(
  emitter: Compound,
  quencher: Compound,
  has: Record<string, boolean>,
  reference: string,
): MissingInput[] {
  type Need = [present: boolean | undefined, Compound, MissingInput['quantity'], MissingInput['neededFor'], string];
  const potential = (
    kind: 'oxidation' | 'reduction',
    couple: string,
    pathway: 'oxidative' | 'reductive',
  ): [MissingInput['quantity'], MissingInput['neededFor'], string] => [
    kind,
    [pathway],
    `${label[kind]} ${couple} usable against ${reference}; ${pathway} quenching needs it`,
  ];
  const e00 = 'E00 (excited-state energy); both electron-transfer pathways need it';
  const triplet = 'triplet energy; the energy-transfer check needs it';
  const needs: Need[] = [
    [has.emitterOxidation, emitter, ...potential('oxidation', 'E(PC+/PC)', 'oxidative')],
    [has.emitterReduction, emitter, ...potential('reduction', 'E(PC/PC-)', 'reductive')],
    [has.e00, emitter, 'e00', ['oxidative', 'reductive'], e00],
    [has.quencherReduction, quencher, ...potential('reduction', 'E(Q/Q-)', 'oxidative')],
    [has.quencherOxidation, quencher, ...potential('oxidation', 'E(Q+/Q)', 'reductive')],
    [has.emitterTriplet, emitter, 'tripletEnergy', ['energy-transfer'], triplet],
    [has.quencherTriplet, quencher, 'tripletEnergy', ['energy-transfer'], triplet],
  ];
  return needs
    .filter(([present]) => !present)
    .map(([, compound, quantity, neededFor, what]) => ({
      compoundId: compound.id,
      compoundName: compound.name,
      quantity,
      neededFor,
      message: `${compound.name} has no ${what}`,
    }));
}

/**
 * Both electron-transfer routes between an emitter and a quencher (the engine's
 * quenchingDrivingForces, Rehm & Weller 1970 estimate), every potential first converted into
 * the lab's display reference; the Coulomb term for the study's solvent is reported beside
 * each dG, not folded in; energy transfer from the triplet energies.
 */
export async function drivingForce(lab: LabContext, query: Query): Promise<DrivingForceResult> {
  const emitter = await findCompound(lab, query.emitterId);
  const quencher = await findCompound(lab, query.quencherId);
  const { displayReference: reference } = await labDisplaySettings(lab.id);
  const potentials = await measurementsOf<RedoxPotential>('potential', lab.id, [emitter.id, quencher.id]);
  const energies = await measurementsOf<ExcitedStateEnergy>('energy', lab.id, [emitter.id]);
  return drivingForceFrom(
    { reference, compounds: new Map([emitter, quencher].map((c) => [c.id, c])), potentials, energies },
    query,
  );
}

/** What the driving force of a pair reads from the library: loaded once for many pairs by the comparison. */
export interface DrivingForceInputs {
  reference: string;
  compounds: ReadonlyMap<string, Compound>;
  /** Every potential of the compounds, and the E00 values of the emitters, oldest first. */
  potentials: RedoxPotential[];
  energies: ExcitedStateEnergy[];
}

/** The inputs for every pair among these compounds (emitters: those whose E00 is needed), in four queries. */
export async function loadDrivingForceInputs(
  lab: LabContext,
  compoundIds: string[],
  emitterIds: string[],
): Promise<DrivingForceInputs> {
  const [compounds, { displayReference: reference }, potentials, energies] = await Promise.all([
    Compound.findAll({ where: { id: compoundIds, labId: lab.id } }),
    labDisplaySettings(lab.id),
    measurementsOf<RedoxPotential>('potential', lab.id, compoundIds),
    measurementsOf<ExcitedStateEnergy>('energy', lab.id, emitterIds),
  ]);
  return { reference, compounds: new Map(compounds.map((compound) => [compound.id, compound])), potentials, energies };
}

/** drivingForce from inputs already loaded (no database work). */
export function drivingForceFrom(inputs: DrivingForceInputs, query: Query): DrivingForceResult {
  const compound = (id: string) => {
    const found = inputs.compounds.get(id);
    if (!found) throw new AppError('not_found', 'No compound with this id in this lab.', 404);
    return found;
  };
  const emitter = compound(query.emitterId);
  const quencher = compound(query.quencherId);
  const { reference } = inputs;
  const potentials = inputs.potentials;
  const energies = inputs.energies.filter((energy) => energy.compoundId === emitter.id);
  const of = (compound: Compound) => potentials.filter((potential) => potential.compoundId === compound.id);
  const used = {
    emitterOxidation: pickPotential(of(emitter), 'oxidation', reference),
    emitterReduction: pickPotential(of(emitter), 'reduction', reference),
    quencherOxidation: pickPotential(of(quencher), 'oxidation', reference),
    quencherReduction: pickPotential(of(quencher), 'reduction', reference),
  };
  const e00 = pickEnergy(energies);
  const solvent = getSolvent(query.solvent);
  const distance = query.distance ?? DEFAULT_ENCOUNTER_DISTANCE;

  const catalyst = {
    oxidation: used.emitterOxidation?.value,
    reduction: used.emitterReduction?.value,
    charge: emitter.charge,
  };
  const partner = {
    oxidation: used.quencherOxidation?.value,
    reduction: used.quencherReduction?.value,
    charge: quencher.charge,
  };
  const computable =
    e00 &&
    ((catalyst.oxidation !== undefined && partner.reduction !== undefined) ||
      (partner.oxidation !== undefined && catalyst.reduction !== undefined));
  const plain = computable
    ? quenchingDrivingForces({ catalyst: { ...catalyst, e00: e00.value }, quencher: partner, pinned: query.pinned })
    : null;
  const withWork = computable
    ? quenchingDrivingForces({
        catalyst: { ...catalyst, e00: e00.value },
        quencher: partner,
        coulomb: { permittivity: solvent.permittivity, distance },
      })
    : null;
  const pathway = (key: Pathway, donor?: number, acceptor?: number) => {
    const force = plain?.[key];
    const work = withWork?.[key];
    if (!force || !work || donor === undefined || acceptor === undefined || !e00) return null;
    return {
      electronvolts: force.electronvolts,
      kilojoulesPerMole: force.kilojoulesPerMole,
      donorOxidation: donor,
      acceptorReduction: acceptor,
      e00: e00.value,
      workTerm: work.workTerm,
      withWorkTerm: work.electronvolts,
    };
  };

  const energyTransfer =
    emitter.tripletEnergy && quencher.tripletEnergy
      ? energyTransferFeasibility({
          catalystTripletEnergy: emitter.tripletEnergy,
          quencherTripletEnergy: quencher.tripletEnergy,
        })
      : null;
  const warnings = new Set(Object.values(used).flatMap((value) => value?.warnings ?? []));
  for (const value of Object.values(used)) {
    if (value && value.original.solvent !== solvent.id) {
      warnings.add(
        `A potential measured in ${value.original.solvent} is used for a study in ${solvent.name}; no solvent correction is applied.`,
      );
    }
  }
  const strip = (value: (typeof used)[keyof typeof used]) =>
    value ? (({ warnings: _, ...rest }) => rest)(value) : null;
  const partnerOut = (compound: Compound, ox: keyof typeof used, red: keyof typeof used) => ({
    id: compound.id,
    name: compound.name,
    charge: compound.charge,
    oxidation: strip(used[ox]),
    reduction: strip(used[red]),
    tripletEnergy: compound.tripletEnergy ?? null,
  });
  return {
    reference,
    solvent: solvent.id,
    emitter: { ...partnerOut(emitter, 'emitterOxidation', 'emitterReduction'), e00 },
    quencher: partnerOut(quencher, 'quencherOxidation', 'quencherReduction'),
    oxidative: pathway('oxidative', catalyst.oxidation, partner.reduction),
    reductive: pathway('reductive', partner.oxidation, catalyst.reduction),
    favoured: plain?.favoured ?? null,
    highlighted: plain?.highlighted ?? null,
    pinned: query.pinned ?? null,
    coulomb: { permittivity: solvent.permittivity, distance, source: solvent.permittivitySource },
    energyTransfer: energyTransfer
      ? {
          possible: energyTransfer.possible,
          energyDifference: energyTransfer.energyDifference,
          kilojoulesPerMole: energyTransfer.energyDifferenceKilojoulesPerMole,
        }
      : null,
    missing: missingInputs(
      emitter,
      quencher,
      {
        emitterOxidation: !!used.emitterOxidation,
        emitterReduction: !!used.emitterReduction,
        e00: !!e00,
        quencherOxidation: !!used.quencherOxidation,
        quencherReduction: !!used.quencherReduction,
        emitterTriplet: !!emitter.tripletEnergy,
        quencherTriplet: !!quencher.tripletEnergy,
      },
      reference,
    ),
    warnings: [...warnings],
  };
}

/** What a study says about its pair; both the comparison and the study report ask through this. */
export interface StudyPair {
  emitterId: string;
  quencherId: string;
  solventId: string | null;
  pinnedMechanism: string | null;
}

/**
 * The driving force of a study's pair in its solvent, or null when the solvent is not in the
 * engine's table (no permittivity for the Coulomb term). Energy transfer is not an
 * electron-transfer pathway, so pinning it highlights the more favourable one.
 */
export async function drivingForceOfStudy(lab: LabContext, study: StudyPair): Promise<DrivingForceResult | null> {
  const query = studyQuery(study);
  return query ? drivingForce(lab, query) : null;
}

/** drivingForceOfStudy from inputs already loaded (loadDrivingForceInputs). */
export function drivingForceOfStudyFrom(inputs: DrivingForceInputs, study: StudyPair): DrivingForceResult | null {
  const query = studyQuery(study);
  return query ? drivingForceFrom(inputs, query) : null;
}

function studyQuery(study: StudyPair): Query | null {
  if (!study.solventId || !(study.solventId in SOLVENTS)) return null;
  const pinned =
    study.pinnedMechanism === 'oxidative' || study.pinnedMechanism === 'reductive' ? study.pinnedMechanism : undefined;
  return { emitterId: study.emitterId, quencherId: study.quencherId, solvent: study.solventId, pinned };
}
