import { afterAll, describe, expect, it } from 'vitest';
import { createMigrator } from '../../server/db/migrator';
import { createSequelize } from '../../server/db/sequelize';
import { startThrowawayCluster } from '../support/throwaway-cluster';

const cleanups: Array<() => Promise<void> | void> = [];
afterAll(async () => {
  for (const cleanup of cleanups.reverse()) await cleanup();
});

const MIGRATION = '20261203-1830-study-filter-indexes-with-id';

describe(`migration ${MIGRATION}`, { timeout: 240_000 }, () => {
  it('when it is applied, undone and applied again, then each filter index of the studies list ends in id, and undone it is as before', async () => {
    const cluster = await startThrowawayCluster();
    cleanups.push(() => cluster.stop());
    const sequelize = createSequelize(cluster.url);
    cleanups.push(() => sequelize.close());
    const migrator = createMigrator(sequelize);
    const filterIndexes = async () =>
      Object.fromEntries(
        (
          await cluster.query<{ indexname: string; indexdef: string }>(
            `SELECT indexname, indexdef FROM pg_indexes
             WHERE tablename = 'studies' AND indexname ~ '(status|owner_id|solvent_id|flagged)' AND indexname <> 'studies_lab_owner_status'
             ORDER BY indexname`,
          )
        ).map((row) => [row.indexname, row.indexdef.replace(/^.* USING btree /, '')]),
      );
    const withId = {
      studies_lab_flagged_updated_at_id: '(lab_id, updated_at DESC, id) WHERE (is_current AND flagged)',
      studies_lab_owner_id_updated_at_id: '(lab_id, owner_id, updated_at DESC, id) WHERE is_current',
      studies_lab_solvent_id_updated_at_id: '(lab_id, solvent_id, updated_at DESC, id) WHERE is_current',
      studies_lab_status_updated_at_id: '(lab_id, status, updated_at DESC, id) WHERE is_current',
    };
    expect(await filterIndexes()).toEqual(withId);

    await migrator.down({ to: MIGRATION });
    // As migration 0005 made them.
    expect(await filterIndexes()).toEqual({
      studies_lab_flagged: '(lab_id, updated_at DESC) WHERE (is_current AND flagged)',
      studies_lab_id_owner_id_updated_at: '(lab_id, owner_id, updated_at DESC) WHERE is_current',
      studies_lab_id_solvent_id_updated_at: '(lab_id, solvent_id, updated_at DESC) WHERE is_current',
      studies_lab_id_status_updated_at: '(lab_id, status, updated_at DESC) WHERE is_current',
    });

    await migrator.up();
    expect(await migrator.pending()).toEqual([]);
    expect(await filterIndexes()).toEqual(withId);
  });
});
