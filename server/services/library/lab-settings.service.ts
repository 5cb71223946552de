import type { Sequelize } from 'sequelize';
import type { LabSettingsUpdate } from '@shared/schemas/lab-settings';
import type { LabSettings } from '@shared/schemas/library-views';
import type { LabContext } from '../../domain/lab-context';
import { Lab } from '../../models';
import { recordLabAudit } from '../audit.service';
import type { Actor } from '../../domain/actor';
import { changedFields, labDisplaySettings } from './library-access.service';

export const getLabSettings = (lab: LabContext): Promise<LabSettings> => labDisplaySettings(lab.id);

/** Admins change the reference the lab reads potentials in; stored values stay as entered. */
export async function updateLabSettings(
  sequelize: Sequelize,
  lab: LabContext,
  actor: Actor,
  changes: LabSettingsUpdate,
): Promise<LabSettings> {
  return sequelize.transaction(async (transaction) => {
    const row = await Lab.findByPk(lab.id, { transaction, lock: transaction.LOCK.UPDATE });
    const before = { displayReference: row!.displayReference, displaySolvent: row!.displaySolvent };
    await row!.update(changes, { transaction });
    await recordLabAudit(
      { lab, actor, transaction },
      'lab_settings_changed',
      ['lab', lab.id],
      changedFields(before, changes),
    );
    return { displayReference: row!.displayReference, displaySolvent: row!.displaySolvent };
  });
}
