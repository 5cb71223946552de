import crypto from 'node:crypto';
import type { Sequelize } from 'sequelize';
import { EngineError } from '@shared/engine';
import type { StudyPointValues } from '@shared/schemas/study-points';
import type { UploadMapping, UploadPreview } from '@shared/schemas/study-uploads';
import { AppError } from '../../lib/app-error';
import type { LabContext } from '../../domain/lab-context';
import { StudyPoint, StudyUpload, User } from '../../models';
import { recordAudit } from '../audit.service';
import type { SignedInActor } from '../../domain/actor';
import { computeStudyFit } from './fit/compute-study-fit';
import { applyMapping } from './parse/apply-mapping';
import { ParseProblem } from './parse/parse-problem';
import { mappingNotes, proposeMapping } from './parse/propose-mapping';
import { readUpload } from './parse/read-upload';
import { cachedTable, rememberTable } from './parse/table-cache';
import type { RawTable } from './parse/read-text-table';
import { loadStudy, requireChangeable, requireEditable, requireOwner } from './study-access';
import { seriesOf } from './study-fitting.service';
import { writeSeries } from './study-points.service';
import { toUpload } from './study-serialize';

const PREVIEW_ROWS = 200;
const problemDetails = (problems: ParseProblem[]) =>
  problems.map((problem) => ({
    path:
      problem.row === null ? 'file' : `file.row ${problem.row}${problem.column ? `, column ${problem.column}` : ''}`,
    message: problem.message,
  }));
const unreadable = (problems: ParseProblem[], uploadId: string) =>
  new AppError(
    'upload_unreadable',
    `${problems[0]!.message}${problems.length > 1 ? ` (and ${problems.length - 1} more problem${problems.length > 2 ? 's' : ''})` : ''} The file is kept (upload ${uploadId}); fix it or choose another mapping.`,
    422,
    problemDetails(problems),
  );

/** The upload without its bytes unless asked for (a 10 MB file takes a while to read back; a kept table needs none). */
async function findUpload(lab: LabContext, studyId: string, uploadId: string, withContent = false) {
  const upload = await StudyUpload.findOne({
    where: { id: uploadId, studyId, labId: lab.id },
    include: [{ model: User, as: 'uploadedBy', attributes: ['name'] }],
    attributes: withContent ? undefined : { exclude: ['content'] },
  });
  if (!upload) throw new AppError('not_found', 'No upload with this id in this study.', 404);
  return upload;
}

function preview(
  upload: StudyUpload,
  table: RawTable | null,
  mapping: UploadMapping | null,
  points: StudyPointValues[],
  problems: ParseProblem[],
): UploadPreview {
  return {
    upload: toUpload(upload),
    format: table?.format ?? 'unreadable',
    headers: table?.headers ?? [],
    rows: table?.rows.slice(0, PREVIEW_ROWS).map((row) => row.cells) ?? [],
    rowCount: table?.rows.length ?? 0,
    mapping,
    points,
    problems: problems.map((problem) => ({ row: problem.row, column: problem.column, message: problem.message })),
    warnings: table && mapping ? mappingNotes(table, mapping) : [],
  };
}

/** Reads a file into table + points; a ParseProblem (not other errors) becomes a list of problems. */
async function readWith(
  fileName: string,
  bytes: Buffer | (() => Promise<Buffer>),
  sha256: string,
  mapping: UploadMapping | null,
) {
  try {
    let table = cachedTable(fileName, sha256);
    if (!table) {
      table = await readUpload(fileName, Buffer.isBuffer(bytes) ? bytes : await bytes());
      rememberTable(fileName, sha256, table);
    }
    const chosen = mapping ?? proposeMapping(table);
    const { points, problems } = applyMapping(table, chosen);
    return { table, mapping: chosen, points, problems };
  } catch (error) {
    if (error instanceof ParseProblem) return { table: null, mapping, points: [], problems: [error] };
    throw error;
  }
}

/**
 * Keeps the file exactly as received (also when it does not parse; the same bytes twice in one
 * study are refused with 409), reads it and proposes a mapping. Nothing reaches the series here.
 */
export async function receiveUpload(
  sequelize: Sequelize,
  lab: LabContext,
  studyId: string,
  file: { originalname: string; mimetype: string; buffer: Buffer },
  actor: SignedInActor,
) {
  const study = await loadStudy(lab, studyId);
  requireOwner(study, lab, actor.userId);
  requireEditable(study);
  const sha256 = crypto.createHash('sha256').update(file.buffer).digest('hex');
  const earlier = await StudyUpload.findOne({
    where: { studyId, sha256 },
    attributes: ['id', 'fileName', 'createdAt'],
  });
  if (earlier) {
    throw new AppError(
      'duplicate_upload',
      `These exact bytes were uploaded to this study already as "${earlier.fileName}" on ${earlier.createdAt.toISOString().slice(0, 10)}.`,
      409,
      [{ path: 'file', message: `same SHA-256 as upload ${earlier.id}` }],
    );
  }
  const read = await readWith(file.originalname, file.buffer, sha256, null);
  const failed = read.problems.length > 0;
  const upload = await sequelize.transaction(async (transaction) => {
    const created = await StudyUpload.create(
      {
        labId: lab.id,
        studyId,
        fileName: file.originalname.slice(0, 255),
        mediaType: file.mimetype || 'application/octet-stream',
        size: file.buffer.length,
        sha256,
        content: file.buffer,
        uploadedById: actor.userId,
        parseStatus: failed ? 'failed' : 'parsed',
        parseReport: failed
          ? { problem: read.problems[0]!.message, problems: read.problems.map((p) => p.message) }
          : { format: read.table!.format, rows: read.table!.rows.length, mapping: read.mapping },
      },
      { transaction },
    );
    await recordAudit(
      actor,
      {
        action: 'study_file_uploaded',
        labId: lab.id,
        targetType: 'study',
        targetId: studyId,
        details: {
          uploadId: created.id,
          fileName: created.fileName,
          size: created.size,
          sha256,
          parseStatus: created.parseStatus,
        },
      },
      transaction,
    );
    return created;
  });
  if (failed) throw unreadable(read.problems, upload.id);
  return preview(upload, read.table, read.mapping, read.points, []);
}

/** The kept bytes of an upload found without them. */
const contentOf = (upload: StudyUpload) => async () =>
  (await StudyUpload.findByPk(upload.id, { attributes: ['content'], rejectOnEmpty: true })).content;

/** The table read again with another mapping (a spectrum window, other columns, units). */
export async function previewUpload(
  lab: LabContext,
  studyId: string,
  uploadId: string,
  mapping: UploadMapping,
): Promise<UploadPreview> {
  const upload = await findUpload(lab, studyId, uploadId);
  const read = await readWith(upload.fileName, contentOf(upload), upload.sha256, mapping);
  return preview(upload, read.table, read.mapping, read.points, read.problems);
}

/** Confirms a mapping: the points replace (or extend) the series only when the result can be fitted. */
export async function applyUpload(
  sequelize: Sequelize,
  lab: LabContext,
  studyId: string,
  uploadId: string,
  input: { version: number; mapping: UploadMapping; mode: 'replace' | 'append' },
  actor: SignedInActor,
) {
  await sequelize.transaction(async (transaction) => {
    const study = await loadStudy(lab, studyId, transaction);
    requireChangeable(study, lab, actor.userId, input.version);
    const upload = await findUpload(lab, studyId, uploadId);
    const read = await readWith(upload.fileName, contentOf(upload), upload.sha256, input.mapping);
    if (read.problems.length > 0) throw unreadable(read.problems, upload.id);
    if (read.points.length === 0) {
      throw new AppError(
        'no_points',
        'Nothing was saved: this mapping gives no points; give the quencher concentration of at least one spectrum.',
        422,
        [{ path: 'body.mapping.samples', message: 'empty' }],
      );
    }
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
    const points = [
      ...existing.map((point) => point.get({ plain: true }) as StudyPointValues & { uploadId: string | null }),
      ...read.points.map((point) => ({ ...point, uploadId })),
    ];
    const settings = { ...study.get({ plain: true }), dataKind: isRatio ? ('ratio' as const) : ('intensity' as const) };
    try {
      computeStudyFit(settings, seriesOf(points.map((point, position) => ({ ...point, position }))), study.fitModel);
    } catch (error) {
      if (error instanceof EngineError) {
        throw new AppError('series_not_fittable', `Nothing was saved: ${error.message}`, 422, [
          { path: `series.${error.field}`, message: error.message },
        ]);
      }
      throw error;
    }
    if (settings.dataKind !== study.dataKind) await study.update({ dataKind: settings.dataKind }, { transaction });
    await writeSeries(study, points, actor, transaction, { action: 'study_points_from_upload', uploadId });
    await upload.update(
      {
        parseStatus: 'applied',
        parseReport: { ...upload.parseReport, appliedMapping: input.mapping, appliedPoints: read.points.length },
      },
      { transaction },
    );
  });
}

export async function downloadUpload(lab: LabContext, studyId: string, uploadId: string) {
  const upload = await findUpload(lab, studyId, uploadId, true);
  return { fileName: upload.fileName, mediaType: upload.mediaType, content: upload.content };
}
