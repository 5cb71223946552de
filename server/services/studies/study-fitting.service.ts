import type { Transaction } from 'sequelize';
import { ENGINE_VERSION, EngineError, fitStudy, type StudyFitOutcome } from '@shared/engine';
import type { FitModel, FitWeighting } from '@shared/schemas/studies';
import { AppError } from '../../lib/app-error';
import { StudyFit, StudyPoint, type Study } from '../../models';
import { recordAudits, type AuditEntry } from '../audit.service';
import type { Actor } from '../../domain/actor';
import { lifetimeOfEmitter } from './study-tau0';

/**
 * Runs the study-fit pipeline (shared/engine/study-fit) on the study's stored points; an
 * EngineError becomes a 422 naming the field. This service only loads and saves.
 */
export async function computeForStudy(
  study: Study,
  model: FitModel,
  transaction?: Transaction,
  weighting: FitWeighting = study.fitWeighting,
  /** the series as just written in this transaction, in position order (read from the table otherwise) */
  written?: StudyPoint[],
): Promise<StudyFitOutcome> {
  // The record behind tau0 is checked on every refit too (same lab, same emitter), and its value
  // and SE are the ones fitted: never a number stored beside the link.
  const record = study.tau0LifetimeId
    ? await lifetimeOfEmitter(study.labId, study.tau0LifetimeId, study.emitterId, transaction)
    : null;
  const settings = {
    ...study.get({ plain: true }),
    fitWeighting: weighting,
    ...(record ? { tau0: record.value, tau0Uncertainty: record.uncertainty ?? null } : {}),
  };
  const points =
    written ?? (await StudyPoint.findAll({ where: { studyId: study.id }, order: [['position', 'ASC']], transaction }));
  try {
    return fitStudy(settings, points, model);
  } catch (error) {
    if (error instanceof EngineError) {
      throw new AppError('fit_failed', `The series cannot be fitted: ${error.message}`, 422, [
        { path: error.field, message: error.message },
      ]);
    }
    throw error;
  }
}

/** What a refit writes: the new fit (built, not saved; none when the auto fit failed), the study's changes and the audit entries. */
export interface PlannedRefit {
  fit: StudyFit | null;
  studyChanges: Record<string, unknown>;
  audits: AuditEntry[];
}

type RefitOptions = {
  model?: FitModel;
  weighting?: FitWeighting;
  trigger: 'auto' | 'manual';
  actor: Actor;
  transaction: Transaction;
  refuseUnfittable?: boolean;
  /** the series as just written in this transaction (saves reading it back), or as about to be written */
  points?: StudyPoint[];
  /** more changes to the study, saved in the same UPDATE as the fit's (e.g. the version) */
  studyChanges?: { version?: number };
  /** audit entries of the same change, written in the same INSERT as the fit's, before it */
  audits?: AuditEntry[];
};

/**
 * Fits the study (see refitStudy) and says what to write, writing nothing: for a change that
 * writes the fit together with its other rows (writeSeries, in one statement).
 */
export async function planRefit(study: Study, options: RefitOptions): Promise<PlannedRefit> {
  const also = options.studyChanges ?? {};
  const audits = options.audits ?? [];
  const model = options.model ?? study.fitModel;
  const weighting = options.weighting ?? study.fitWeighting;
  let computed: StudyFitOutcome;
  try {
    computed = await computeForStudy(study, model, options.transaction, weighting, options.points);
  } catch (error) {
    if (options.trigger === 'manual' || options.refuseUnfittable || !(error instanceof AppError)) throw error;
    return {
      fit: null,
      studyChanges: { ...also, kSv: null, kq: null, flagged: false, fitProblem: error.message, latestFitId: null },
      audits,
    };
  }
  const fit = StudyFit.build({
    studyId: study.id,
    model,
    weighting,
    trigger: options.trigger,
    kSv: computed.kSv,
    kq: computed.kq,
    result: computed.result,
    pointsUsed: computed.pointsUsed,
    engineVersion: ENGINE_VERSION,
    createdById: options.actor.userId,
  });
  return {
    fit,
    studyChanges: {
      ...also,
      kSv: computed.kSv,
      kq: computed.kq,
      flagged: computed.result.flags.length > 0,
      fitProblem: null,
      latestFitId: fit.id,
      ...(options.trigger === 'manual' ? { fitModel: model, fitWeighting: weighting } : {}),
    },
    audits: [
      ...audits,
      {
        action: 'study_fitted',
        labId: study.labId,
        targetType: 'study',
        targetId: study.id,
        details: {
          fitId: fit.id,
          model,
          weighting,
          applied: computed.result.weighting?.applied ?? null,
          trigger: options.trigger,
          kSv: computed.kSv,
          kq: computed.kq,
          flags: computed.result.flags.map((flag) => flag.code),
          engineVersion: ENGINE_VERSION,
        },
      },
    ],
  };
}

/**
 * Fits the study and stores the fit as a new record (never updated), then copies K_SV, kq and
 * "flagged" onto the study for the list. `auto` fits follow every change of the points or
 * settings; a failing auto fit clears the copied numbers and keeps the reason instead, unless
 * `refuseUnfittable` (an upload apply) asks for the failure to be thrown so nothing is saved.
 */
export async function refitStudy(study: Study, options: RefitOptions): Promise<StudyFit | null> {
  const { transaction } = options;
  const planned = await planRefit(study, options);
  if (planned.fit) await planned.fit.save({ transaction });
  await study.update(planned.studyChanges, { transaction });
  await recordAudits(options.actor, planned.audits, transaction);
  return planned.fit;
}
