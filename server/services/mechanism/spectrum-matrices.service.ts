import crypto from 'node:crypto';
import { ENGINE_VERSION } from '@shared/engine';
import type { SpectrumMatrix as SpectrumMatrixAnswer, SpectrumMatrixOptions } from '@shared/schemas/spectrum-matrices';
import type { SignedInActor } from '../../domain/actor';
import type { LabContext } from '../../domain/lab-context';
import { AppError } from '../../lib/app-error';
import { MechanismFile, SpectrumMatrix, User } from '../../models';
import { recordAudit } from '../audit.service';
import type { ReceivedFile } from '../decays/decay-sets.service';
import { downloadKeptFile, sha256Of } from '../studies/files/raw-file-store';
import { loadStudy, requireEditable, requireOwner } from '../studies/study-access';
import type { UploadServices } from '../studies/study-upload.service';

const withFile = [
  { model: MechanismFile, as: 'file', attributes: { exclude: ['content'] } },
  { model: User, as: 'createdBy', attributes: ['name'] },
];

export function toSpectrumMatrix(row: SpectrumMatrix): SpectrumMatrixAnswer {
  const file = row.file!;
  return {
    id: row.id,
    studyId: row.studyId,
    title: row.title,
    file: {
      id: file.id,
      fileName: file.fileName,
      size: file.size,
      sha256: file.sha256,
      createdAt: file.createdAt.toISOString(),
    },
    reading: row.reading,
    analysis: row.analysis,
    plot: row.plot,
    engineVersion: row.engineVersion,
    createdBy: row.createdBy?.name ?? null,
    createdAt: row.createdAt.toISOString(),
  };
}

/**
 * Reads a spectrum matrix in a reading thread and keeps it with a study: the owner, while the
 * study may change. Unreadable or not analysable: 422 naming the row, column or concentration;
 * over a limit: 413; nothing kept. The bytes go to the file store first, the rows and the audit
 * entry follow in one transaction, and the stored bytes are removed again if it does not commit.
 */
export async function keepSpectrumMatrix(
  services: UploadServices,
  lab: LabContext,
  studyId: string,
  upload: { file: ReceivedFile; options: SpectrumMatrixOptions },
  actor: SignedInActor,
): Promise<SpectrumMatrixAnswer> {
  const study = await loadStudy(lab, studyId);
  requireOwner(study, lab, actor.userId);
  requireEditable(study);
  const { file, options } = upload;
  const outcome = await services.uploadReader.readSpectrumMatrix({
    fileName: file.originalname,
    bytes: file.buffer,
    options,
  });
  if (outcome.kind === 'limit')
    throw new AppError(
      'upload_limit',
      `${outcome.message} Nothing was kept.`,
      outcome.limit === 'seconds' ? 422 : 413,
      [{ path: 'file', message: `over the ${outcome.limit} limit` }],
    );
  if (outcome.kind === 'unreadable')
    throw new AppError(
      'spectrum_matrix_unreadable',
      `${outcome.problems[0]!.message} Nothing was kept.`,
      422,
      outcome.problems.map((problem) => ({
        path: problem.column ? `file.column ${problem.column}` : problem.row ? `file.row ${problem.row}` : 'file',
        message: problem.message,
      })),
    );
  const fileId = crypto.randomUUID();
  const sha256 = await sha256Of(file.buffer);
  const location = await services.files.put({ uploadId: fileId, labId: lab.id, bytes: file.buffer });
  try {
    const matrixId = await services.sequelize.transaction(async (transaction) => {
      await MechanismFile.create(
        {
          ...location,
          id: fileId,
          labId: lab.id,
          fileName: file.originalname.slice(0, 255),
          mediaType: file.mimetype || 'application/octet-stream',
          size: file.buffer.length,
          sha256,
          uploadedById: actor.userId,
        },
        { transaction },
      );
      const matrix = await SpectrumMatrix.create(
        {
          labId: lab.id,
          studyId,
          fileId,
          title: file.originalname.slice(0, 255),
          bandWidth: options.bandWidth,
          reading: outcome.reading,
          analysis: outcome.analysis,
          plot: outcome.plot,
          engineVersion: ENGINE_VERSION,
          createdById: actor.userId,
        },
        { transaction },
      );
      await recordAudit(
        actor,
        {
          action: 'spectrum_matrix_kept',
          labId: lab.id,
          targetType: 'study',
          targetId: studyId,
          details: {
            spectrumMatrixId: matrix.id,
            file: { id: fileId, fileName: file.originalname, size: file.buffer.length, sha256 },
            bandWidth: options.bandWidth,
            flags: outcome.analysis.flags.map((flag) => flag.code),
          },
        },
        transaction,
      );
      return matrix.id;
    });
    const kept = await SpectrumMatrix.findOne({ where: { id: matrixId, labId: lab.id }, include: withFile });
    return toSpectrumMatrix(kept!);
  } catch (error) {
    await services.files.discard(location);
    throw error;
  }
}

/** A study's spectrum matrices, newest first. */
export async function listSpectrumMatrices(lab: LabContext, studyId: string): Promise<SpectrumMatrixAnswer[]> {
  await loadStudy(lab, studyId);
  const rows = await SpectrumMatrix.findAll({
    where: { labId: lab.id, studyId },
    include: withFile,
    order: [['createdAt', 'DESC']],
  });
  return rows.map(toSpectrumMatrix);
}

/** A kept mechanism file exactly as received (checked against its SHA-256). */
export const downloadMechanismFile = (services: UploadServices, lab: LabContext, fileId: string) =>
  downloadKeptFile(services.files, 'mechanism-file', lab.id, fileId);
