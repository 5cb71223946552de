import type { Sequelize, Transaction } from 'sequelize';
import type { CreateStudyInput, UpdateStudyInput } from '@shared/schemas/studies';
import { studySettingsIssues } from '@shared/schemas/studies';
import type { StudyDetail } from '@shared/schemas/study-detail';
import type { FitResult, StudyFit as StudyFitRecord } from '@shared/schemas/study-fits';
import { OneStatement } from '../../db/one-statement';
import { fixedStatement, selectRows } from '../../db/select-rows';
import { AppError } from '../../lib/app-error';
import type { LabContext } from '../../domain/lab-context';
import { AuditEvent, Study, type StudyPoint, type StudyReview, type StudyUpload } from '../../models';
import { recordLabAudit, unsavedAuditEvent } from '../audit.service';
import type { SignedInActor } from '../../domain/actor';
import { loadStudy, requireChangeable, studyNotFound } from './study-access';
import { resolveStudyCompounds } from './study-compounds';
import { refitStudy } from './study-fitting.service';
import { resolveTau0, type Tau0Fields } from './study-tau0';
import {
  correctionsOf,
  settingsOf,
  identityOf,
  withPlotAxes,
  toPoint,
  toReview,
  toTau0Source,
  toUpload,
  type SummaryRow,
} from './study-serialize';

const settingsIssuesError = (issues: { path: string; message: string }[]) =>
  new AppError(
    'validation_failed',
    `The study has problems: ${issues.map((issue) => `${issue.path}: ${issue.message}`).join('; ')}`,
    400,
    issues.map((issue) => ({ path: `body.${issue.path}`, message: issue.message })),
  );

/** Input keys that are not the study's own columns: the compounds (resolveStudyCompounds) and the version edited. */
const NOT_SETTINGS = ['emitterId', 'quencherId', 'newEmitterName', 'newQuencherName', 'version'] as const;

/** A create or update input without its NOT_SETTINGS keys: what is written to the study as it is. */
function ownSettings<T extends CreateStudyInput | UpdateStudyInput>(input: T): Omit<T, (typeof NOT_SETTINGS)[number]> {
  const settings: Partial<T> = { ...input };
  for (const key of NOT_SETTINGS) delete settings[key as keyof T];
  return settings as Omit<T, (typeof NOT_SETTINGS)[number]>;
}

export async function createStudy(
  sequelize: Sequelize,
  lab: LabContext,
  input: CreateStudyInput,
  actor: SignedInActor,
) {
  /** Reads what the study names, then writes the study and its audit entry in one statement. */
  const create = async (transaction?: Transaction) => {
    // The create schema requires an emitter and a quencher (by id or by a new name): both are found.
    const compounds = await resolveStudyCompounds(lab, input, actor, transaction);
    const emitterId = compounds.emitterId!;
    const settings = ownSettings(input);
    const tau0 = await resolveTau0(lab, settings, null, emitterId, transaction);
    const study = Study.build({
      ...settings,
      ...tau0,
      labId: lab.id,
      emitterId,
      quencherId: compounds.quencherId!,
      ownerId: actor.userId,
      previousRevisionId: null,
    });
    await study.validate();
    const audit = unsavedAuditEvent(actor, {
      action: 'study_created',
      labId: lab.id,
      targetType: 'study',
      targetId: study.id,
      details: { after: settingsOf(study) },
    });
    // A new study moves its lab's row of lab_study_counts (a trigger, migration
    // 20261203-0910-lab-study-counts), locked until COMMIT: every other create in the lab waits
    // for it. Written as one statement outside a transaction, the row is locked only while
    // PostgreSQL runs that statement. With BEGIN, audit INSERT, study INSERT and COMMIT each a
    // round trip, under bench:load's writes on a busy machine the study INSERT waited for the row
    // 183 ms at the median and 834 ms at p90, and each round trip took about 140 ms.
    const write = new OneStatement(transaction);
    await write.insert(AuditEvent, [audit]);
    await write.insert(Study, [study]);
    await write.run(sequelize);
    return study.id;
  };
  // Only a compound named anew (created here, with its own audit entry) needs a transaction.
  const studyId = input.newEmitterName || input.newQuencherName ? await sequelize.transaction(create) : await create();
  return getStudyDetail(lab, studyId);
}

/**
 * The decay set a study's new tau0 still comes from.
 * tau0 stays "from decay" only while it is the number the decays gave.
 */
function decaySetKeepingTau0(study: Study, tau0: Tau0Fields): string | null {
  const unchanged =
    tau0.tau0LifetimeId === null && tau0.tau0 === study.tau0 && tau0.tau0Uncertainty === study.tau0Uncertainty;
  return unchanged ? study.tau0DecaySetId : null;
}

export async function updateStudy(
  sequelize: Sequelize,
  lab: LabContext,
  studyId: string,
  input: UpdateStudyInput,
  actor: SignedInActor,
) {
  await sequelize.transaction(async (transaction) => {
    const study = await loadStudy(lab, studyId, transaction);
    requireChangeable(study, lab, actor.userId, input.version);
    const before = { ...settingsOf(study), emitterId: study.emitterId, quencherId: study.quencherId };
    const changes = ownSettings(input);
    const defined = Object.fromEntries(Object.entries(changes).filter(([, value]) => value !== undefined));
    const merged = { ...settingsOf(study), ...defined };
    const issues = studySettingsIssues(merged);
    if (issues.length) throw settingsIssuesError(issues);
    const compounds = await resolveStudyCompounds(lab, input, actor, transaction);
    const tau0 = await resolveTau0(
      lab,
      { tau0: changes.tau0, tau0Uncertainty: changes.tau0Uncertainty, tau0LifetimeId: changes.tau0LifetimeId },
      study,
      compounds.emitterId ?? study.emitterId,
      transaction,
    );
    const tau0DecaySetId = decaySetKeepingTau0(study, tau0);
    await study.update(
      { ...defined, ...compounds, ...tau0, tau0DecaySetId, version: study.version + 1 },
      { transaction },
    );
    await recordLabAudit({ lab, actor, transaction }, 'study_updated', ['study', study.id], {
      before,
      after: { ...settingsOf(study), emitterId: study.emitterId, quencherId: study.quencherId },
    });
    await refitStudy(study, { trigger: 'auto', actor, transaction });
  });
  return getStudyDetail(lab, studyId);
}

/** Column names (snake_case) as a model names them (camelCase); a fixed set, kept once converted. */
const camelNames = new Map<string, string>();
const camelName = (key: string) => {
  let name = camelNames.get(key);
  if (name === undefined) {
    name = key.replace(/_([a-z0-9])/g, (_, letter: string) => letter.toUpperCase());
    camelNames.set(key, name);
  }
  return name;
};

/** A row PostgreSQL turned into JSON (snake_case keys, timestamps as text) in the shape a model row has. */
function modelShaped<T>(row: Record<string, unknown>): T {
  const shaped: Record<string, unknown> = {};
  for (const key in row) {
    const name = camelName(key);
    const value = row[key];
    shaped[name] =
      (name === 'createdAt' || name === 'updatedAt') && typeof value === 'string' ? new Date(value) : value;
  }
  return shaped as T;
}

type Named = { name: string | null };
const byName = (name: unknown): Named | null => (typeof name === 'string' ? { name } : null);

/**
 * A study's detail as JSON built by PostgreSQL in one round trip: the study row with its emitter,
 * quencher and owner names, the next revision, decay file names, points, latest fit, uploads
 * (never their bytes) and reviews, each with the person's name. Every column of the study, points
 * and reviews comes along, so a column added later reaches the serialisers without a change here.
 *
 * The latest fit comes as the text of its answer (latestFitJson), which the GET answer carries as
 * it is: its stored result (several KB of numbers, most of a study's answer) was parsed here and
 * written out again on every read, about a third of the node CPU of opening a study beyond that of
 * a small read. Beside it: whether its plot names its axes (an older record is reshaped by
 * toFit first, see withPlotAxes) and its corrections (the points' corrected values).
 */
const detailSql = fixedStatement(`
  SELECT
    (SELECT row_to_json(x) FROM (
       SELECT s.*, e.name AS emitter_name, q.name AS quencher_name, o.name AS owner_name
         FROM studies s
         LEFT JOIN compounds e ON e.id = s.emitter_id
         LEFT JOIN compounds q ON q.id = s.quencher_id
         LEFT JOIN users o ON o.id = s.owner_id
        WHERE s.id = $1 AND s.lab_id = $2) x) AS study,
    (SELECT n.id FROM studies n WHERE n.previous_revision_id = $1 AND n.lab_id = $2 LIMIT 1) AS next_id,
    (SELECT coalesce(json_agg(json_build_object('id', d.id, 'fileName', f.file_name)), '[]')
       FROM decay_sets d LEFT JOIN decay_files f ON f.id = d.file_id
      WHERE d.study_id = $1 AND d.lab_id = $2) AS decay_sets,
    (SELECT coalesce(json_agg(p ORDER BY p.position), '[]') FROM study_points p WHERE p.study_id = $1) AS points,
    fit.latest_fit, fit.latest_fit_has_axes, fit.latest_fit_corrections,
    (SELECT coalesce(json_agg(x ORDER BY x.created_at DESC), '[]') FROM (
       SELECT u.id, u.file_name, u.media_type, u.size, u.sha256, u.parse_status, u.parse_report, u.created_at,
              b.name AS uploaded_by_name
         FROM study_uploads u LEFT JOIN users b ON b.id = u.uploaded_by_id WHERE u.study_id = $1) x) AS uploads,
    (SELECT coalesce(json_agg(x ORDER BY x.created_at ASC), '[]') FROM (
       SELECT r.*, a.name AS author_name FROM study_reviews r LEFT JOIN users a ON a.id = r.author_id
        WHERE r.study_id = $1) x) AS reviews
  FROM (SELECT 1) one
  -- The fit in the shape toFit gives (study-serialize.ts); study-detail.test.ts compares the two.
  LEFT JOIN LATERAL (
    SELECT json_build_object(
             'id', f.id, 'model', f.model, 'weighting', f.weighting, 'trigger', f.trigger, 'kSv', f.k_sv,
             'kq', f.kq, 'result', r.result, 'pointsUsed', f.points_used, 'engineVersion', f.engine_version,
             'createdBy', c.name,
             'createdAt', to_char(f.created_at AT TIME ZONE 'UTC', 'YYYY-MM-DD"T"HH24:MI:SS.MS"Z"'))::text AS latest_fit,
           (r.result -> 'plot') ? 'xAxis' AS latest_fit_has_axes,
           r.result -> 'corrections' AS latest_fit_corrections
      FROM studies s JOIN study_fits f ON f.id = s.latest_fit_id LEFT JOIN users c ON c.id = f.created_by_id
      -- The stored result is kept compressed (TOAST): read once here, not once per use above.
      CROSS JOIN LATERAL (SELECT f.result || '{}'::jsonb AS result OFFSET 0) r
     WHERE s.id = $1 AND s.lab_id = $2) fit ON true`);

type DetailRow = {
  study: Record<string, unknown> | null;
  next_id: string | null;
  decay_sets: Array<{ id: string; fileName: string | null }>;
  points: Array<Record<string, unknown>>;
  /** The latest fit in its answer's shape (StudyFit of shared/schemas/study-fits.ts), as JSON text. */
  latest_fit: string | null;
  latest_fit_has_axes: boolean | null;
  latest_fit_corrections: FitResult['corrections'];
  uploads: Array<Record<string, unknown>>;
  reviews: Array<Record<string, unknown>>;
};

/** A study's detail with latestFit still null, and the fit's answer as JSON text (null without a fit). */
type DetailParts = { detail: StudyDetail; latestFitJson: string | null };

async function readStudyDetail(lab: LabContext, studyId: string): Promise<DetailParts> {
  // The study (404 when it is not this lab's) with its names and everything shown beside it, in
  // one round trip as plain rows: no Sequelize query building or model instances on this read, and
  // (a prepared statement) no planning after the first runs on each connection.
  const [parts] = await selectRows<DetailRow>(Study.sequelize!, detailSql, [studyId, lab.id]);
  const studyRow = parts!.study;
  if (!studyRow) throw studyNotFound();
  // emitter_name, quencher_name and owner_name become the names identityOf reads.
  const study = modelShaped<Study & Pick<SummaryRow, 'emitterName' | 'quencherName' | 'ownerName'>>(studyRow);
  const points = parts!.points.map((row) => modelShaped<StudyPoint>(row));
  let latestFitJson = parts!.latest_fit;
  if (latestFitJson !== null && !parts!.latest_fit_has_axes) {
    // An older record: its plot as the screen drew it then (rare: such fits are fitted again at start).
    const stored = JSON.parse(latestFitJson) as StudyFitRecord;
    latestFitJson = JSON.stringify({ ...stored, result: withPlotAxes(stored) });
  }
  const uploads = parts!.uploads.map((row) =>
    modelShaped<StudyUpload>({ ...row, uploaded_by: byName(row.uploaded_by_name), uploaded_by_name: undefined }),
  );
  const reviews = parts!.reviews.map((row) =>
    modelShaped<StudyReview>({ ...row, author: byName(row.author_name), author_name: undefined }),
  );
  const next = parts!.next_id ? { id: parts!.next_id } : null;
  const decaySets = parts!.decay_sets.map((set) => ({
    id: set.id,
    file: set.fileName === null ? null : { fileName: set.fileName },
  }));
  const sources = new Map(decaySets.map((set) => [set.id, set.file?.fileName ?? 'decay file']));
  const corrections =
    study.dilutionCorrection || study.innerFilterCorrection
      ? correctionsOf({ result: { corrections: parts!.latest_fit_corrections } as FitResult })
      : new Map();
  // Object.assign rather than spreads into a new literal (see toSummary). latestFit keeps its place
  // among the fields; the callers put it in.
  const detail: StudyDetail = Object.assign(settingsOf(study), identityOf(study), {
    previousRevisionId: study.previousRevisionId,
    nextRevisionId: next?.id ?? null,
    version: study.version,
    createdAt: study.createdAt.toISOString(),
    updatedAt: study.updatedAt.toISOString(),
    points: points.map((point) => toPoint(point, corrections, sources)),
    latestFit: null,
    fitProblem: study.fitProblem,
    tau0Source: toTau0Source(study, sources),
    uploads: uploads.map(toUpload),
    reviews: reviews.map(toReview),
  });
  return { detail, latestFitJson };
}

/** A study's detail. A read never writes: outdated stored fits are fitted again at start (refit-outdated-fits.ts). */
export async function getStudyDetail(lab: LabContext, studyId: string): Promise<StudyDetail> {
  const { detail, latestFitJson } = await readStudyDetail(lab, studyId);
  if (latestFitJson !== null) detail.latestFit = JSON.parse(latestFitJson) as StudyFitRecord;
  return detail;
}

/**
 * The GET answer of a study's detail as JSON text: what getStudyDetail gives, with the latest
 * fit's text put in as PostgreSQL wrote it instead of parsed and written out again. Its numbers
 * and spacing read as PostgreSQL prints them (0.0000046 for 4.6e-6, a space after each colon);
 * the values are the same. The fit goes in at a marker no stored text can hold (PostgreSQL text
 * cannot contain U+0000, and the API refuses it: shared/schemas/storable-text.ts).
 */
export async function studyDetailAnswer(lab: LabContext, studyId: string): Promise<string> {
  const { detail, latestFitJson } = await readStudyDetail(lab, studyId);
  if (latestFitJson === null) return JSON.stringify(detail);
  const text = JSON.stringify(Object.assign(detail, { latestFit: fitMarker }));
  return text.replace(fitMarkerJson, () => latestFitJson);
}

const fitMarker = '\u0000latest fit\u0000';
const fitMarkerJson = JSON.stringify(fitMarker);
