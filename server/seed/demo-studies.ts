import type { Transaction } from 'sequelize';
import { getSolvent, viscosityAt } from '@shared/engine';
import type { FitModel } from '@shared/schemas/studies';
import { Study, StudyPoint, StudyReview, type Lab, type User } from '../models';
import { refitStudy } from '../services/studies/study-fitting.service';
import type { DemoClock } from './demo-clock';
import { seedDemoAbsorption } from './demo-absorption';
import { demoDecayConcentrations, seedDemoDecays, seedDemoLibraryDecay } from './demo-decays';
import { seedDemoExciplex } from './demo-exciplex';
import type { DemoLibrary } from './demo-library';

/*
 * The demo lab's quenching studies. Every title, code and number is INVENTED: each series is
 * computed from the model its title describes (I0/I = (1 + K_D[Q])(1 + K_S[Q]), the accessible-
 * fraction form, or a straight line) with a small fixed wobble so it looks measured. Compounds
 * are named, never picked by position, and each title names the two compounds it uses (a test
 * checks that). Together the studies show each fit model and each flag the engine raises.
 */

type Person = 'priya' | 'tomasz' | 'ines';
type Status = 'draft' | 'submitted' | 'approved' | 'returned';

interface Series {
  /** mol/L */
  concentrations: number[];
  /** the true I0/I at [Q] */
  ratio: (q: number) => number;
  /** the true tau0/tau at [Q], when lifetimes were measured */
  lifetimeRatio?: (q: number) => number;
  /** relative deviation of each reading (default WOBBLE) */
  wobble?: readonly number[];
  /** absorbance of the quencher at the excitation and emission wavelengths, per mol/L */
  absorbancePerMolar?: { excitation: number; emission: number };
  /** the stock added (L) and the starting volume (L), when the quencher was added without emitter */
  dilution?: { initialVolume: number; stock: number };
  /** readings replaced by hand-made faults: position -> intensity */
  faults?: Record<number, number>;
}

export interface DemoStudy {
  key: string;
  title: string;
  emitter: string;
  quencher: string;
  /** default 'acetonitrile' (most demo studies) */
  solventId?: string;
  /** K, default 298.15 */
  temperature?: number;
  owner: Person;
  /** the lifetime record of the emitter (the default), or a tau0 typed in s (e.g. measured in another solvent) */
  tau0?: 'record' | { value: number; uncertainty: number };
  /** I0 typed with the study (no blank in the series) */
  i0?: number;
  /** default 'linear-free' */
  model?: FitModel;
  series: Series;
  innerFilterCorrection?: boolean;
  notes: string;
  /** what happened, in days before the demo was loaded */
  story: { started: number; submitted?: number; decided?: { days: number; status: 'approved' | 'returned' } };
  comment?: string;
  /** who decides; never the owner */
  reviewer?: Person;
}

const I0 = 12000;
const WOBBLE = [0, 0.012, -0.009, 0.007, -0.011, 0.006, -0.004, 0.01, -0.006, 0.008, -0.01, 0.005];
const evenly = (max: number, steps: number) => Array.from({ length: steps + 1 }, (_, i) => (max * i) / steps);
const line = (k: number) => (q: number) => 1 + k * q;
const combined = (kD: number, kS: number) => (q: number) => (1 + kD * q) * (1 + kS * q);
// Lehrer's accessible-fraction form: I/I0 = f_a/(1 + K[Q]) + (1 - f_a).
const partlyAccessible = (fa: number, k: number) => (q: number) => 1 / (fa / (1 + k * q) + 1 - fa);

export const demoStudies: DemoStudy[] = [
  {
    key: 'ir-amine',
    title: 'Demo: HL-Ir-7 (iridium) with the amine Q-amine-3 in MeCN',
    emitter: 'HL-Ir-7',
    quencher: 'Q-amine-3',
    owner: 'priya',
    series: { concentrations: evenly(4e-3, 7), ratio: line(1600), lifetimeRatio: line(1600) },
    notes: 'Demo data. Intensities integrated 470–640 nm; lifetimes from invented TCSPC runs at each addition.',
    story: { started: 19, submitted: 16, decided: { days: 15, status: 'approved' } },
    comment: 'Intensity and lifetime slopes agree within error: dynamic quenching. Approved.',
    reviewer: 'tomasz',
  },
  {
    key: 'ir-viologen',
    title: 'Demo: HL-Ir-7 (iridium) with the bipyridinium salt Q-viol-5, faster than diffusion',
    emitter: 'HL-Ir-7',
    quencher: 'Q-viol-5',
    owner: 'priya',
    // A static share (an ion pair) on top of collisions: the line is too steep and bends upward.
    series: { concentrations: evenly(6e-5, 7), ratio: combined(40000, 30000) },
    notes:
      'Demo data. kq comes out above the diffusion limit in MeCN: an ion pair of the cationic emitter and the dication?',
    story: { started: 4, submitted: 1 },
  },
  {
    key: 'cz-aryl-bromide',
    title: 'Demo: HL-Cz-2 (carbazole) with the aryl bromide Q-aryl-Br-1 in DMF',
    emitter: 'HL-Cz-2',
    quencher: 'Q-aryl-Br-1',
    solventId: 'dmf',
    owner: 'priya',
    // The library's lifetime is in MeCN; this one was measured in DMF for the study.
    tau0: { value: 4.2e-6, uncertainty: 0.15e-6 },
    series: { concentrations: [0, 0.01, 0.02, 0.03], ratio: line(45) },
    notes: 'Demo data. τ0 measured in DMF under argon (invented).',
    story: { started: 9, submitted: 7, decided: { days: 6, status: 'returned' } },
    comment: 'Only four concentrations: add a second blank and two points above 30 mM, then submit again.',
    reviewer: 'tomasz',
  },
  {
    key: 'cz-alkene',
    title: 'Demo: HL-Cz-2 (carbazole) with the alkene Q-ene-6, static and dynamic',
    emitter: 'HL-Cz-2',
    quencher: 'Q-ene-6',
    owner: 'priya',
    model: 'static-dynamic',
    // Lifetimes see only the dynamic part, so the fit can tell K_D from K_S.
    series: { concentrations: evenly(8e-3, 7), ratio: combined(300, 150), lifetimeRatio: line(300) },
    notes: 'Demo data. The plot bends upward and the lifetimes follow the smaller constant.',
    story: { started: 3 },
  },
  {
    key: 'ru-thiol',
    title: 'Demo: HL-Ru-4 (ruthenium) with the thiol Q-thiol-8, part of the emission out of reach',
    emitter: 'HL-Ru-4',
    quencher: 'Q-thiol-8',
    owner: 'ines',
    model: 'modified',
    series: { concentrations: evenly(5e-3, 8), ratio: partlyAccessible(0.65, 900) },
    notes: 'Demo data. The plot levels off: about a third of the emission is not reached by the thiol.',
    story: { started: 6, submitted: 2 },
  },
  {
    key: 'ir-thiol-levels-off',
    title: 'Demo: HL-Ir-7 (iridium) with the thiol Q-thiol-8, plot levels off',
    emitter: 'HL-Ir-7',
    quencher: 'Q-thiol-8',
    owner: 'priya',
    series: { concentrations: evenly(4e-3, 7), ratio: partlyAccessible(0.7, 1500) },
    notes: 'Demo data. Still fitted with a straight line; the flag suggests the accessible-fraction model.',
    story: { started: 1 },
  },
  {
    key: 'ru-borate',
    title: 'Demo: HL-Ru-4 (ruthenium) with the borate salt Q-borate-9, line through 1',
    emitter: 'HL-Ru-4',
    quencher: 'Q-borate-9',
    owner: 'tomasz',
    model: 'linear-fixed',
    series: { concentrations: evenly(5e-3, 7), ratio: line(700) },
    notes: 'Demo data. Reductive quenching expected from the borate’s oxidation potential.',
    story: { started: 24, submitted: 22, decided: { days: 21, status: 'approved' } },
    comment: 'Clean line; the fixed intercept is justified by the blanks. Approved.',
    reviewer: 'ines',
  },
  {
    key: 'ir-aryl-bromide-filter',
    title: 'Demo: HL-Ir-7 (iridium) with the aryl bromide Q-aryl-Br-1, quencher absorbs',
    emitter: 'HL-Ir-7',
    quencher: 'Q-aryl-Br-1',
    owner: 'tomasz',
    series: {
      concentrations: evenly(0.04, 7),
      ratio: line(12),
      absorbancePerMolar: { excitation: 2.4, emission: 0.6 },
    },
    notes: 'Demo data. Absorbances of each sample at 420 nm and at the emission maximum recorded.',
    story: { started: 8, submitted: 5, decided: { days: 4, status: 'returned' } },
    comment: 'The aryl bromide absorbs at 420 nm (A up to 0.1): switch on the inner-filter correction and refit.',
    reviewer: 'ines',
  },
  {
    key: 'ir-amine-dilution',
    title: 'Demo: HL-Ir-7 (iridium) with the amine Q-amine-3, stock without emitter',
    emitter: 'HL-Ir-7',
    quencher: 'Q-amine-3',
    owner: 'priya',
    series: {
      concentrations: evenly(4e-3, 7),
      ratio: line(1600),
      dilution: { initialVolume: 2e-3, stock: 0.025 },
    },
    notes: 'Demo data. The amine stock held no emitter, so the sample was diluted by about 19 % by the end.',
    story: { started: 2 },
  },
  {
    key: 'ru-amine-offset',
    title: 'Demo: HL-Ru-4 (ruthenium) with the amine Q-amine-3, I0 typed from another day',
    emitter: 'HL-Ru-4',
    quencher: 'Q-amine-3',
    owner: 'priya',
    // I0 typed from another day's blank, 12 % above this series' own: the intercept moves off 1.
    i0: I0 * 1.12,
    series: { concentrations: evenly(5e-3, 7).slice(1), ratio: line(400) },
    notes: 'Demo data. No blank in this series; I0 was copied from the previous day.',
    story: { started: 5 },
  },
  {
    key: 'cz-amine-lifetimes',
    title: 'Demo: HL-Cz-2 (carbazole) with the amine Q-amine-3, lifetimes fall faster',
    emitter: 'HL-Cz-2',
    quencher: 'Q-amine-3',
    owner: 'ines',
    series: { concentrations: evenly(2e-3, 7), ratio: line(900), lifetimeRatio: line(1500) },
    notes: 'Demo data. Lifetimes drop faster than intensities.',
    story: { started: 7, submitted: 5, decided: { days: 3, status: 'returned' } },
    comment:
      'Lifetimes fall faster than intensities: was the TCSPC sample the steady-state one? Please check and refit.',
    reviewer: 'tomasz',
  },
  {
    key: 'ir-alkene-decays',
    title: 'Demo: HL-Ir-7 (iridium) with the alkene Q-ene-6, lifetimes from decays',
    emitter: 'HL-Ir-7',
    quencher: 'Q-ene-6',
    owner: 'priya',
    // Lifetimes and tau0 come from the demo decay set (demo-decays.ts), kept with the study a day later.
    series: { concentrations: demoDecayConcentrations, ratio: line(700) },
    notes: 'Demo data. Lifetimes and tau0 fitted from the invented TCSPC titration kept with the study.',
    story: { started: 2 },
  },
  {
    key: 'ru-alkene-blocks',
    title: 'Demo: HL-Ru-4 (ruthenium) with the alkene Q-ene-6, residuals in blocks',
    emitter: 'HL-Ru-4',
    quencher: 'Q-ene-6',
    owner: 'priya',
    series: {
      concentrations: evenly(0.011, 15),
      ratio: line(60),
      // Four readings high, four low, and again: a drifting lamp, not noise.
      wobble: [
        0.006, 0.008, 0.008, 0.006, -0.006, -0.008, -0.008, -0.006, 0.006, 0.008, 0.008, 0.006, -0.006, -0.008, -0.008,
        -0.006,
      ],
    },
    notes: 'Demo data. The lamp warmed up during the run; residuals come in blocks.',
    story: { started: 11 },
  },
  {
    key: 'ir-borate-dropout',
    title: 'Demo: HL-Ir-7 (iridium) with the borate salt Q-borate-9, one reading of zero',
    emitter: 'HL-Ir-7',
    quencher: 'Q-borate-9',
    owner: 'priya',
    series: { concentrations: evenly(3e-3, 7), ratio: line(500), faults: { 4: 0 } },
    notes: 'Demo data. The detector shutter stayed closed for one reading: leave that point out or measure it again.',
    story: { started: 1 },
  },
  {
    key: 'cz-thiol-no-blank',
    title: 'Demo: HL-Cz-2 (carbazole) with the thiol Q-thiol-8, no blank yet',
    emitter: 'HL-Cz-2',
    quencher: 'Q-thiol-8',
    owner: 'priya',
    series: { concentrations: evenly(6e-3, 6).slice(1), ratio: line(350) },
    notes: 'Demo data. The blank of this series still has to be measured.',
    story: { started: 0 },
  },
];

/** T/eta(T) in acetonitrile relative to 25 °C: how a diffusion-controlled constant scales. */
function diffusionScale(temperature: number): number {
  const correlation = getSolvent('acetonitrile').viscosityCorrelation!;
  const at = (t: number) => t / viscosityAt(correlation, t).value;
  return at(temperature) / at(298.15);
}

const celsius = (kelvin: number) => Math.round(kelvin - 273.15);

/*
 * Two temperature series in MeCN (thermostatted cell, invented): HL-Ir-7 with Q-amine-3 beside
 * the 25 °C studies above (dynamic: K_SV follows T/eta), and HL-Ru-4 with Q-aryl-Br-1, a
 * ground-state pair whose constant falls on warming as for dH = -18 kJ/mol (static). tau0 is the
 * 25 °C record in both: the demo keeps the lifetime fixed so kq follows K_SV.
 */
const temperatureSeries: DemoStudy[] = [
  ...[283.15, 313.15, 328.15].map((temperature, i): DemoStudy => ({
    key: `ir-amine-${temperature}`,
    title: `Demo: HL-Ir-7 (iridium) with the amine Q-amine-3 at ${celsius(temperature)} °C`,
    emitter: 'HL-Ir-7',
    quencher: 'Q-amine-3',
    temperature,
    owner: 'ines',
    series: { concentrations: evenly(4e-3, 7), ratio: line(1600 * diffusionScale(temperature)) },
    notes: 'Demo data: temperature series in a thermostatted cell, ±0.1 K (invented).',
    story: { started: 8 - i },
  })),
  ...[283.15, 298.15, 313.15, 328.15].map((temperature, i): DemoStudy => ({
    key: `ru-aryl-bromide-${temperature}`,
    title: `Demo: HL-Ru-4 (ruthenium) with the aryl bromide Q-aryl-Br-1 at ${celsius(temperature)} °C`,
    emitter: 'HL-Ru-4',
    quencher: 'Q-aryl-Br-1',
    temperature,
    owner: 'ines',
    series: {
      concentrations: evenly(5e-3, 7),
      ratio: line(
        12 * diffusionScale(temperature) + 180 * Math.exp((18_000 / 8.314462618) * (1 / temperature - 1 / 298.15)),
      ),
    },
    notes: 'Demo data: temperature series; the pair also changes the absorption spectrum (invented).',
    story: { started: 12 - i },
  })),
];

function points(studyId: string, series: Series) {
  const wobble = series.wobble ?? WOBBLE;
  let added = 0;
  return series.concentrations.map((q, position) => {
    const deviation = wobble[position % wobble.length]!;
    // With dilution, the stock volume that gives this [Q]: q = c V / (V0 + V), so V = q V0 / (c - q).
    const volume = series.dilution ? (q * series.dilution.initialVolume) / (series.dilution.stock - q) : null;
    const dilutionFactor = series.dilution
      ? series.dilution.initialVolume / (series.dilution.initialVolume + volume!)
      : 1;
    const absorbance = series.absorbancePerMolar;
    const innerFilter = absorbance ? 10 ** (-((absorbance.excitation + absorbance.emission) * q) / 2) : 1;
    added = volume ?? added;
    return {
      studyId,
      position,
      concentration: q,
      intensity: series.faults?.[position] ?? ((I0 * dilutionFactor * innerFilter) / series.ratio(q)) * (1 + deviation),
      lifetime: series.lifetimeRatio ? (1 / series.lifetimeRatio(q)) * (1 - deviation / 2) : null,
      absorbanceExcitation: absorbance ? Number((absorbance.excitation * q).toFixed(4)) : null,
      absorbanceEmission: absorbance ? Number((absorbance.emission * q).toFixed(4)) : null,
      volumeAdded: series.dilution ? Number(added.toPrecision(4)) : null,
      uncertainty: null,
      excluded: false,
      exclusionReason: null,
      uploadId: null,
    };
  });
}

/** Adds the demo studies after the demo library, inside the seeding transaction, each at its own time. */
export async function seedDemoStudies(
  transaction: Transaction,
  labs: Record<string, Lab>,
  people: Record<Person, User>,
  library: DemoLibrary,
  clock: DemoClock,
): Promise<void> {
  const lab = labs.marram;
  if (!lab) return;
  const id = (name: string) => {
    const found = library.compounds[name];
    if (!found) throw new Error(`The demo library has no compound named ${name}.`);
    return found;
  };
  const created = new Map<string, Study>();
  for (const demo of [...demoStudies, ...temperatureSeries]) {
    const owner = people[demo.owner];
    const actor = { userId: owner.id, ip: null };
    const typedTau0 = typeof demo.tau0 === 'object' ? demo.tau0 : undefined;
    const record = typedTau0 ? undefined : library.lifetimes[demo.emitter];
    const tau0 = typedTau0 ?? record;
    if (!tau0) throw new Error(`The demo library has no lifetime of ${demo.emitter}.`);
    const model = demo.model ?? 'linear-free';
    clock.set(demo.story.started, 10);
    const study = await Study.create(
      {
        labId: lab.id,
        emitterId: id(demo.emitter),
        quencherId: id(demo.quencher),
        title: demo.title,
        solventId: demo.solventId ?? 'acetonitrile',
        customSolventName: null,
        customViscosity: null,
        temperature: demo.temperature ?? 298.15,
        excitationWavelength: 420,
        emissionWavelength: null,
        windowStart: 470,
        windowEnd: 640,
        atmosphere: 'argon',
        degassingMethod: 'sparging',
        tau0: tau0.value,
        tau0Uncertainty: tau0.uncertainty,
        tau0LifetimeId: record?.id ?? null,
        i0: demo.i0 ?? null,
        dataKind: 'intensity',
        fitModel: model,
        dilutionCorrection: demo.series.dilution !== undefined,
        initialVolume: demo.series.dilution?.initialVolume ?? null,
        stockConcentration: demo.series.dilution?.stock ?? null,
        stockContainsEmitter: false,
        innerFilterCorrection: demo.innerFilterCorrection ?? false,
        pinnedMechanism: null,
        notes: demo.notes,
        ownerId: owner.id,
        previousRevisionId: null,
      },
      { transaction },
    );
    clock.record(actor, 'study_created', lab.id, study.id, { title: demo.title });
    clock.set(demo.story.started, 15);
    const series = points(study.id, demo.series);
    // The lifetimes above are tau/tau0; store them in s.
    for (const point of series) if (point.lifetime !== null) point.lifetime *= tau0.value;
    await StudyPoint.bulkCreate(series, { transaction });
    clock.record(actor, 'study_points_replaced', lab.id, study.id, { count: series.length });
    await refitStudy(study, { trigger: 'auto', actor, transaction });
    if (model !== 'linear-free') clock.record(actor, 'study_fitted', lab.id, study.id, { model, trigger: 'manual' });
    if (demo.story.submitted !== undefined) {
      clock.set(demo.story.submitted, 11);
      await StudyReview.create(
        { studyId: study.id, authorId: owner.id, action: 'submit', comment: '' },
        { transaction },
      );
      clock.record(actor, 'study_submitted', lab.id, study.id, {});
    }
    const decided = demo.story.decided;
    if (decided) {
      const reviewer = people[demo.reviewer ?? 'tomasz'];
      clock.set(decided.days, 16);
      await StudyReview.create(
        {
          studyId: study.id,
          authorId: reviewer.id,
          action: decided.status === 'approved' ? 'approve' : 'return',
          comment: demo.comment ?? '',
        },
        { transaction },
      );
      clock.record(
        { userId: reviewer.id, ip: null },
        decided.status === 'approved' ? 'study_approved' : 'study_returned',
        lab.id,
        study.id,
        { comment: demo.comment ?? '' },
      );
    }
    const status: Status = decided?.status ?? (demo.story.submitted !== undefined ? 'submitted' : 'draft');
    const lastChange = new Date(clock.now().getTime());
    await study.update({ status }, { transaction });
    await Study.update({ updatedAt: lastChange }, { where: { id: study.id }, silent: true, transaction });
    created.set(demo.key, study);
  }
  clock.set(1, 11);
  const withStudy = (key: string) => ({ transaction, lab, owner: people.priya, study: created.get(key)!, clock });
  await seedDemoDecays(withStudy('ir-alkene-decays'));
  await seedDemoAbsorption(withStudy('cz-alkene'));
  await seedDemoExciplex(withStudy('ir-amine-dilution'));
  await seedDemoLibraryDecay({ transaction, lab, owner: people.priya, clock }, library.compounds['HL-Ru-4']!);
}
