import crypto from 'node:crypto';
import type { Sequelize } from 'sequelize';
import { UniqueConstraintError } from 'sequelize';
import { describeUploadReading } from '@shared/format';
import type { UploadMapping, UploadPreview, UploadQuestionCode } from '@shared/schemas/study-uploads';
import { AppError } from '../../lib/app-error';
import type { LabContext } from '../../domain/lab-context';
import { AuditEvent, Study, StudyPoint, StudyUpload, User } from '../../models';
import { recordLabAudit, unsavedAuditEvent } from '../audit.service';
import { OneStatement } from '../../db/one-statement';
import type { SignedInActor } from '../../domain/actor';
import type { RawFileStore, StoredLocation } from './files/raw-file-store';
import type { Problem, ReadOutcome } from './parse/read-and-map';
import type { UploadReader } from './parse/upload-reader';
import { loadStudy, requireChangeable, requireEditable, requireOwner, studyNotFound } from './study-access';
import { storedSeriesPoint, writeSeries } from './study-points.service';
import { toUpload } from './study-serialize';

/** What the upload flows need from the app: the database, the reading threads and the file store. */
export interface UploadServices {
  sequelize: Sequelize;
  uploadReader: UploadReader;
  files: RawFileStore;
}

const PREVIEW_POINTS = 200;
const problemDetails = (problems: Problem[]) =>
  problems.map((problem) => ({
    path:
      problem.row === null ? 'file' : `file.row ${problem.row}${problem.column ? `, column ${problem.column}` : ''}`,
    message: problem.message,
  }));
const unreadable = (problems: Problem[]) =>
  new AppError(
    'upload_unreadable',
    `${problems[0]!.message}${problems.length > 1 ? ` (and ${problems.length - 1} more problem${problems.length > 2 ? 's' : ''})` : ''} The file is kept with the study's files; fix it or choose another mapping.`,
    422,
    problemDetails(problems),
  );
/** Over a limit: 413 for a file that expands too far, 422 for one that takes too long. */
const overLimit = (outcome: Extract<ReadOutcome, { kind: 'limit' }>, kept: string | null) =>
  new AppError(
    'upload_limit',
    kept ? `${outcome.message} The file is kept with the study's files.` : outcome.message,
    outcome.limit === 'seconds' ? 422 : 413,
    [{ path: 'file', message: `over the ${outcome.limit} limit` }],
  );

/** The upload without its bytes (a 20 MB file takes a while to read back; the file store reads them). */
async function findUpload(lab: LabContext, studyId: string, uploadId: string) {
  const upload = await StudyUpload.findOne({
    where: { id: uploadId, studyId, labId: lab.id },
    include: [{ model: User, as: 'uploadedBy', attributes: ['name'] }],
    attributes: { exclude: ['content'] },
  });
  if (!upload) throw new AppError('not_found', 'No upload with this id in this study.', 404);
  return upload;
}

/** The answer: the table's first rows and the first points, never every parsed value. */
function preview(upload: StudyUpload, outcome: ReadOutcome): UploadPreview {
  const read = outcome.kind === 'read' ? outcome : null;
  return {
    upload: toUpload(upload),
    format: read?.table.format ?? 'unreadable',
    headers: read?.table.headers ?? [],
    rows: read?.table.rows ?? [],
    rowCount: read?.table.rowCount ?? 0,
    mapping: read?.mapping ?? null,
    points: read?.points.slice(0, PREVIEW_POINTS) ?? [],
    pointCount: read?.points.length ?? 0,
    problems: outcome.kind === 'limit' ? [] : outcome.problems,
    warnings: read?.warnings ?? [],
    questions: read?.questions ?? [],
  };
}

/** What the history keeps of how a file was read: the words, and for spectra the reduction and baseline as numbers. */
const readingDetails = (mapping: UploadMapping) => ({
  reading: describeUploadReading(mapping),
  ...(mapping.layout === 'spectrum' ? { reduction: mapping.reduction, baseline: mapping.baseline } : {}),
});

function parseReportOf(outcome: ReadOutcome) {
  if (outcome.kind === 'limit') return { problem: outcome.message, limit: outcome.limit };
  if (outcome.kind === 'unreadable' || outcome.problems.length > 0)
    return { problem: outcome.problems[0]!.message, problems: outcome.problems.map((p) => p.message) };
  return { format: outcome.table.format, rows: outcome.table.rowCount, mapping: outcome.mapping };
}

const duplicate = (earlier: Pick<StudyUpload, 'id' | 'fileName' | 'createdAt'>) =>
  new AppError(
    'duplicate_upload',
    `These exact bytes were uploaded to this study already as "${earlier.fileName}" on ${earlier.createdAt.toISOString().slice(0, 10)}.`,
    409,
    [{ path: 'file', message: `same SHA-256 as upload ${earlier.id}` }],
  );

/**
 * Keeps the file exactly as received (also when it does not parse: then the error names the
 * upload), reads it off the main thread and proposes a mapping. Nothing reaches the series
 * here. The file is read before anything is written, and the row, its parse report and the
 * audit entry are written in one transaction: a failure leaves nothing half-kept. The same
 * bytes twice in one study are refused with 409, unless the earlier copy failed to read: then
 * the kept row is read again (a timeout on a busy machine must not block a retry).
 */
export async function receiveUpload(
  services: UploadServices,
  lab: LabContext,
  studyId: string,
  file: { originalname: string; mimetype: string; buffer: Buffer },
  actor: SignedInActor,
) {
  // SubtleCrypto hashes on libuv's thread pool; a 20 MB digest would otherwise hold the event loop.
  const sha256 = Buffer.from(await crypto.subtle.digest('SHA-256', file.buffer)).toString('hex');
  // The study and an earlier upload of the same bytes to it, in one statement.
  const study = await Study.findOne({
    where: { id: studyId, labId: lab.id },
    include: [
      {
        model: StudyUpload,
        as: 'uploads',
        where: { sha256 },
        required: false,
        attributes: ['id', 'fileName', 'createdAt', 'parseStatus'],
      },
    ],
  });
  if (!study) throw studyNotFound();
  requireOwner(study, lab, actor.userId);
  requireEditable(study);
  const earlier = study.uploads?.[0];
  if (earlier && earlier.parseStatus !== 'failed') throw duplicate(earlier);
  const outcome = await services.uploadReader.read(file.originalname, file.buffer, null, {
    windowStart: study.windowStart,
    windowEnd: study.windowEnd,
    emissionWavelength: study.emissionWavelength,
  });
  const report = parseReportOf(outcome);
  const failed = 'problem' in report;
  const fields = {
    fileName: file.originalname.slice(0, 255),
    mediaType: file.mimetype || 'application/octet-stream',
    uploadedById: actor.userId,
    parseStatus: failed ? ('failed' as const) : ('parsed' as const),
    parseReport: report,
  };
  // A new file's bytes go to the store first (an object store that is down answers 503, nothing kept);
  // the row follows (with its audit entry, in one statement), and if it is not kept the stored bytes are removed again.
  const uploadId = crypto.randomUUID();
  const location: StoredLocation | null = earlier
    ? null
    : await services.files.put({ uploadId, labId: lab.id, bytes: file.buffer });
  let upload: StudyUpload;
  try {
    const audit = (kept: StudyUpload) =>
      unsavedAuditEvent(actor, {
        action: 'study_file_uploaded',
        labId: lab.id,
        targetType: 'study',
        targetId: studyId,
        details: {
          uploadId: kept.id,
          fileName: kept.fileName,
          size: file.buffer.length,
          sha256,
          parseStatus: kept.parseStatus,
          ...(earlier ? { readAgain: true } : {}),
        },
      });
    if (location) {
      // A new file: its row and the audit entry in one statement, no transaction round trips.
      upload = StudyUpload.build({
        ...fields,
        ...location,
        id: uploadId,
        labId: lab.id,
        studyId,
        size: file.buffer.length,
        sha256,
      });
      await upload.validate();
      const write = new OneStatement();
      await write.insert(StudyUpload, [upload]);
      await write.insert(AuditEvent, [audit(upload)]);
      await write.run(services.sequelize);
    } else {
      upload = await services.sequelize.transaction(async (transaction) => {
        const kept = await (
          await StudyUpload.findByPk(earlier!.id, {
            attributes: { exclude: ['content'] },
            transaction,
            rejectOnEmpty: true,
          })
        ).update(fields, { transaction });
        await recordLabAudit(
          { lab, actor, transaction },
          'study_file_uploaded',
          ['study', studyId],
          audit(kept).details,
        );
        return kept;
      });
    }
  } catch (error) {
    if (location) await services.files.discard(location);
    // The same bytes sent twice at once: the second insert meets the unique index.
    if (error instanceof UniqueConstraintError) {
      const winner = await StudyUpload.findOne({
        where: { studyId, sha256 },
        attributes: ['id', 'fileName', 'createdAt'],
      });
      if (winner) throw duplicate(winner);
    }
    throw error;
  }
  if (outcome.kind === 'limit') throw overLimit(outcome, upload.id);
  if (outcome.problems.length > 0) throw unreadable(outcome.problems);
  return preview(upload, outcome);
}

/** The table read again from the kept bytes with another mapping (a spectrum window, other columns, units). */
export async function previewUpload(
  services: UploadServices,
  lab: LabContext,
  studyId: string,
  uploadId: string,
  mapping: UploadMapping,
): Promise<UploadPreview> {
  const upload = await findUpload(lab, studyId, uploadId);
  const outcome = await services.uploadReader.read(upload.fileName, await services.files.read(upload), mapping);
  if (outcome.kind === 'limit') throw overLimit(outcome, null);
  return preview(upload, outcome);
}

/**
 * Confirms a mapping: the points replace (or extend) the series only when the result can be
 * fitted. The file is read again from its kept bytes before the transaction (no connection is
 * held while a thread reads), so any instance can apply what another previewed.
 */
export async function applyUpload(
  services: UploadServices,
  lab: LabContext,
  studyId: string,
  uploadId: string,
  input: {
    version: number;
    mapping: UploadMapping;
    mode: 'replace' | 'append';
    /** questions of the preview the person has checked (a concentration above 1 M, K_SV below 1 M^-1) */
    acknowledged?: UploadQuestionCode[];
  },
  actor: SignedInActor,
) {
  if (input.mapping.layout === 'series' && input.mapping.concentrationUnit === null)
    throw new AppError(
      'unit_needed',
      'Nothing was saved: choose the unit of the concentration column; Halflight does not guess one.',
      422,
      [{ path: 'body.mapping.concentrationUnit', message: 'choose M, mM, uM or nM' }],
    );
  const found = await findUpload(lab, studyId, uploadId);
  const outcome = await services.uploadReader.read(found.fileName, await services.files.read(found), input.mapping);
  if (outcome.kind === 'limit') throw overLimit(outcome, null);
  if (outcome.problems.length > 0) throw unreadable(outcome.problems);
  if (outcome.kind !== 'read' || outcome.points.length === 0) {
    throw new AppError(
      'no_points',
      'Nothing was saved: this mapping gives no points; give the quencher concentration of at least one spectrum.',
      422,
      [{ path: 'body.mapping.samples', message: 'empty' }],
    );
  }
  const read = outcome;
  const open = read.questions.filter((question) => !(input.acknowledged ?? []).includes(question.code));
  if (open.length > 0)
    throw new AppError(
      'questions_open',
      `Nothing was saved: ${open.map((question) => question.message).join(' ')} Confirm that you checked ${open.length === 1 ? 'this' : 'these'}, or choose another unit.`,
      422,
      open.map((question) => ({ path: 'body.acknowledged', message: `not acknowledged: ${question.code}` })),
    );
  await services.sequelize.transaction(async (transaction) => {
    const study = await loadStudy(lab, studyId, transaction);
    requireChangeable(study, lab, actor.userId, input.version);
    const upload = await StudyUpload.findByPk(uploadId, {
      attributes: { exclude: ['content'] },
      transaction,
      rejectOnEmpty: true,
    });
    const isRatio = input.mapping.layout === 'series' && input.mapping.intensityIsRatio;
    const existing =
      input.mode === 'append'
        ? await StudyPoint.findAll({ where: { studyId }, order: [['position', 'ASC']], transaction })
        : [];
    if (existing.length > 0 && isRatio !== (study.dataKind === 'ratio')) {
      throw new AppError(
        'mixed_data_kinds',
        'The study holds ' +
          (study.dataKind === 'ratio' ? 'I0/I ratios' : 'intensities') +
          '; points of the other kind cannot be appended. Replace the series instead.',
        409,
      );
    }
    const points = [...existing.map(storedSeriesPoint), ...read.points.map((point) => ({ ...point, uploadId }))];
    const dataKind = isRatio ? ('ratio' as const) : ('intensity' as const);
    if (dataKind !== study.dataKind) await study.update({ dataKind }, { transaction });
    // One fit: the refit after writing; a series it cannot fit is refused and the transaction saves nothing.
    try {
      await writeSeries(study, points, actor, transaction, {
        action: 'study_points_from_upload',
        uploadId,
        reading: readingDetails(input.mapping),
        refuseUnfittable: true,
      });
    } catch (error) {
      if (error instanceof AppError && error.code === 'fit_failed') {
        throw new AppError(
          'series_not_fittable',
          `Nothing was saved: ${error.details?.[0]?.message ?? error.message}`,
          422,
          error.details?.map((issue) => ({ ...issue, path: `series.${issue.path}` })),
        );
      }
      throw error;
    }
    await upload.update(
      {
        parseStatus: 'applied',
        parseReport: { ...upload.parseReport, appliedMapping: input.mapping, appliedPoints: read.points.length },
      },
      { transaction },
    );
  });
}

/** The bytes exactly as received, from wherever they are kept (checked against their SHA-256). */
export async function downloadUpload(files: RawFileStore, lab: LabContext, studyId: string, uploadId: string) {
  const upload = await findUpload(lab, studyId, uploadId);
  return { fileName: upload.fileName, mediaType: upload.mediaType, content: await files.read(upload) };
}
