import type { MigrationModule } from '../db/migrator';

/**
 * How many current studies each lab holds, by owner, status and flag: the studies list's total
 * without counting rows (server/services/studies/study-list.service.ts). The count of a lab of
 * 5,000 studies read all 5,000 index entries on every page (about 3 ms of PostgreSQL per request
 * under the load benchmark); a sum over this lab's few rows costs what a lookup does.
 *
 * Triggers on studies keep it, in the same statement as the change and so in its transaction:
 * whatever changes a study (a service, a revision, a migration, an owner's account removed and
 * its studies set to no owner, a lab removed) moves the counts with it, and a change that rolls
 * back takes its counts with it. They are statement-level with transition tables, so a bulk
 * INSERT … SELECT (demo data, benchmarks) costs one update per key rather than one per row, and a
 * change that moves no count (new points, a fit) writes nothing here. A statement writes its keys
 * in one order, so two bulk changes do not lock each other's rows crosswise. Removed studies only
 * decrement rows that exist: a lab removed takes its counts along (ON DELETE CASCADE), whichever
 * of the two cascades runs first.
 *
 * A study without owner is counted under owner_id NULL; the unique index names it through
 * coalesce so that NULLs meet (without PostgreSQL 15's NULLS NOT DISTINCT).
 */
const NO_OWNER = "'00000000-0000-0000-0000-000000000000'::uuid";

export const up: MigrationModule['up'] = async ({ context: queryInterface }) => {
  const run = (sql: string) => queryInterface.sequelize.query(sql);
  await run(`
    CREATE TABLE lab_study_counts (
      lab_id uuid NOT NULL REFERENCES labs (id) ON DELETE CASCADE,
      owner_id uuid,
      status enum_studies_status NOT NULL,
      flagged boolean NOT NULL,
      n integer NOT NULL
    )`);
  await run(
    `CREATE UNIQUE INDEX lab_study_counts_key ON lab_study_counts (lab_id, (coalesce(owner_id, ${NO_OWNER})), status, flagged)`,
  );
  await run(`
    CREATE FUNCTION lab_study_counts_follow() RETURNS trigger LANGUAGE plpgsql AS $$
    BEGIN
      -- Each branch names only the transition tables its event has.
      IF TG_OP = 'DELETE' THEN
        UPDATE lab_study_counts c SET n = c.n - d.n
          FROM (SELECT lab_id, owner_id, status, flagged, count(*)::int AS n
                  FROM old_rows WHERE is_current GROUP BY 1, 2, 3, 4) d
         WHERE c.lab_id = d.lab_id AND c.owner_id IS NOT DISTINCT FROM d.owner_id
           AND c.status = d.status AND c.flagged = d.flagged;
      ELSIF TG_OP = 'INSERT' THEN
        INSERT INTO lab_study_counts AS c (lab_id, owner_id, status, flagged, n)
        SELECT lab_id, owner_id, status, flagged, count(*)::int FROM new_rows WHERE is_current
         GROUP BY 1, 2, 3, 4 ORDER BY 1, 2, 3, 4
        ON CONFLICT (lab_id, (coalesce(owner_id, ${NO_OWNER})), status, flagged) DO UPDATE SET n = c.n + excluded.n;
      ELSE
        INSERT INTO lab_study_counts AS c (lab_id, owner_id, status, flagged, n)
        SELECT lab_id, owner_id, status, flagged, sum(n)::int FROM (
          SELECT lab_id, owner_id, status, flagged, 1 AS n FROM new_rows WHERE is_current
          UNION ALL
          SELECT lab_id, owner_id, status, flagged, -1 FROM old_rows WHERE is_current) changes
         GROUP BY 1, 2, 3, 4 HAVING sum(n) <> 0 ORDER BY 1, 2, 3, 4
        ON CONFLICT (lab_id, (coalesce(owner_id, ${NO_OWNER})), status, flagged) DO UPDATE SET n = c.n + excluded.n;
      END IF;
      RETURN NULL;
    END $$`);
  await run(`
    CREATE TRIGGER lab_study_counts_insert AFTER INSERT ON studies
      REFERENCING NEW TABLE AS new_rows FOR EACH STATEMENT EXECUTE FUNCTION lab_study_counts_follow()`);
  await run(`
    CREATE TRIGGER lab_study_counts_update AFTER UPDATE ON studies
      REFERENCING OLD TABLE AS old_rows NEW TABLE AS new_rows FOR EACH STATEMENT EXECUTE FUNCTION lab_study_counts_follow()`);
  await run(`
    CREATE TRIGGER lab_study_counts_delete AFTER DELETE ON studies
      REFERENCING OLD TABLE AS old_rows FOR EACH STATEMENT EXECUTE FUNCTION lab_study_counts_follow()`);
  // The studies already kept, counted once. The migration's transaction holds the lock CREATE
  // TRIGGER took on studies until it commits, so no change slips between this count and the triggers.
  await run(`
    INSERT INTO lab_study_counts (lab_id, owner_id, status, flagged, n)
    SELECT lab_id, owner_id, status, flagged, count(*) FROM studies WHERE is_current GROUP BY 1, 2, 3, 4`);
};

export const down: MigrationModule['down'] = async ({ context: queryInterface }) => {
  const run = (sql: string) => queryInterface.sequelize.query(sql);
  for (const event of ['insert', 'update', 'delete'])
    await run(`DROP TRIGGER IF EXISTS lab_study_counts_${event} ON studies`);
  await run('DROP FUNCTION IF EXISTS lab_study_counts_follow()');
  await run('DROP TABLE IF EXISTS lab_study_counts');
};
