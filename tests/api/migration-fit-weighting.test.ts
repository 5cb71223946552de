import { afterAll, describe, expect, it } from 'vitest';
import { createMigrator } from '../../server/db/migrator';
import { createSequelize } from '../../server/db/sequelize';
import { startThrowawayCluster } from '../support/throwaway-cluster';

const cleanups: Array<() => Promise<void> | void> = [];
afterAll(async () => {
  for (const cleanup of cleanups.reverse()) await cleanup();
});

// Rows as they stood before 20261202-1200-fit-weighting, written with plain SQL (the models
// already know the columns that migration adds). Invented names and numbers.
const seedSql = `
  WITH lab AS (
    INSERT INTO labs (id, name, slug, created_at, updated_at)
    VALUES (gen_random_uuid(), 'Migration lab', 'migration-lab', now(), now()) RETURNING id
  ), emitter AS (
    INSERT INTO compounds (id, lab_id, name, role_hint, created_at, updated_at)
    SELECT gen_random_uuid(), id, 'TEST-emitter', 'photocatalyst', now(), now() FROM lab RETURNING id, lab_id
  ), quencher AS (
    INSERT INTO compounds (id, lab_id, name, role_hint, created_at, updated_at)
    SELECT gen_random_uuid(), lab_id, 'TEST-quencher', 'quencher', now(), now() FROM emitter RETURNING id
  )
  INSERT INTO studies (id, lab_id, emitter_id, quencher_id, title, atmosphere, degassing_method, created_at, updated_at)
  SELECT gen_random_uuid(), e.lab_id, e.id, q.id, t.title, 'argon', 'sparging', now(), now()
    FROM emitter e, quencher q,
         (VALUES ('every sigma'), ('one sigma missing'), ('two runs'), ('no points'), ('only a left-out sigma')) t(title)`;

/** Points of one study: [Q] (mol/L), σ (or null), run and whether left out. */
async function addPoints(
  query: (sql: string, values?: unknown[]) => Promise<unknown[]>,
  title: string,
  points: Array<[number, number | null, number, boolean]>,
) {
  for (const [position, [q, sigma, series, excluded]] of points.entries()) {
    await query(
      `INSERT INTO study_points (id, study_id, position, concentration, intensity, uncertainty, series, excluded)
       SELECT gen_random_uuid(), id, $2, $3, $4, $5, $6, $7 FROM studies WHERE title = $1`,
      [title, position, q, 1000 / (1 + 500 * q), sigma, series, excluded],
    );
  }
}

describe('migration 20261202-1200-fit-weighting on a database with studies', { timeout: 240_000 }, () => {
  it('when studies and fits exist, then only single-run studies whose every kept point has a σ become weighted and old fits record none', async () => {
    const cluster = await startThrowawayCluster({ migrate: false });
    cleanups.push(() => cluster.stop());
    const sequelize = createSequelize(cluster.url);
    cleanups.push(() => sequelize.close());
    const migrator = createMigrator(sequelize);
    await migrator.up({ to: '20261202-1100-replicate-series' });
    const query = (sql: string, values: unknown[] = []) => cluster.query(sql, values);

    await query(seedSql);
    await addPoints(query, 'every sigma', [
      [0, 5, 1, false],
      [1e-3, 4, 1, false],
      [2e-3, 3, 1, false],
      [3e-3, null, 1, true], // left out: its missing σ does not count
    ]);
    await addPoints(query, 'one sigma missing', [
      [0, 5, 1, false],
      [1e-3, null, 1, false],
      [2e-3, 3, 1, false],
    ]);
    await addPoints(query, 'two runs', [
      [0, 5, 1, false],
      [1e-3, 4, 1, false],
      [0, 5, 2, false],
      [1e-3, 4, 2, false],
    ]);
    await addPoints(query, 'only a left-out sigma', [[0, 5, 1, true]]);
    await query(
      `INSERT INTO study_fits (id, study_id, model, trigger, result, points_used, engine_version, created_at)
       SELECT gen_random_uuid(), id, 'linear-free', 'auto', '{}'::jsonb, '[]'::jsonb, '1.2.0', now()
         FROM studies WHERE title = 'every sigma'`,
    );

    await migrator.up({ to: '20261202-1200-fit-weighting' });
    const studies = await query(`SELECT title, fit_weighting FROM studies ORDER BY title`);
    expect(studies).toEqual([
      { title: 'every sigma', fit_weighting: 'weighted' },
      { title: 'no points', fit_weighting: 'unweighted' },
      { title: 'one sigma missing', fit_weighting: 'unweighted' },
      { title: 'only a left-out sigma', fit_weighting: 'unweighted' },
      { title: 'two runs', fit_weighting: 'unweighted' },
    ]);
    expect(await query('SELECT weighting FROM study_fits')).toEqual([{ weighting: null }]);
    await expect(query(`UPDATE studies SET fit_weighting = 'heavy' WHERE title = 'two runs'`)).rejects.toThrow(
      /studies_fit_weighting_known/,
    );

    // and every later migration applies on top of these rows
    await migrator.up();
    expect(await migrator.pending()).toEqual([]);
    expect(await query(`SELECT count(*)::int AS n FROM study_points`)).toEqual([{ n: 12 }]);
  });
});
