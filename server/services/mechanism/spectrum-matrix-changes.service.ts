import { ENGINE_VERSION } from '@shared/engine';
import type {
  SpectraDiscarded,
  SpectrumMatrixReanalysed,
  SpectrumMatrixReanalysis,
} from '@shared/schemas/spectrum-matrices';
import type { SignedInActor } from '../../domain/actor';
import type { LabContext } from '../../domain/lab-context';
import { AppError } from '../../lib/app-error';
import { SpectrumMatrix } from '../../models';
import { recordLabAudit } from '../audit.service';
import * as attached from '../studies/files/attached-files';
import { loadStudyToChange } from '../studies/study-access';
import type { UploadServices } from '../studies/study-upload.service';
import { verdictChange } from './mechanism-evidence.service';
import { releaseMechanismFiles } from './release-mechanism-files';
import { findSpectrumMatrix, toSpectrumMatrix } from './spectrum-matrices.service';

const notFound = () => new AppError('spectrum_matrix_not_found', 'No such spectrum matrix in this study.', 404);

/** What the audit log keeps of one analysis: the band width, the flags, the χ² test's answer and the component count. */
const auditedAnalysis = (analysis: SpectrumMatrix['analysis']) => ({
  bandWidth: analysis.bandWidth,
  flags: analysis.flags.map((flag) => flag.code),
  homogeneous: analysis.homogeneity?.homogeneous ?? null,
  significantComponents: analysis.components.significant,
});

async function findOrRefuse(lab: LabContext, studyId: string, matrixId: string) {
  const row = await findSpectrumMatrix(lab, studyId, matrixId);
  if (!row) throw notFound();
  return row;
}

/**
 * Analyses a kept matrix again from its kept file at another band width: the owner, while the study
 * may change. Nothing changes unless the file reads and the analysis runs (422 naming the problem).
 * The verdict before and after goes into the audit entry with the old and new band width, flags and
 * component count, and comes back beside the matrix.
 */
export async function reanalyseSpectrumMatrix(
  services: UploadServices,
  lab: LabContext,
  studyId: string,
  matrixId: string,
  input: SpectrumMatrixReanalysis,
  actor: SignedInActor,
): Promise<SpectrumMatrixReanalysed> {
  await loadStudyToChange(lab, studyId, actor.userId);
  const row = await findOrRefuse(lab, studyId, matrixId);
  const file = row.file!;
  const outcome = await services.uploadReader.readSpectrumMatrix({
    fileName: file.fileName,
    bytes: await services.files.read({ ...file.get({ plain: true }), kind: 'mechanism-file' }),
    options: { bandWidth: input.bandWidth },
  });
  if (outcome.kind !== 'read') attached.refuseUnread(outcome, 'spectrum_matrix_unreadable', 'Nothing was changed.');
  const verdict = await verdictChange(lab, studyId, { spectrumMatrix: { id: row.id, analysis: outcome.analysis } });
  await services.sequelize.transaction(async (transaction) => {
    await loadStudyToChange(lab, studyId, actor.userId, transaction);
    const locked = await SpectrumMatrix.findOne({
      where: { id: matrixId, labId: lab.id, studyId },
      transaction,
      lock: transaction.LOCK.UPDATE,
    });
    if (!locked) throw notFound();
    const before = auditedAnalysis(locked.analysis);
    await locked.update({ bandWidth: input.bandWidth, ...attached.reanalysedColumns(outcome) }, { transaction });
    await recordLabAudit({ lab, actor, transaction }, 'spectrum_matrix_reanalysed', ['study', studyId], {
      spectrumMatrixId: row.id,
      before,
      after: auditedAnalysis(outcome.analysis),
      verdict: { before: verdict.before, after: verdict.after },
      engineVersion: ENGINE_VERSION,
    });
  });
  return { matrix: toSpectrumMatrix(await findOrRefuse(lab, studyId, matrixId)), verdict };
}

/**
 * Removes a kept matrix and its file (the owner, while the study may change); a file another
 * revision of the study still names stays. The audit entry keeps the file's name and SHA-256, what
 * the matrix said and the verdict before and after. Bytes in object storage are removed after the commit.
 */
export async function discardSpectrumMatrix(
  services: UploadServices,
  lab: LabContext,
  studyId: string,
  matrixId: string,
  actor: SignedInActor,
): Promise<SpectraDiscarded> {
  await loadStudyToChange(lab, studyId, actor.userId);
  await findOrRefuse(lab, studyId, matrixId);
  const verdict = await verdictChange(lab, studyId, { spectrumMatrix: { id: matrixId, analysis: null } });
  const locations = await services.sequelize.transaction(async (transaction) => {
    await loadStudyToChange(lab, studyId, actor.userId, transaction);
    const row = await findSpectrumMatrix(lab, studyId, matrixId, transaction);
    if (!row) throw notFound();
    const file = row.file!;
    await row.destroy({ transaction });
    const released = await releaseMechanismFiles(lab.id, [file], transaction);
    await recordLabAudit({ lab, actor, transaction }, 'spectrum_matrix_discarded', ['study', studyId], {
      spectrumMatrixId: row.id,
      file: { id: file.id, fileName: file.fileName, sha256: file.sha256 },
      fileRemoved: released.removed.length > 0,
      ...auditedAnalysis(row.analysis),
      verdict: { before: verdict.before, after: verdict.after },
    });
    return released.locations;
  });
  for (const location of locations) await services.files.discard(location);
  return { verdict };
}
