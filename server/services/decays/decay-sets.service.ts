import type { Transaction } from 'sequelize';
import { ENGINE_VERSION } from '@shared/engine';
import type {
  DecayCurves,
  DecayLifetime,
  DecayModel,
  DecayOutcome,
  DecayPreview,
  DecayReadOptions,
  DecaySet as DecaySetAnswer,
} from '@shared/schemas/decays';
import { AppError } from '../../lib/app-error';
import type { LabContext } from '../../domain/lab-context';
import type { SignedInActor } from '../../domain/actor';
import { DecayFile, DecaySet, ExcitedStateLifetime, User } from '../../models';
import type { Atmosphere } from '../../models/excited-state-lifetime.model';
import { findCompound } from '../library/library-access.service';
import { recordLabAudit, type AuditTarget } from '../audit.service';
import * as attached from '../studies/files/attached-files';
import { downloadKeptFile } from '../studies/files/raw-file-store';
import { loadStudy, loadStudyToChange } from '../studies/study-access';
import type { UploadServices } from '../studies/study-upload.service';
import { decaySternVolmer } from './decay-stern-volmer';

export interface DecayUpload {
  file: attached.ReceivedFile;
  response: attached.ReceivedFile | null;
  options: DecayReadOptions;
}

export interface ReadRequest {
  file: { fileName: string; bytes: Buffer };
  response: { fileName: string; bytes: Buffer } | null;
  options: DecayReadOptions;
  stored?: DecayOutcome[];
}

async function read(services: UploadServices, request: ReadRequest) {
  const outcome = await services.uploadReader.readDecays({
    fileName: request.file.fileName,
    bytes: request.file.bytes,
    response: request.response,
    options: request.options,
    stored: request.stored ?? null,
  });
  if (outcome.kind !== 'read') attached.refuseUnread(outcome, 'decay_unreadable');
  return outcome;
}

const asFile = (file: attached.ReceivedFile) => ({ fileName: file.originalname, bytes: file.buffer });

/**
 * Reads and fits a set that is to be kept: only when every decay is read and fitted and nothing
 * is left to choose (else 422 naming the decay; the caller keeps nothing).
 */
export async function readToKeep(services: UploadServices, request: ReadRequest) {
  const outcome = await read(services, request);
  if (outcome.questions.length > 0)
    throw new AppError(
      'decay_choice_needed',
      `Nothing was kept: ${outcome.questions[0]}`,
      422,
      outcome.questions.map((question) => ({ path: 'body.options', message: question })),
    );
  const failed = outcome.outcomes.filter((decay) => decay.problem !== null);
  if (failed.length > 0)
    throw new AppError(
      'decay_not_fittable',
      `Nothing was kept: decay "${failed[0]!.label}" cannot be fitted: ${failed[0]!.problem} Mark it "ignore" or change the model.`,
      422,
      failed.map((decay) => ({ path: `file.column ${decay.label}`, message: decay.problem! })),
    );
  return outcome;
}

/** A kept set's files as read again from the file store. */
export async function keptFilesOf(services: UploadServices, set: DecaySet) {
  const bytes = async (file: DecayFile) => ({
    fileName: file.fileName,
    bytes: await services.files.read({ ...file.get({ plain: true }), kind: 'decay-file' }),
  });
  return { file: await bytes(set.file!), response: set.responseFile ? await bytes(set.responseFile) : null };
}

/** Reads and fits what was sent as chosen and answers what was found; keeps nothing. */
async function previewOf(services: UploadServices, upload: DecayUpload): Promise<DecayPreview> {
  const outcome = await read(services, {
    file: asFile(upload.file),
    response: upload.response ? asFile(upload.response) : null,
    options: upload.options,
  });
  return {
    ...outcome.summary,
    fileName: upload.file.originalname,
    responseFileName: upload.response?.originalname ?? null,
    model: outcome.model,
    outcomes: outcome.outcomes,
    shown: outcome.shown,
    questions: outcome.questions,
  };
}

/**
 * Reads and fits a decay file (and its response file) as chosen and answers what it found;
 * nothing is kept. Any member who may add data to the study may look.
 */
export async function previewDecaySet(
  services: UploadServices,
  lab: LabContext,
  studyId: string,
  upload: DecayUpload,
): Promise<DecayPreview> {
  await loadStudy(lab, studyId);
  return previewOf(services, upload);
}

/** What keepLibraryDecay refuses when a file does not hold exactly one decay. */
const oneDecayNeeded = (count: number) =>
  `a library lifetime comes from one decay, and the file holds ${count}; mark the others "ignore".`;

/**
 * The same look for one decay of an emitter on its way to the library: the compound must be in
 * the lab, and a file that does not hold exactly one decay gets the question keeping would
 * refuse it with, so the screen says so before the click.
 */
export async function previewLibraryDecay(
  services: UploadServices,
  lab: LabContext,
  compoundId: string,
  upload: DecayUpload,
): Promise<DecayPreview> {
  await findCompound(lab, compoundId);
  const preview = await previewOf(services, upload);
  if (preview.outcomes.length === 1) return preview;
  const question = oneDecayNeeded(preview.outcomes.length);
  return { ...preview, questions: [...preview.questions, `${question[0]!.toUpperCase()}${question.slice(1)}`] };
}

/** The answer for a kept set, with its files' names and hashes. */
export function toDecaySet(set: DecaySet): DecaySetAnswer {
  const { sternVolmer, problem } = decaySternVolmer(set.outcomes);
  return {
    ...set.reading,
    id: set.id,
    title: set.title,
    studyId: set.studyId,
    compoundId: set.compoundId,
    lifetimeId: set.lifetimeId,
    file: attached.keptFileAnswer(set.file!),
    responseFile: set.responseFile ? attached.keptFileAnswer(set.responseFile) : null,
    model: set.options.model,
    countRate: set.options.countRate,
    repetitionRate: set.options.repetitionRate,
    outcomes: set.outcomes,
    sternVolmer,
    sternVolmerProblem: problem,
    engineVersion: set.engineVersion,
    createdBy: set.createdBy?.name ?? null,
    createdById: set.createdById,
    version: set.version,
    createdAt: set.createdAt.toISOString(),
  };
}

const withFiles = [
  attached.fileRowWithoutBytes(DecayFile, 'file'),
  attached.fileRowWithoutBytes(DecayFile, 'responseFile'),
  { model: User, as: 'createdBy', attributes: ['name'] },
];

/** The decay set in this lab (404 otherwise), with its files but not their bytes. */
export async function findDecaySet(lab: LabContext, setId: string): Promise<DecaySet> {
  const set = await DecaySet.findOne({ where: { id: setId, labId: lab.id }, include: withFiles });
  if (!set) throw new AppError('not_found', 'No decay set with this id in this lab.', 404);
  return set;
}

/** What a decay set's audit events are about: its study, or the compound whose lifetime it gives. */
export const decaySetTarget = (set: { studyId: string | null; compoundId: string | null }): AuditTarget =>
  set.studyId ? ['study', set.studyId] : ['compound', set.compoundId!];

/**
 * Keeps a decay set: only when every decay is read and fitted and nothing is left to choose
 * (else 422 naming the decay, nothing kept). The bytes go to the file store first; the rows and
 * the audit entry follow in one transaction, and the stored bytes are removed again if it does
 * not commit.
 */
export async function keepDecaySet(
  services: UploadServices,
  lab: LabContext,
  target: { studyId: string | null; compoundId: string | null },
  upload: DecayUpload,
  actor: SignedInActor,
  extra: (set: DecaySet, transaction: Transaction) => Promise<void> = async () => {},
): Promise<DecaySet> {
  const outcome = await readToKeep(services, {
    file: asFile(upload.file),
    response: upload.response ? asFile(upload.response) : null,
    options: upload.options,
  });
  const received = [upload.file, ...(upload.response ? [upload.response] : [])];
  const setId = await attached.keepWithFiles(services, lab, actor, DecayFile, received, async (kept, transaction) => {
    const set = await DecaySet.create(
      {
        labId: lab.id,
        studyId: target.studyId,
        compoundId: target.compoundId,
        lifetimeId: null,
        title: upload.file.originalname.slice(0, 255),
        fileId: kept[0]!.id,
        responseFileId: kept[1]?.id ?? null,
        reading: outcome.summary,
        options: { ...upload.options, model: outcome.model, show: 0 },
        outcomes: outcome.outcomes,
        engineVersion: ENGINE_VERSION,
        createdById: actor.userId,
      },
      { transaction },
    );
    await recordLabAudit({ lab, actor, transaction }, 'decay_set_kept', decaySetTarget(target), {
      decaySetId: set.id,
      files: kept.map(attached.keptFileDetails),
      decays: outcome.outcomes.length,
    });
    await extra(set, transaction);
    return set.id;
  });
  return findDecaySet(lab, setId);
}

/** A study's decay sets, newest first. */
export async function listStudyDecaySets(lab: LabContext, studyId: string): Promise<DecaySetAnswer[]> {
  return (await attached.listOfStudy(DecaySet, lab, studyId, withFiles)).map(toDecaySet);
}

/** A compound's decay sets (each a single decay that gave or gives a lifetime record), newest first; 404 for a compound of another lab. */
export async function listCompoundDecaySets(lab: LabContext, compoundId: string): Promise<DecaySetAnswer[]> {
  await findCompound(lab, compoundId);
  const sets = await DecaySet.findAll({
    where: { labId: lab.id, compoundId },
    include: withFiles,
    order: [['createdAt', 'DESC']],
  });
  return sets.map(toDecaySet);
}

/** Keeps a decay set of a study: the owner, while the study may change. */
export async function keepStudyDecaySet(
  services: UploadServices,
  lab: LabContext,
  studyId: string,
  upload: DecayUpload,
  actor: SignedInActor,
): Promise<DecaySetAnswer> {
  await loadStudyToChange(lab, studyId, actor.userId);
  return toDecaySet(await keepDecaySet(services, lab, { studyId, compoundId: null }, upload, actor));
}

/** The curves of one decay of a kept set, drawn again from its files and stored choices in a reading thread. */
export async function decaySetCurves(
  services: UploadServices,
  lab: LabContext,
  setId: string,
  index: number,
): Promise<DecayCurves> {
  const set = await findDecaySet(lab, setId);
  if (index >= set.outcomes.length)
    throw new AppError('not_found', `The set holds decays 0 to ${set.outcomes.length - 1}.`, 404);
  const outcome = await read(services, {
    ...(await keptFilesOf(services, set)),
    options: { ...set.options, show: index },
    stored: set.outcomes,
  });
  if (!outcome.shown) throw new AppError('not_found', 'This decay has no curves.', 404);
  return outcome.shown;
}

/** A kept decay file exactly as received (checked against its SHA-256). */
export const downloadDecayFile = (services: UploadServices, lab: LabContext, fileId: string) =>
  downloadKeptFile(services.files, 'decay-file', lab.id, fileId);

/** The method text a lifetime record from a decay carries, e.g. "TCSPC decay fit: 1 exponential by reconvolution, Poisson likelihood". */
export const methodOf = (model: DecayModel) =>
  `TCSPC decay fit: ${model.components} exponential${model.components === 1 ? '' : 's'} ${
    model.method === 'tail' ? 'as a tail fit' : 'by reconvolution'
  }, ${model.estimator === 'poisson' ? 'Poisson likelihood' : 'weighted least squares'}`;

const MEAN_NOTE = 'Amplitude-weighted mean lifetime of the fit.';

/** A lifetime record's notes, opening with the sentence that says when its value is a mean of several exponentials. */
export const notesWithBasis = (notes: string, basis: DecayLifetime['basis']) =>
  [basis === 'amplitude-weighted-mean' ? MEAN_NOTE : '', notes.replace(MEAN_NOTE, '').trim()].filter(Boolean).join(' ');

/**
 * Keeps a single decay of an emitter and makes it a lifetime record of the library with the
 * decay file as its source ("from decay <file>"): tau of one exponential, else the
 * amplitude-weighted mean (said in the notes). Refused (422, nothing kept) unless the file
 * holds exactly one decay that fits.
 */
export async function keepLibraryDecay(
  services: UploadServices,
  lab: LabContext,
  compoundId: string,
  upload: DecayUpload & { conditions: { solvent: string; atmosphere: Atmosphere; temperature: number; notes: string } },
  actor: SignedInActor,
): Promise<DecaySetAnswer> {
  await findCompound(lab, compoundId);
  const set = await keepDecaySet(
    services,
    lab,
    { studyId: null, compoundId },
    upload,
    actor,
    async (kept, transaction) => {
      if (kept.outcomes.length !== 1)
        throw new AppError('one_decay_needed', `Nothing was kept: ${oneDecayNeeded(kept.outcomes.length)}`, 422, [
          { path: 'body.options.columns', message: `${kept.outcomes.length} decays` },
        ]);
      const lifetime = kept.outcomes[0]!.lifetime!;
      const { conditions } = upload;
      const record = await ExcitedStateLifetime.create(
        {
          labId: lab.id,
          compoundId,
          value: lifetime.value,
          uncertainty: lifetime.standardError,
          solvent: conditions.solvent,
          atmosphere: conditions.atmosphere,
          temperature: conditions.temperature,
          method: methodOf(kept.options.model),
          source: `from decay ${upload.file.originalname}`.slice(0, 400),
          notes: notesWithBasis(conditions.notes, lifetime.basis),
          createdById: actor.userId,
        },
        { transaction },
      );
      await kept.update({ lifetimeId: record.id }, { transaction });
      await recordLabAudit({ lab, actor, transaction }, 'lifetime_added', ['lifetime', record.id], {
        decaySetId: kept.id,
        value: record.value,
        uncertainty: record.uncertainty,
        source: record.source,
      });
    },
  );
  return toDecaySet(set);
}
