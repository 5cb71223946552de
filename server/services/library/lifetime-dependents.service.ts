import { QueryTypes } from 'sequelize';
import type { Sequelize } from 'sequelize';
import type { LifetimeDependents } from '@shared/schemas/library-views';
import { AppError } from '../../lib/app-error';
import type { LabContext } from '../../middleware/access';
import { ExcitedStateLifetime } from '../../models';

interface StudyRow { id: string; title: string; status: string; tau0: number | null; updated_at: Date }

/**
 * The current studies of the lab whose tau0 comes from this lifetime record, so a person can
 * decide which to refit after the record changed (never done silently). Read with SQL on the
 * studies table, which the studies feature owns.
 */
export async function lifetimeDependents(sequelize: Sequelize, lab: LabContext, compoundId: string, lifetimeId: string): Promise<LifetimeDependents> {
  const lifetime = await ExcitedStateLifetime.findOne({ where: { id: lifetimeId, compoundId, labId: lab.id } });
  if (!lifetime) throw new AppError('not_found', 'No lifetime with this id on this compound.', 404);
  const rows = await sequelize.query<StudyRow>(
    `SELECT id, title, status, tau0, updated_at FROM studies
     WHERE lab_id = :labId AND tau0_lifetime_id = :lifetimeId AND is_current ORDER BY updated_at DESC`,
    { replacements: { labId: lab.id, lifetimeId }, type: QueryTypes.SELECT },
  );
  return {
    lifetimeId,
    value: lifetime.value,
    studies: rows.map((row) => ({
      studyId: row.id,
      title: row.title,
      status: row.status,
      tau0: row.tau0,
      // Same double stored twice: equal unless the record changed after the study copied it.
      matchesRecord: row.tau0 === lifetime.value,
      updatedAt: new Date(row.updated_at).toISOString(),
    })),
  };
}
