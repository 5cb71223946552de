import type { Transaction } from 'sequelize';
import type { SpectrumMatrix as SpectrumMatrixAnswer, SpectrumMatrixOptions } from '@shared/schemas/spectrum-matrices';
import type { SignedInActor } from '../../domain/actor';
import type { LabContext } from '../../domain/lab-context';
import { MechanismFile, SpectrumMatrix, User } from '../../models';
import { recordLabAudit } from '../audit.service';
import * as attached from '../studies/files/attached-files';
import { downloadKeptFile } from '../studies/files/raw-file-store';
import { loadStudyToChange } from '../studies/study-access';
import type { UploadServices } from '../studies/study-upload.service';

const withFile = [
  attached.fileRowWithoutBytes(MechanismFile, 'file'),
  { model: User, as: 'createdBy', attributes: ['name'] },
];

export function toSpectrumMatrix(row: SpectrumMatrix): SpectrumMatrixAnswer {
  return {
    id: row.id,
    studyId: row.studyId,
    title: row.title,
    file: attached.keptFileAnswer(row.file!),
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
  upload: { file: attached.ReceivedFile; options: SpectrumMatrixOptions },
  actor: SignedInActor,
): Promise<SpectrumMatrixAnswer> {
  await loadStudyToChange(lab, studyId, actor.userId);
  const { file, options } = upload;
  const outcome = await services.uploadReader.readSpectrumMatrix({
    fileName: file.originalname,
    bytes: file.buffer,
    options,
  });
  if (outcome.kind !== 'read') attached.refuseUnread(outcome, 'spectrum_matrix_unreadable');
  const matrixId = await attached.keepWithFiles(
    services,
    lab,
    actor,
    MechanismFile,
    [file],
    async ([kept], transaction) => {
      const matrix = await SpectrumMatrix.create(
        {
          ...attached.analysedRecordColumns(lab, studyId, actor, outcome),
          fileId: kept!.id,
          title: file.originalname.slice(0, 255),
          bandWidth: options.bandWidth,
        },
        { transaction },
      );
      await recordLabAudit({ lab, actor, transaction }, 'spectrum_matrix_kept', ['study', studyId], {
        spectrumMatrixId: matrix.id,
        file: attached.keptFileDetails(kept!),
        bandWidth: options.bandWidth,
        flags: outcome.analysis.flags.map((flag) => flag.code),
      });
      return matrix.id;
    },
  );
  const kept = await SpectrumMatrix.findOne({ where: { id: matrixId, labId: lab.id }, include: withFile });
  return toSpectrumMatrix(kept!);
}

/** One kept matrix of the study with its file row (no bytes); null when there is none. */
export const findSpectrumMatrix = (lab: LabContext, studyId: string, matrixId: string, transaction?: Transaction) =>
  SpectrumMatrix.findOne({ where: { id: matrixId, labId: lab.id, studyId }, include: withFile, transaction });

/** A study's spectrum matrices, newest first. */
export async function listSpectrumMatrices(lab: LabContext, studyId: string): Promise<SpectrumMatrixAnswer[]> {
  return (await attached.listOfStudy(SpectrumMatrix, lab, studyId, withFile)).map(toSpectrumMatrix);
}

/** A kept mechanism file exactly as received (checked against its SHA-256). */
export const downloadMechanismFile = (services: UploadServices, lab: LabContext, fileId: string) =>
  downloadKeptFile(services.files, 'mechanism-file', lab.id, fileId);
