import { QueryTypes, type Sequelize } from 'sequelize';
import { AppError } from '../../lib/app-error';
import { Study, StudyFit } from '../../models';
import { refitStudy } from './study-fitting.service';

/**
 * Latest fits stored by an engine older than this are fitted again at start: engine 1.0.0 stored
 * plot series without their axis titles and without the left-out points (see
 * shared/engine/README.md, section 12). Raise it when a new engine stores what older screens cannot
 * read; a plain ENGINE_VERSION bump leaves stored fits as they were fitted.
 */
export const OLDEST_CURRENT_FIT_ENGINE = '1.1.0';
/**
 * With a correction switched on, the points grid shows the corrected values the latest fit stored
 * (engine 1.5.0 on); a study whose latest fit is older is fitted again at start to get them.
 */
export const OLDEST_FIT_WITH_CORRECTIONS = '1.5.0';

// Versions compared as integer arrays in PostgreSQL ("1.10.0" after "1.9.0"); a version that is
// not numbers and dots counts as outdated.
const olderThan = (version: string) => `
  CASE WHEN f.engine_version ~ '^[0-9]+(\\.[0-9]+)*$'
       THEN string_to_array(f.engine_version, '.')::int[] < string_to_array(${version}, '.')::int[]
       ELSE true END`;
const outdatedSql = `
  SELECT s.id FROM studies s JOIN study_fits f ON f.id = s.latest_fit_id
   WHERE ${olderThan('$1')}
      OR ((s.dilution_correction OR s.inner_filter_correction) AND ${olderThan('$2')})
   ORDER BY s.id`;

/**
 * Fits each study whose latest fit is outdated again with the same model and weighting (a new fit
 * record with trigger "auto"; the old record is kept), one study per transaction. Runs at start
 * under the migration lock (server/boot/database.ts), so a read never writes. A study that cannot
 * be fitted now keeps its old record and is tried again at the next start. Returns the studies
 * fitted again.
 */
export async function refitOutdatedFits(sequelize: Sequelize): Promise<number> {
  const outdated = await sequelize.query<{ id: string }>(outdatedSql, {
    bind: [OLDEST_CURRENT_FIT_ENGINE, OLDEST_FIT_WITH_CORRECTIONS],
    type: QueryTypes.SELECT,
  });
  let refitted = 0;
  for (const { id } of outdated) {
    try {
      const done = await sequelize.transaction(async (transaction) => {
        const study = await Study.findByPk(id, { transaction, lock: transaction.LOCK.UPDATE });
        const fit = study?.latestFitId
          ? await StudyFit.findByPk(study.latestFitId, { attributes: ['id', 'model', 'weighting'], transaction })
          : null;
        if (!study || !fit) return false;
        const actor = { userId: null, ip: null };
        await refitStudy(study, {
          model: fit.model,
          weighting: fit.weighting ?? study.fitWeighting,
          trigger: 'auto',
          actor,
          transaction,
          refuseUnfittable: true,
        });
        return true;
      });
      if (done) refitted += 1;
    } catch (error) {
      if (!(error instanceof AppError)) throw error;
    }
  }
  return refitted;
}
