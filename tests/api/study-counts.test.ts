import { QueryTypes, type Transaction } from 'sequelize';
import { afterAll, describe, expect, it } from 'vitest';
import { apiClient, createLabWithMembers } from '../support/accounts';
import { createStudy, exactPoints } from '../support/studies';
import { createTestApp } from '../support/test-app';

const testApp = await createTestApp();
afterAll(testApp.close);
const { sequelize } = testApp;

type Count = { owner_id: string | null; status: string; flagged: boolean; n: number };

const rows = (sql: string, bind: unknown[]) => sequelize.query<Count>(sql, { bind, type: QueryTypes.SELECT });

/** What lab_study_counts holds for the lab (rows brought down to zero say nothing). */
const kept = (labId: string) =>
  rows(
    `SELECT owner_id, status::text, flagged, n FROM lab_study_counts WHERE lab_id = $1 AND n <> 0
      ORDER BY owner_id NULLS FIRST, status, flagged`,
    [labId],
  );

/** The same counts computed again from the studies themselves. */
const recomputed = (labId: string) =>
  rows(
    `SELECT owner_id, status::text, flagged, count(*)::int AS n FROM studies WHERE lab_id = $1 AND is_current
      GROUP BY 1, 2, 3 ORDER BY owner_id NULLS FIRST, status, flagged`,
    [labId],
  );

async function expectCountsTrue(labId: string) {
  const computed = await recomputed(labId);
  expect(await kept(labId)).toEqual(computed);
  return computed;
}

async function newLab() {
  const { lab, users } = await createLabWithMembers(sequelize, { roles: ['researcher', 'reviewer'] });
  const researcher = await apiClient(testApp.app);
  await researcher.signIn(users.researcher);
  const reviewer = await apiClient(testApp.app);
  await reviewer.signIn(users.reviewer);
  return { labId: lab.id, users, researcher, reviewer };
}

describe('lab_study_counts (the studies list total)', () => {
  it('when a study is created, fitted, submitted, returned, approved and revised, then the counts equal the studies after each step', async () => {
    const { labId, researcher, reviewer } = await newLab();
    const base = `/api/labs/${labId}/studies`;
    expect(await expectCountsTrue(labId)).toEqual([]);

    const study = await createStudy(researcher, labId, `counts-${labId.slice(0, 6)}`);
    const other = await createStudy(researcher, labId, `counts-other-${labId.slice(0, 6)}`);
    expect((await expectCountsTrue(labId)).map((row) => [row.status, row.n])).toEqual([['draft', 2]]);

    const fitted = await researcher.patch(`${base}/${study.id}/points`, {
      version: study.version,
      points: exactPoints,
    });
    expect(fitted.status, JSON.stringify(fitted.body)).toBe(200);
    await expectCountsTrue(labId);

    expect((await researcher.post(`${base}/${study.id}/submit`, {})).status).toBe(200);
    await expectCountsTrue(labId);
    expect((await reviewer.post(`${base}/${study.id}/return`, { comment: 'Add a blank.' })).status).toBe(200);
    await expectCountsTrue(labId);
    expect((await researcher.post(`${base}/${study.id}/submit`, {})).status).toBe(200);
    expect((await reviewer.post(`${base}/${study.id}/approve`, {})).status).toBe(200);
    await expectCountsTrue(labId);

    // A revision is a new current draft; the approved one it came from is no longer current.
    const revision = await researcher.post(`${base}/${study.id}/revisions`);
    expect(revision.status, JSON.stringify(revision.body)).toBe(201);
    expect((await expectCountsTrue(labId)).map((row) => [row.status, row.n])).toEqual([['draft', 2]]);

    // Flagged (set here directly; a fit sets it from its checks) and back.
    await sequelize.query('UPDATE studies SET flagged = true WHERE id = $1', { bind: [other.id] });
    expect((await expectCountsTrue(labId)).some((row) => row.flagged)).toBe(true);
    await sequelize.query('UPDATE studies SET flagged = false WHERE id = $1', { bind: [other.id] });
    await expectCountsTrue(labId);
  });

  it('when the list is asked with no filter or by owner, status and flag, then its total equals a count of the studies', async () => {
    const { labId, users, researcher } = await newLab();
    const made = [];
    for (let i = 0; i < 5; i++) made.push(await createStudy(researcher, labId, `total-${i}-${labId.slice(0, 6)}`));
    await sequelize.query("UPDATE studies SET status = 'submitted', flagged = true WHERE id IN ($1, $2)", {
      bind: [made[0]!.id, made[1]!.id],
    });
    await sequelize.query("UPDATE studies SET status = 'approved' WHERE id = $1", { bind: [made[2]!.id] });
    await sequelize.query('UPDATE studies SET owner_id = NULL WHERE id = $1', { bind: [made[3]!.id] });
    const queries: Array<[string, string, unknown[]]> = [
      ['', '', []],
      ['status=draft', "AND status = 'draft'", []],
      ['status=submitted&flagged=true', "AND status = 'submitted' AND flagged", []],
      ['flagged=true', 'AND flagged', []],
      [`ownerId=${users.researcher.id}`, 'AND owner_id = $2', [users.researcher.id]],
      [
        `ownerId=${users.reviewer.id}&status=approved`,
        "AND owner_id = $2 AND status = 'approved'",
        [users.reviewer.id],
      ],
    ];
    for (const [query, condition, extra] of queries) {
      const [{ n }] = (await sequelize.query<{ n: number }>(
        `SELECT count(*)::int AS n FROM studies WHERE lab_id = $1 AND is_current ${condition}`,
        { bind: [labId, ...extra], type: QueryTypes.SELECT },
      )) as [{ n: number }];
      const answer = await researcher.get(`/api/labs/${labId}/studies?${query}`);
      expect(answer.status, query).toBe(200);
      expect(answer.body, query).toMatchObject({ total: n, totalCapped: false });
    }
    await expectCountsTrue(labId);
  });

  it('when studies are added in bulk, lose their owner, are removed, or a change rolls back, then the counts still equal the studies', async () => {
    const { labId, users, researcher } = await newLab();
    const template = await createStudy(researcher, labId, `bulk-${labId.slice(0, 6)}`);
    // One INSERT … SELECT of 40 copies spread over statuses and flags, as demo data and benchmarks add them.
    await sequelize.query(
      `INSERT INTO studies (id, lab_id, emitter_id, quencher_id, title, solvent_id, atmosphere, degassing_method,
                            tau0, owner_id, status, flagged, created_at, updated_at)
       SELECT gen_random_uuid(), lab_id, emitter_id, quencher_id, 'copy ' || g, solvent_id, atmosphere,
              degassing_method, tau0, CASE WHEN g % 4 = 0 THEN NULL ELSE owner_id END,
              (ARRAY['draft', 'submitted', 'approved', 'returned'])[1 + g % 4]::enum_studies_status,
              g % 3 = 0, now(), now()
         FROM studies, generate_series(1, 40) AS g WHERE studies.id = $1`,
      { bind: [template.id] },
    );
    expect((await expectCountsTrue(labId)).reduce((sum, row) => sum + row.n, 0)).toBe(41);

    const transaction = await sequelize.transaction();
    try {
      await sequelize.query("UPDATE studies SET status = 'approved' WHERE lab_id = $1", { bind: [labId], transaction });
      await sequelize.query('DELETE FROM studies WHERE lab_id = $1 AND flagged', { bind: [labId], transaction });
      // Inside the change the counts follow it already.
      await expectCountsTrueWithin(labId, transaction);
    } finally {
      await transaction.rollback();
    }
    expect((await expectCountsTrue(labId)).reduce((sum, row) => sum + row.n, 0)).toBe(41);

    // The researcher's account removed: their studies are kept with no owner (ON DELETE SET NULL).
    await sequelize.query('DELETE FROM users WHERE id = $1', { bind: [users.researcher.id] });
    const ownerless = await expectCountsTrue(labId);
    expect(ownerless.every((row) => row.owner_id === null)).toBe(true);

    await sequelize.query('DELETE FROM studies WHERE lab_id = $1 AND flagged', { bind: [labId] });
    await expectCountsTrue(labId);

    // The lab removed: its counts go with it.
    await sequelize.query('DELETE FROM labs WHERE id = $1', { bind: [labId] });
    expect(await rows('SELECT * FROM lab_study_counts WHERE lab_id = $1', [labId])).toEqual([]);
  });

  it('when several studies are created at the same moment, then each is counted once', async () => {
    const { labId, researcher } = await newLab();
    const tag = labId.slice(0, 6);
    await Promise.all(Array.from({ length: 8 }, (_, i) => createStudy(researcher, labId, `together-${i}-${tag}`)));
    expect(await expectCountsTrue(labId)).toEqual([expect.objectContaining({ status: 'draft', flagged: false, n: 8 })]);
  });
});

async function expectCountsTrueWithin(labId: string, transaction: Transaction) {
  const within = (sql: string) => sequelize.query<Count>(sql, { bind: [labId], type: QueryTypes.SELECT, transaction });
  expect(
    await within(
      `SELECT owner_id, status::text, flagged, n FROM lab_study_counts WHERE lab_id = $1 AND n <> 0
        ORDER BY owner_id NULLS FIRST, status, flagged`,
    ),
  ).toEqual(
    await within(
      `SELECT owner_id, status::text, flagged, count(*)::int AS n FROM studies WHERE lab_id = $1 AND is_current
        GROUP BY 1, 2, 3 ORDER BY owner_id NULLS FIRST, status, flagged`,
    ),
  );
}
