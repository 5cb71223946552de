import { ENGINE_VERSION } from '@shared/engine';
import type { DecayModel, DecaySetRefit } from '@shared/schemas/decays';
import { AppError } from '../../lib/app-error';
import type { LabContext } from '../../domain/lab-context';
import type { SignedInActor } from '../../domain/actor';
import { DecaySet, ExcitedStateLifetime } from '../../models';
import { recordLabAudit } from '../audit.service';
import { assertMayEdit, changedFields } from '../library/library-access.service';
import { lifetimeDependents } from '../library/lifetime-dependents.service';
import { loadStudy, requireEditable, requireOwner } from '../studies/study-access';
import type { UploadServices } from '../studies/study-upload.service';
import { placeDecaySet } from './apply-decay-set.service';
import {
  decaySetTarget,
  findDecaySet,
  keptFilesOf,
  methodOf,
  notesWithBasis,
  readToKeep,
  toDecaySet,
} from './decay-sets.service';

/** Who may refit: a study's set its owner while the study may change; a library set whoever may edit its lifetime record. */
async function requireMayRefit(lab: LabContext, set: DecaySet, actor: SignedInActor) {
  if (set.studyId) {
    const study = await loadStudy(lab, set.studyId);
    requireOwner(study, lab, actor.userId);
    requireEditable(study);
    return;
  }
  assertMayEdit(lab, actor, set, 'decay set');
}

function requireSetVersion(set: DecaySet, version: number) {
  if (set.version !== version)
    throw new AppError(
      'stale_version',
      `This decay set was refitted since you opened it (you have version ${version}, it is now at ${set.version}). Reload to see the current fit, then choose again.`,
      409,
      [{ path: 'body.version', message: `is ${version}; the current version is ${set.version}` }],
    );
}

/**
 * Fits a kept decay set again with another model (number of exponentials, tail or
 * reconvolution, estimator, start and end channel), from its kept files and the column choices it
 * was kept with. Nothing changes unless every decay fits (422 naming the decay otherwise). What
 * took its numbers from the set follows in the same transaction, each change in the history: the
 * study's lifetimes and tau0 that still come from the set, and the library lifetime record the set
 * feeds. Studies whose tau0 comes from that record are not refitted here: like any change of a
 * lifetime record, they are listed as holding the older value until their owners refit them
 * (never silently; lifetime-dependents.service.ts).
 */
export async function refitDecaySet(
  services: UploadServices,
  lab: LabContext,
  setId: string,
  input: { model: DecayModel; version: number },
  actor: SignedInActor,
): Promise<DecaySetRefit> {
  const found = await findDecaySet(lab, setId);
  await requireMayRefit(lab, found, actor);
  requireSetVersion(found, input.version);
  const outcome = await readToKeep(services, {
    ...(await keptFilesOf(services, found)),
    options: { ...found.options, model: input.model, show: 0 },
  });
  const changes = await services.sequelize.transaction(async (transaction) => {
    const set = await DecaySet.findOne({
      where: { id: setId, labId: lab.id },
      transaction,
      lock: transaction.LOCK.UPDATE,
    });
    if (!set) throw new AppError('not_found', 'No decay set with this id in this lab.', 404);
    requireSetVersion(set, input.version);
    const before = { model: set.options.model, lifetimes: set.outcomes.map((decay) => decay.lifetime) };
    await set.update(
      { options: { ...set.options, model: outcome.model }, outcomes: outcome.outcomes, engineVersion: ENGINE_VERSION },
      { transaction },
    );
    await recordLabAudit({ lab, actor, transaction }, 'decay_set_refitted', decaySetTarget(set), {
      decaySetId: set.id,
      before,
      after: { model: outcome.model, lifetimes: outcome.outcomes.map((decay) => decay.lifetime) },
      engineVersion: ENGINE_VERSION,
    });
    let study: DecaySetRefit['study'] = null;
    if (set.studyId) {
      const owner = await loadStudy(lab, set.studyId, transaction);
      requireOwner(owner, lab, actor.userId);
      requireEditable(owner);
      const placed = await placeDecaySet(owner, set, actor, transaction, 'refit');
      if (placed.points > 0 || placed.tau0) study = { studyId: owner.id, ...placed };
    }
    let lifetimeId: string | null = null;
    if (set.lifetimeId) {
      const record = await ExcitedStateLifetime.findOne({
        where: { id: set.lifetimeId, labId: lab.id },
        transaction,
        lock: transaction.LOCK.UPDATE,
      });
      const lifetime = outcome.outcomes[0]?.lifetime;
      if (record && lifetime) {
        assertMayEdit(lab, actor, record, 'lifetime');
        const fields = {
          value: lifetime.value,
          uncertainty: lifetime.standardError,
          method: methodOf(outcome.model),
          notes: notesWithBasis(record.notes, lifetime.basis),
        };
        const diff = changedFields(record.get({ plain: true }) as Record<string, unknown>, fields);
        await record.update(fields, { transaction });
        await recordLabAudit({ lab, actor, transaction }, 'lifetime_changed', ['lifetime', record.id], {
          ...diff,
          decaySetId: set.id,
        });
        lifetimeId = record.id;
      }
    }
    return { study, lifetimeId };
  });
  const set = await findDecaySet(lab, setId);
  let lifetime: DecaySetRefit['lifetime'] = null;
  if (changes.lifetimeId && set.compoundId) {
    const dependents = await lifetimeDependents(services.sequelize, lab, set.compoundId, changes.lifetimeId);
    lifetime = {
      lifetimeId: changes.lifetimeId,
      value: dependents.value,
      uncertainty: dependents.uncertainty,
      outdatedStudies: dependents.studies.filter((study) => !study.matchesRecord).length,
    };
  }
  return { set: toDecaySet(set), study: changes.study, lifetime };
}
