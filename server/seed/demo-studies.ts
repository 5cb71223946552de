import type { Transaction } from 'sequelize';
import { Op } from 'sequelize';
import type { FitModel } from '@shared/schemas/studies';
import { Compound, Study, StudyPoint, StudyReview, type Lab, type User } from '../models';
import { refitStudy } from '../services/studies/study-fitting.service';

/*
 * Demo quenching studies for the Marram demo lab. Every title, code and number is INVENTED:
 * the series follow I0/I = (1 + K_D[Q])(1 + K_S[Q]) with made-up constants and a small fixed
 * wobble so they look measured. Nothing here comes from a paper or an instrument.
 */
const WOBBLE = [0, 0.012, -0.009, 0.007, -0.011, 0.006, -0.004, 0.01];
const EXTRA_QUENCHERS = ['Q-thiol-8 (demo)', 'Q-borate-9 (demo)'];

interface DemoStudy {
  title: string;
  emitter: string;
  quencher: string;
  solventId: string;
  tau0: number;
  kD: number;
  kS?: number;
  model?: FitModel;
  maxConcentration: number;
  lifetimes?: boolean;
  status: 'draft' | 'submitted' | 'approved' | 'returned';
  comment?: string;
  notes: string;
}

const demoStudies = (emitters: string[], quenchers: string[]): DemoStudy[] => [
  {
    title: 'Demo: amine quenching of the iridium emitter',
    emitter: emitters[0]!,
    quencher: quenchers[0]!,
    solventId: 'acetonitrile',
    tau0: 1.1e-6,
    kD: 1100,
    maxConcentration: 4e-3,
    lifetimes: true,
    status: 'approved',
    comment: 'Intensity and lifetime slopes agree; approved.',
    notes: 'Demo data. Lifetimes by invented TCSPC runs.',
  },
  {
    title: 'Demo: bipyridinium salt, faster than diffusion',
    emitter: emitters[0]!,
    quencher: quenchers[2] ?? quenchers[0]!,
    solventId: 'acetonitrile',
    tau0: 1.1e-6,
    kD: 26000,
    maxConcentration: 2e-4,
    status: 'submitted',
    notes: 'Demo data. kq above k_diff: check for ion pairing.',
  },
  {
    title: 'Demo: aryl bromide with the carbazole emitter',
    emitter: emitters[1] ?? emitters[0]!,
    quencher: quenchers[1] ?? quenchers[0]!,
    solventId: 'dmf',
    tau0: 4.2e-6,
    kD: 45,
    maxConcentration: 0.05,
    status: 'returned',
    comment: 'Please add a second blank and one point above 50 mM.',
    notes: 'Demo data.',
  },
  {
    title: 'Demo: alkene, plot bends upward',
    emitter: emitters[1] ?? emitters[0]!,
    quencher: quenchers[3] ?? quenchers[0]!,
    solventId: 'acetonitrile',
    tau0: 4.2e-6,
    kD: 300,
    kS: 150,
    maxConcentration: 8e-3,
    status: 'draft',
    notes: 'Demo data. Try the static + dynamic model.',
  },
  {
    title: 'Demo: thiol screen in DMF',
    emitter: emitters[0]!,
    quencher: quenchers[4] ?? quenchers[0]!,
    solventId: 'dmf',
    tau0: 9.5e-7,
    kD: 2500,
    maxConcentration: 2e-3,
    status: 'draft',
    notes: 'Demo data.',
  },
  {
    title: 'Demo: borate salt, reductive pathway expected',
    emitter: emitters[1] ?? emitters[0]!,
    quencher: quenchers[5] ?? quenchers[0]!,
    solventId: 'acetonitrile',
    tau0: 4.2e-6,
    kD: 800,
    maxConcentration: 5e-3,
    status: 'approved',
    comment: 'Fine.',
    notes: 'Demo data.',
  },
];

async function compoundsByRole(labId: string, transaction: Transaction) {
  const found = await Compound.findAll({ where: { labId }, order: [['name', 'ASC']], transaction });
  let emitters = found.filter((c) => c.roleHint === 'photocatalyst').map((c) => c.id);
  let quenchers = found.filter((c) => c.roleHint !== 'photocatalyst').map((c) => c.id);
  if (emitters.length === 0) {
    emitters = [
      (
        await Compound.create(
          {
            labId,
            name: 'HL-Ir-7',
            roleHint: 'photocatalyst',
            notes: 'Demo compound: invented code.',
            createdById: null,
          },
          { transaction },
        )
      ).id,
    ];
  }
  const wanted = [...EXTRA_QUENCHERS, 'Q-amine-3', 'Q-aryl-Br-1', 'Q-viol-5', 'Q-ene-6'];
  for (const name of wanted) {
    if (quenchers.length >= 6) break;
    const exists = await Compound.findOne({ where: { labId, name: { [Op.iLike]: name } }, transaction });
    if (!exists)
      quenchers.push(
        (
          await Compound.create(
            { labId, name, roleHint: 'quencher', notes: 'Demo compound: invented code.', createdById: null },
            { transaction },
          )
        ).id,
      );
  }
  quenchers = [...new Set(quenchers)];
  return { emitters, quenchers };
}

/** Adds the demo studies after the demo library, inside the seeding transaction. */
export async function seedDemoStudies(
  transaction: Transaction,
  labs: Record<string, Lab>,
  users: Record<string, User>,
): Promise<void> {
  const lab = labs.marram;
  const owner = Object.values(users).find((user) => user.email.startsWith('priya'));
  const reviewer = Object.values(users).find((user) => user.email.startsWith('tomasz'));
  if (!lab || !owner || !reviewer) return;
  const { emitters, quenchers } = await compoundsByRole(lab.id, transaction);
  for (const demo of demoStudies(emitters, quenchers)) {
    const study = await Study.create(
      {
        labId: lab.id,
        emitterId: demo.emitter,
        quencherId: demo.quencher,
        title: demo.title,
        solventId: demo.solventId,
        customSolventName: null,
        customViscosity: null,
        temperature: 298.15,
        excitationWavelength: 420,
        emissionWavelength: null,
        windowStart: 470,
        windowEnd: 640,
        atmosphere: 'argon',
        degassingMethod: 'sparging',
        tau0: demo.tau0,
        tau0Uncertainty: demo.tau0 * 0.03,
        tau0LifetimeId: null,
        i0: null,
        dataKind: 'intensity',
        fitModel: demo.kS ? 'static-dynamic' : 'linear-free',
        dilutionCorrection: false,
        initialVolume: null,
        stockConcentration: null,
        stockContainsEmitter: false,
        innerFilterCorrection: false,
        pinnedMechanism: null,
        notes: demo.notes,
        ownerId: owner.id,
        previousRevisionId: null,
      },
      { transaction },
    );
    const steps = 7;
    await StudyPoint.bulkCreate(
      Array.from({ length: steps + 1 }, (_, i) => {
        const q = (demo.maxConcentration * i) / steps;
        const ratio = (1 + demo.kD * q) * (1 + (demo.kS ?? 0) * q);
        return {
          studyId: study.id,
          position: i,
          concentration: q,
          intensity: (12000 / ratio) * (1 + WOBBLE[i]!),
          lifetime: demo.lifetimes ? (demo.tau0 / (1 + demo.kD * q)) * (1 - WOBBLE[i]! / 2) : null,
          absorbanceExcitation: null,
          absorbanceEmission: null,
          volumeAdded: null,
          uncertainty: null,
          excluded: false,
          exclusionReason: null,
          uploadId: null,
        };
      }),
      { transaction },
    );
    await refitStudy(study, { trigger: 'auto', actor: { userId: owner.id, ip: null }, transaction });
    if (demo.status !== 'draft') {
      await StudyReview.create(
        { studyId: study.id, authorId: owner.id, action: 'submit', comment: '' },
        { transaction },
      );
      if (demo.status !== 'submitted')
        await StudyReview.create(
          {
            studyId: study.id,
            authorId: reviewer.id,
            action: demo.status === 'approved' ? 'approve' : 'return',
            comment: demo.comment ?? '',
          },
          { transaction },
        );
      await study.update({ status: demo.status }, { transaction });
    }
  }
}
