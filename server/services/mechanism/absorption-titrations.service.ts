import { compareAssociationConstants, type AbsorptionEvidence } from '@shared/engine';
import type {
  AbsorptionAnalysisAnswer,
  AbsorptionComparisonAnswer,
  AbsorptionOptions,
  AbsorptionPreview,
  AbsorptionSettings,
  AbsorptionTitration as AbsorptionTitrationAnswer,
  AssociationFit,
} from '@shared/schemas/absorption-titrations';
import type { SignedInActor } from '../../domain/actor';
import type { LabContext } from '../../domain/lab-context';
import { AppError } from '../../lib/app-error';
import { AbsorptionTitration, MechanismFile, StudyFit, User, type Study } from '../../models';
import { recordLabAudit } from '../audit.service';
import * as attached from '../studies/files/attached-files';
import { loadStudy, loadStudyToChange } from '../studies/study-access';
import type { UploadServices } from '../studies/study-upload.service';
import type { AbsorptionTitrationOutcome } from './read-absorption-titration';

export interface AbsorptionUpload {
  file: attached.ReceivedFile;
  quencher: attached.ReceivedFile | null;
  options: AbsorptionOptions;
}

type ReadOutcome = Extract<AbsorptionTitrationOutcome, { kind: 'read' }>;

export const withFiles = [
  attached.fileRowWithoutBytes(MechanismFile, 'file'),
  attached.fileRowWithoutBytes(MechanismFile, 'quencherFile'),
  { model: User, as: 'createdBy', attributes: ['name'] },
];

/** Reads in a reading thread; a limit is 413 (422 for time), an unreadable file or analysis 422 naming it; nothing kept (or changed). */
export async function readOrRefuse(
  services: UploadServices,
  upload: AbsorptionUpload,
  consequence = 'Nothing was kept.',
): Promise<ReadOutcome> {
  const outcome = await services.uploadReader.readAbsorptionTitration({
    fileName: upload.file.originalname,
    bytes: upload.file.buffer,
    quencher: upload.quencher ? { fileName: upload.quencher.originalname, bytes: upload.quencher.buffer } : null,
    options: upload.options,
  });
  if (outcome.kind === 'limit') attached.refuseOverLimit(outcome, consequence);
  if (outcome.kind === 'unreadable')
    throw new AppError(
      'absorption_titration_unreadable',
      `${outcome.problems[0]!.message} ${consequence}`,
      422,
      outcome.problems.map((problem) => ({
        path: problem.row ? `file.row ${problem.row}` : problem.column ? `file.column ${problem.column}` : 'file',
        message: problem.message,
      })),
    );
  return outcome;
}

/** How a kept titration is analysed; rows kept before re-analysis existed take out a kept quencher file and use the isotherm. */
export function settingsOf(row: Pick<AbsorptionTitration, 'options' | 'quencherFileId'>): AbsorptionSettings {
  const { subtractQuencher, associationFit, ...options } = row.options;
  return {
    ...options,
    subtractQuencher: subtractQuencher ?? row.quencherFileId !== null,
    associationFit: associationFit ?? 'isotherm',
  };
}

const FIT_WORDS: Record<AssociationFit, string> = {
  isotherm: 'the 1:1 isotherm',
  'benesi-hildebrand': 'the Benesi–Hildebrand line',
};

/**
 * The K_a a titration offers: the chosen fit's, else the other's when the chosen one gave none
 * (with the words saying so); null when the absorption does not change or neither fit.
 */
export function chosenAssociation(analysis: Pick<AbsorptionAnalysisAnswer, 'binding'>, choice: AssociationFit) {
  const binding = analysis.binding;
  if (!binding) return null;
  const fits = { isotherm: binding.isotherm, 'benesi-hildebrand': binding.benesiHildebrand };
  const other: AssociationFit = choice === 'isotherm' ? 'benesi-hildebrand' : 'isotherm';
  const chosen = fits[choice].fit;
  if (chosen) return { fit: chosen, words: `K_a from ${FIT_WORDS[choice]}.` };
  const fallback = fits[other].fit;
  if (!fallback) return null;
  return {
    fit: fallback,
    words: `${FIT_WORDS[choice].replace(/^the/, 'The')} gave no K_a (${fits[choice].problem ?? 'no fit'}); K_a from ${FIT_WORDS[other]}.`,
  };
}

/**
 * K_a against K_S of the study's latest combined static+dynamic fit, worked out when read (the
 * fit may change after the titration is kept). A fit that could not tell K_S from K_D offers its
 * two roots: the one nearer K_a is taken, and the source says so.
 */
export async function comparisonFor(
  study: Study,
  analysis: AbsorptionAnalysisAnswer,
  associationFit: AssociationFit = 'isotherm',
): Promise<AbsorptionComparisonAnswer> {
  const none = (source: string): AbsorptionComparisonAnswer => ({
    kS: null,
    source,
    benesiHildebrand: null,
    isotherm: null,
  });
  const fit = study.latestFitId ? await StudyFit.findByPk(study.latestFitId) : null;
  if (!fit || fit.model !== 'static-dynamic')
    return none('No K_S: fit the study with the combined static and dynamic model to compare.');
  const kA = chosenAssociation(analysis, associationFit)?.fit.kA ?? null;
  const parameters = fit.result.parameters;
  let kS = parameters.kS ?? null;
  let source = "K_S of the study's combined static and dynamic fit.";
  if (!kS && parameters.largerRoot && parameters.smallerRoot && kA) {
    const [larger, smaller] = [parameters.largerRoot, parameters.smallerRoot];
    kS = Math.abs(larger.value - kA.value) <= Math.abs(smaller.value - kA.value) ? larger : smaller;
    source = `The combined fit could not tell K_S from K_D; its root nearer K_a (${kS === larger ? 'the larger' : 'the smaller'}) is taken as K_S.`;
  }
  if (!kS) return none('No K_S: the combined fit gave no static constant.');
  if (!analysis.binding) return { ...none('No K_a: the absorption does not change, so nothing to compare.'), kS };
  const { benesiHildebrand, isotherm } = analysis.binding;
  return {
    kS,
    source,
    benesiHildebrand: benesiHildebrand.fit ? compareAssociationConstants(benesiHildebrand.fit.kA, kS) : null,
    isotherm: isotherm.fit ? compareAssociationConstants(isotherm.fit.kA, kS) : null,
  };
}

/** Reads and analyses a titration as chosen and answers what was found; keeps nothing. */
export async function previewAbsorptionTitration(
  services: UploadServices,
  lab: LabContext,
  studyId: string,
  upload: AbsorptionUpload,
): Promise<AbsorptionPreview> {
  const study = await loadStudy(lab, studyId);
  const outcome = await readOrRefuse(services, upload);
  const { quencher, ...reading } = outcome.reading;
  return {
    reading,
    quencher,
    analysis: outcome.analysis,
    plot: outcome.plot,
    comparison: await comparisonFor(study, outcome.analysis),
  };
}

export async function toAnswer(row: AbsorptionTitration, study: Study): Promise<AbsorptionTitrationAnswer> {
  const { quencher, ...reading } = row.reading;
  const settings = settingsOf(row);
  return {
    id: row.id,
    studyId: row.studyId,
    title: row.title,
    file: attached.keptFileAnswer(row.file!),
    quencherFile: row.quencherFile ? attached.keptFileAnswer(row.quencherFile) : null,
    options: settings,
    reading,
    quencher,
    analysis: row.analysis,
    plot: row.plot,
    comparison: await comparisonFor(study, row.analysis, settings.associationFit),
    engineVersion: row.engineVersion,
    createdBy: row.createdBy?.name ?? null,
    createdAt: row.createdAt.toISOString(),
  };
}

/**
 * Reads an absorption titration in a reading thread and keeps it with a study: the owner, while
 * the study may change. The bytes go to the file store first; the rows and the audit entry follow
 * in one transaction, and the stored bytes are removed again if it does not commit.
 */
export async function keepAbsorptionTitration(
  services: UploadServices,
  lab: LabContext,
  studyId: string,
  upload: AbsorptionUpload,
  actor: SignedInActor,
): Promise<AbsorptionTitrationAnswer> {
  const study = await loadStudyToChange(lab, studyId, actor.userId);
  const outcome = await readOrRefuse(services, upload);
  const received = [upload.file, ...(upload.quencher ? [upload.quencher] : [])];
  const titrationId = await attached.keepWithFiles(
    services,
    lab,
    actor,
    MechanismFile,
    received,
    async (kept, transaction) => {
      const titration = await AbsorptionTitration.create(
        {
          ...attached.analysedRecordColumns(lab, studyId, actor, outcome),
          fileId: kept[0]!.id,
          quencherFileId: kept[1]?.id ?? null,
          kind: 'absorption',
          title: upload.file.originalname.slice(0, 255),
          bandWidth: upload.options.bandWidth,
          options: upload.options,
        },
        { transaction },
      );
      await recordLabAudit({ lab, actor, transaction }, 'absorption_titration_kept', ['study', studyId], {
        absorptionTitrationId: titration.id,
        files: kept.map(attached.keptFileDetails),
        options: upload.options,
        flags: outcome.analysis.flags.map((flag) => flag.code),
      });
      return titration.id;
    },
  );
  const row = await AbsorptionTitration.findOne({ where: { id: titrationId, labId: lab.id }, include: withFiles });
  return toAnswer(row!, study);
}

/** A study's absorption titrations, newest first, each compared with the study's current K_S. */
export async function listAbsorptionTitrations(lab: LabContext, studyId: string): Promise<AbsorptionTitrationAnswer[]> {
  const study = await loadStudy(lab, studyId);
  const rows = await attached.listOfStudy(AbsorptionTitration, lab, studyId, withFiles);
  return Promise.all(rows.map((row) => toAnswer(row, study)));
}

/**
 * What the study's newest absorption titration says, for the combined mechanism verdict
 * (readMechanismPieces); null without a titration.
 */
export async function absorptionEvidenceForStudy(lab: LabContext, studyId: string): Promise<AbsorptionEvidence | null> {
  await loadStudy(lab, studyId);
  const row = await AbsorptionTitration.findOne({
    where: { labId: lab.id, studyId },
    attributes: ['analysis', 'options', 'quencherFileId'],
    order: [['createdAt', 'DESC']],
  });
  return row ? absorptionEvidenceOf(row.analysis, settingsOf(row).associationFit) : null;
}

/**
 * What one absorption analysis says: whether the absorption changes beyond the sum of the parts,
 * in words, and K_a of the chosen fit (chosenAssociation, the isotherm unless the titration was
 * analysed again with Benesi–Hildebrand) where one was fitted.
 */
export function absorptionEvidenceOf(
  analysis: Pick<AbsorptionAnalysisAnswer, 'binding' | 'flags' | 'largestChange' | 'threshold'>,
  associationFit: AssociationFit = 'isotherm',
): AbsorptionEvidence {
  const association = chosenAssociation(analysis, associationFit);
  const flag = analysis.flags[0];
  const detail = flag
    ? `${flag.title}. ${flag.detail}${association ? ` ${association.words}` : ''}`
    : `The absorption is the sum of emitter and quencher within the noise: the largest change, ΔA = ${analysis.largestChange.change.toPrecision(2)} at ${analysis.largestChange.centre} nm, is ${analysis.largestChange.z.toPrecision(2)} noise SDs against a bound of ${analysis.threshold.z.toPrecision(3)}.`;
  return {
    changed: analysis.flags.length > 0,
    detail,
    associationConstant: association
      ? { value: association.fit.kA.value, standardError: association.fit.kA.standardError }
      : null,
  };
}
