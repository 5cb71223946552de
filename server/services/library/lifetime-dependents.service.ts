import { QueryTypes } from 'sequelize';
import type { Sequelize } from 'sequelize';
import type { LifetimeDependents } from '@shared/schemas/library-views';
import { fitModelSchema } from '@shared/schemas/studies';
import { AppError } from '../../lib/app-error';
import type { LabContext } from '../../domain/lab-context';
import { ExcitedStateLifetime } from '../../models';

interface StudyRow {
  id: string;
  title: string;
  status: string;
  tau0: number | null;
  tau0_uncertainty: number | null;
  fit_model: string;
  version: number;
  owner_id: string | null;
  owner_name: string | null;
  updated_at: Date;
}

/**
 * The current studies of the lab whose tau0 comes from this lifetime record, so a person can
 * decide which to refit after the record changed (never done silently). Read with SQL on the
 * studies table, which the studies feature owns; the version, model and owner let the screen
 * refit through the studies API.
 */
export async function lifetimeDependents(
  sequelize: Sequelize,
  lab: LabContext,
  compoundId: string,
  lifetimeId: string,
): Promise<LifetimeDependents> {
  const lifetime = await ExcitedStateLifetime.findOne({ where: { id: lifetimeId, compoundId, labId: lab.id } });
  if (!lifetime) throw new AppError('not_found', 'No lifetime with this id on this compound.', 404);
  const rows = await sequelize.query<StudyRow>(
    `SELECT s.id, s.title, s.status, s.tau0, s.tau0_uncertainty, s.fit_model, s.version, s.owner_id, u.name AS owner_name, s.updated_at
     FROM studies s LEFT JOIN users u ON u.id = s.owner_id
     WHERE s.lab_id = :labId AND s.tau0_lifetime_id = :lifetimeId AND s.is_current ORDER BY s.updated_at DESC`,
    { replacements: { labId: lab.id, lifetimeId }, type: QueryTypes.SELECT },
  );
  return {
    lifetimeId,
    value: lifetime.value,
    uncertainty: lifetime.uncertainty ?? null,
    studies: rows.map((row) => ({
      studyId: row.id,
      title: row.title,
      status: row.status,
      tau0: row.tau0,
      tau0Uncertainty: row.tau0_uncertainty,
      // Same doubles stored twice: equal unless the record changed after the study copied them.
      matchesRecord: row.tau0 === lifetime.value && row.tau0_uncertainty === (lifetime.uncertainty ?? null),
      fitModel: fitModelSchema.parse(row.fit_model),
      version: row.version,
      ownerId: row.owner_id,
      ownerName: row.owner_name,
      updatedAt: new Date(row.updated_at).toISOString(),
    })),
  };
}
