import { ENGINE_VERSION } from '@shared/engine';
import { decayReadOptionsSchema } from '@shared/schemas/decays';
import { seededRandom } from '../lib/seeded-random';
import { DecayFile, DecaySet, ExcitedStateLifetime } from '../models';
import { placeDecaySet } from '../services/decays/apply-decay-set.service';
import { methodOf, notesWithBasis } from '../services/decays/decay-sets.service';
import { fitDecaySet } from '../services/decays/fit-decay-set';
import { readDecayTable } from '../services/decays/read-decay-table';
import { DEFAULT_UPLOAD_LIMITS } from '../services/studies/parse/upload-limits';
import { keepDemoFile, keptWithStudy, type DemoLabSeed, type DemoStudySeed } from './demo-files';

/*
 * The demo's decay set: an INVENTED time-resolved titration, so a new person sees decays,
 * their fits and the lifetime Stern–Volmer plot. Every number below is made up: a Gaussian
 * instrument response, single exponentials tau = tau0 / (1 + K_SV [Q]) convolved with it,
 * a few counts of background and Poisson-like noise from a fixed seed, so the file is the same
 * on every load. Nothing here is a measurement.
 */
export const demoDecayFileName = 'demo-tcspc-titration.csv';
const TAU0 = 1.9e-6; // s, as the emitter's demo lifetime record
const K_SV = 700; // M^-1
const CONCENTRATIONS_MM = [0, 0.5, 1, 2, 3, 4];
const CHANNELS = 1024;
const WIDTH = 10e-9; // s per channel
const RESPONSE_CENTRE = 150e-9;
const RESPONSE_FWHM = 25e-9;
const PEAK = 10_000;
const BACKGROUND = 3;

/** A Poisson-like count: exact (Knuth) for small means, the normal approximation above 30. */
function noisy(mean: number, random: () => number): number {
  if (mean < 30) {
    const limit = Math.exp(-mean);
    let count = 0;
    for (let product = random(); product > limit; product *= random()) count++;
    return count;
  }
  const normal = Math.sqrt(-2 * Math.log(1 - random())) * Math.cos(2 * Math.PI * random());
  return Math.max(0, Math.round(mean + Math.sqrt(mean) * normal));
}

/** Steps per channel of the fine grid the invented curves are made on, then summed per channel. */
const FINE = 16;

/** Sums each channel's FINE steps: what a histogram channel collects. */
const perChannel = (fine: number[]) =>
  Array.from({ length: CHANNELS }, (_, i) => fine.slice(i * FINE, (i + 1) * FINE).reduce((sum, v) => sum + v, 0));

/** The invented file: time (ns), the response, and one decay per concentration with [Q] in its header. */
export function demoDecayFile(): Buffer {
  return inventedDecayFile(
    CONCENTRATIONS_MM.map((mM) => ({ header: `[Q] ${mM} mM`, lifetime: TAU0 / (1 + K_SV * mM * 1e-3) })),
    20261202,
  );
}

/** An invented TCSPC file: time (ns), the response as a column "IRF", and one decay per lifetime (s). */
function inventedDecayFile(decays: ReadonlyArray<{ header: string; lifetime: number }>, seed: number): Buffer {
  const random = seededRandom(seed);
  const sigma = RESPONSE_FWHM / (2 * Math.sqrt(2 * Math.LN2));
  const step = WIDTH / FINE;
  const pulse = Array.from({ length: CHANNELS * FINE }, (_, i) =>
    Math.exp(-(((i + 0.5) * step - RESPONSE_CENTRE) ** 2) / (2 * sigma ** 2)),
  );
  const response = perChannel(pulse);
  const responseTop = Math.max(...response);
  const columns = [
    response.map((value) => noisy((5000 * value) / responseTop, random)),
    ...decays.map(({ lifetime }) => {
      const decay = Math.exp(-step / lifetime);
      // The pulse convolved with the exponential on the fine grid (recursive form), then per channel.
      const fine: number[] = [];
      pulse.forEach((value, i) => fine.push(value + (i > 0 ? fine[i - 1]! * decay : 0)));
      const ideal = perChannel(fine);
      const top = Math.max(...ideal);
      return ideal.map((value) => noisy((PEAK * value) / top + BACKGROUND, random));
    }),
  ];
  const headers = ['time (ns)', 'IRF', ...decays.map(({ header }) => header)];
  const rows = Array.from({ length: CHANNELS }, (_, i) =>
    [(i * WIDTH * 1e9).toFixed(1), ...columns.map((column) => column[i]!)].join(','),
  );
  return Buffer.from(`${[headers.join(','), ...rows].join('\n')}\n`);
}

/** The [Q] of the demo's decays in mol/L, for the study they belong to. */
export const demoDecayConcentrations = CONCENTRATIONS_MM.map((mM) => mM * 1e-3);

/**
 * Keeps the invented decay set with the study (the file on its row, as the default file store
 * does) and puts its lifetimes and tau0 into the study, as "use these lifetimes" would.
 */
export async function seedDemoDecays(seed: DemoStudySeed): Promise<void> {
  const { transaction, lab, owner, study, clock } = seed;
  const actor = { userId: owner.id, ip: null };
  const bytes = demoDecayFile();
  const options = decayReadOptionsSchema.parse({});
  const reading = fitDecaySet(await readDecayTable(demoDecayFileName, bytes, DEFAULT_UPLOAD_LIMITS), null, options);
  const failed = reading.outcomes.find((outcome) => outcome.problem !== null);
  if (reading.questions.length > 0 || failed)
    throw new Error(`The demo decay set does not fit: ${reading.questions[0] ?? failed?.problem}`);
  const file = await keepDemoFile(DecayFile, seed, demoDecayFileName, bytes);
  const set = await DecaySet.create(
    {
      ...keptWithStudy(seed),
      compoundId: null,
      lifetimeId: null,
      title: demoDecayFileName,
      fileId: file.id,
      responseFileId: null,
      reading: reading.summary,
      options: { ...options, model: reading.model, show: 0 },
      outcomes: reading.outcomes,
    },
    { transaction },
  );
  clock.record(actor, 'decay_set_kept', lab.id, study.id, {
    decaySetId: set.id,
    files: [file],
    decays: reading.outcomes.length,
  });
  await placeDecaySet(study, set, actor, transaction);
}

/*
 * The demo's library decay: one INVENTED decay of the emitter HL-Ru-4 (tau = 0.93 us, made up,
 * near its invented library lifetime), made like the titration above, kept on the compound's page
 * as a lifetime record "from decay", as keeping one decay on a compound page does.
 */
export const demoLibraryDecayFileName = 'demo-hl-ru-4-decay.csv';
export const demoLibraryDecayLifetime = 9.3e-7; // s, invented

/** The invented file of the library decay: the response and one decay. */
export const demoLibraryDecayFile = () =>
  inventedDecayFile([{ header: 'HL-Ru-4 in MeCN under argon', lifetime: demoLibraryDecayLifetime }], 20261203);

/** Keeps the invented decay with the compound and adds the lifetime record it gives. */
export async function seedDemoLibraryDecay(seed: DemoLabSeed, compoundId: string): Promise<void> {
  const { transaction, lab, owner, clock } = seed;
  const actor = { userId: owner.id, ip: null };
  const bytes = demoLibraryDecayFile();
  const options = decayReadOptionsSchema.parse({});
  const reading = fitDecaySet(
    await readDecayTable(demoLibraryDecayFileName, bytes, DEFAULT_UPLOAD_LIMITS),
    null,
    options,
  );
  const lifetime = reading.outcomes.length === 1 ? reading.outcomes[0]!.lifetime : null;
  if (reading.questions.length > 0 || !lifetime)
    throw new Error(`The demo library decay does not fit: ${reading.questions[0] ?? reading.outcomes[0]?.problem}`);
  const file = await keepDemoFile(DecayFile, seed, demoLibraryDecayFileName, bytes);
  const set = await DecaySet.create(
    {
      labId: lab.id,
      studyId: null,
      compoundId,
      lifetimeId: null,
      title: demoLibraryDecayFileName,
      fileId: file.id,
      responseFileId: null,
      reading: reading.summary,
      options: { ...options, model: reading.model, show: 0 },
      outcomes: reading.outcomes,
      engineVersion: ENGINE_VERSION,
      createdById: owner.id,
    },
    { transaction },
  );
  const record = await ExcitedStateLifetime.create(
    {
      labId: lab.id,
      compoundId,
      value: lifetime.value,
      uncertainty: lifetime.standardError,
      solvent: 'acetonitrile',
      atmosphere: 'argon',
      temperature: 298.15,
      method: methodOf(reading.model),
      source: `from decay ${demoLibraryDecayFileName}`,
      notes: notesWithBasis('Demo record: an invented decay file, not a measurement.', lifetime.basis),
      createdById: owner.id,
    },
    { transaction },
  );
  await set.update({ lifetimeId: record.id }, { transaction });
  clock.record(
    actor,
    'decay_set_kept',
    lab.id,
    compoundId,
    { decaySetId: set.id, files: [file], decays: 1 },
    'compound',
  );
  clock.record(
    actor,
    'lifetime_added',
    lab.id,
    record.id,
    { decaySetId: set.id, value: record.value, uncertainty: record.uncertainty, source: record.source },
    'lifetime',
  );
}
