import { afterAll, describe, expect, it } from 'vitest';
import { inject } from 'vitest';
import { sessionWithMembershipSql } from '../../server/auth/session-membership';
import { selectRows } from '../../server/db/select-rows';
import { createSequelize } from '../../server/db/sequelize';
import { initModels } from '../../server/models';
import { apiClient, createLabWithMembers } from '../support/accounts';
import { createStudy, exactPoints } from '../support/studies';
import { createTestApp } from '../support/test-app';

// One connection per pool, so the statements of the requests and the look at them share it
// (pg_prepared_statements shows the current connection's statements only).
const sequelize = createSequelize(inject('databaseUrl'), { pools: { read: 1, write: 1 } });
initModels(sequelize);
const testApp = await createTestApp({ sequelize });
afterAll(async () => {
  await testApp.close();
  await sequelize.close();
});

type Prepared = { statement: string; generic_plans: string; custom_plans: string };

describe('statements every read asks', () => {
  it('when one study is opened again and again, then its statement and the session read with the membership are planned once and kept', async () => {
    const { lab, users } = await createLabWithMembers(sequelize, { roles: ['researcher'] });
    const client = await apiClient(testApp.app);
    await client.signIn(users.researcher);
    const study = await createStudy(client, lab.id, 'prepared');
    await client.patch(`/api/labs/${lab.id}/studies/${study.id}/points`, { version: 0, points: exactPoints });
    const url = `/api/labs/${lab.id}/studies/${study.id}`;
    for (let i = 0; i < 8; i++) {
      const answer = await client.get(url);
      expect(answer.status).toBe(200);
      expect(answer.body.points).toHaveLength(exactPoints.length);
    }
    // The session row with the membership is read on the session store's own connections, which
    // this test cannot look into: the same prepared statement is asked here as the store asks it,
    // for the same session and lab, on the connection the test looks at.
    const [session] = await selectRows<{ sid: string }>(
      sequelize,
      `SELECT sid FROM sessions WHERE sess #>> '{passport,user}' = $1`,
      [users.researcher.id],
    );
    for (let i = 0; i < 8; i++) {
      const [row] = await selectRows<{ role: string }>(sequelize, sessionWithMembershipSql, [
        session!.sid,
        Math.ceil(Date.now() / 1000),
        lab.id,
      ]);
      expect(row?.role).toBe('researcher');
    }
    const prepared = await selectRows<Prepared>(
      sequelize,
      'SELECT statement, generic_plans, custom_plans FROM pg_prepared_statements',
    );
    // PostgreSQL plans a prepared statement for its values the first five times, then keeps one
    // generic plan when that costs no more ("PREPARE", PostgreSQL documentation, plan_cache_mode).
    for (const marker of ['AS reviews', 'LEFT JOIN memberships m']) {
      const statement = prepared.find((row) => row.statement.includes(marker));
      expect(statement, marker).toBeDefined();
      expect(Number(statement!.generic_plans), marker).toBeGreaterThanOrEqual(1);
      expect(Number(statement!.custom_plans), marker).toBeLessThanOrEqual(5);
    }
  });

  it('when the dashboard is opened again and again, then its lists and its activity run as one prepared statement per kind of reader, and the answer stays the same', async () => {
    const { lab, users } = await createLabWithMembers(sequelize, { roles: ['reviewer', 'researcher'] });
    const researcher = await apiClient(testApp.app);
    await researcher.signIn(users.researcher);
    const drafted = await createStudy(researcher, lab.id, 'dashboard draft');
    const reviewer = await apiClient(testApp.app);
    await reviewer.signIn(users.reviewer);
    const url = `/api/labs/${lab.id}/dashboard`;
    const first = await reviewer.get(url);
    expect(first.status).toBe(200);
    for (let i = 0; i < 7; i++) {
      const [asReviewer, asResearcher] = [await reviewer.get(url), await researcher.get(url)];
      expect(asReviewer.body).toEqual(first.body);
      expect(asResearcher.body.myDrafts.map((study: { id: string }) => study.id)).toEqual([drafted.id]);
    }
    const prepared = await selectRows<Prepared>(
      sequelize,
      'SELECT statement, generic_plans, custom_plans FROM pg_prepared_statements',
    );
    // A reviewer's lists add "waiting for my review": two texts, one for each kind of reader.
    const lists = prepared.filter((row) => row.statement.includes("'myDrafts' AS list"));
    const reviewerLists = lists.filter((row) => row.statement.includes("'waitingForMyReview' AS list"));
    const events = prepared.filter((row) => row.statement.includes('FROM audit_events'));
    // Each run of a prepared statement counts one plan, custom or generic (pg_prepared_statements).
    // Which of the two PostgreSQL keeps depends on the statistics of the whole test database (other
    // files fill it at the same time), so only the runs are counted here: 8 as reviewer, 7 as
    // researcher. The activity is read in the same statement as the lists.
    const runs = (rows: Prepared[]) => rows.map((row) => Number(row.generic_plans) + Number(row.custom_plans));
    expect(lists).toHaveLength(2);
    expect(runs(reviewerLists)).toEqual([8]);
    expect(runs(lists).sort((a, b) => a - b)).toEqual([7, 8]);
    expect(events).toEqual(lists);
  });

  it('when the studies list is paged, then a first page or a cursor page with one index for its order runs prepared, and a text search does not', async () => {
    const { lab, users } = await createLabWithMembers(sequelize, { roles: ['researcher'] });
    const researcher = await apiClient(testApp.app);
    await researcher.signIn(users.researcher);
    for (const tag of ['listed one', 'listed two', 'listed three']) await createStudy(researcher, lab.id, tag);
    const base = `/api/labs/${lab.id}/studies`;
    const first = await researcher.get(`${base}?pageSize=2`);
    expect(first.body.items).toHaveLength(2);
    const next = await researcher.get(`${base}?pageSize=2&cursor=${encodeURIComponent(first.body.nextCursor)}`);
    expect(next.body.items).toHaveLength(1);
    // Same answer as a page planned for its values (a text search matching every study here).
    const searched = await researcher.get(`${base}?pageSize=2&q=listed`);
    expect(searched.body.items).toEqual(first.body.items);
    expect(searched.body.total).toBe(3);

    const prepared = await selectRows<Prepared>(
      sequelize,
      'SELECT statement, generic_plans, custom_plans FROM pg_prepared_statements',
    );
    const pages = prepared.filter((row) => row.statement.includes('AS "sortKey"'));
    // pageSize=2 is not one of the usual sizes: neither page was prepared.
    expect(pages).toEqual([]);
    for (const query of ['pageSize=25', 'pageSize=25', 'status=draft', `ownerId=${users.researcher.id}`, 'q=listed']) {
      expect((await researcher.get(`${base}?${query}`)).body.total).toBe(3);
    }
    const after = await selectRows<Prepared>(
      sequelize,
      'SELECT statement, generic_plans, custom_plans FROM pg_prepared_statements',
    );
    const kept = after.filter((row) => row.statement.includes('AS "sortKey"'));
    // The unfiltered page (asked twice), the status page and the owner page; not the text search.
    expect(kept.map((row) => Number(row.generic_plans) + Number(row.custom_plans)).sort()).toEqual([1, 1, 2]);
    expect(kept.some((row) => row.statement.includes('ILIKE'))).toBe(false);
    // The totals of those three came from lab_study_counts, prepared as well.
    expect(after.filter((row) => row.statement.includes('FROM lab_study_counts'))).toHaveLength(3);
  });

  it('when the compounds are listed again and again, with and without a search or a role, then each of those lists runs prepared and answers as before', async () => {
    const { lab, users } = await createLabWithMembers(sequelize, { roles: ['researcher'] });
    const researcher = await apiClient(testApp.app);
    await researcher.signIn(users.researcher);
    const base = `/api/labs/${lab.id}/compounds`;
    for (const [name, roleHint] of [
      ['HL-Ir-prep-1', 'photocatalyst'],
      ['HL-Q-prep-1', 'quencher'],
      ['HL-Q-prep-2', 'quencher'],
      ['HL-Both-prep', 'both'],
    ]) {
      expect((await researcher.post(base, { name, roleHint })).status).toBe(201);
    }
    const names = (body: { items: Array<{ name: string }> }) => body.items.map((item) => item.name);
    const asked: Array<[string, string[], number]> = [
      ['', ['HL-Both-prep', 'HL-Ir-prep-1', 'HL-Q-prep-1', 'HL-Q-prep-2'], 4],
      ['?roleHint=quencher', ['HL-Both-prep', 'HL-Q-prep-1', 'HL-Q-prep-2'], 3],
      ['?search=q-prep', ['HL-Q-prep-1', 'HL-Q-prep-2'], 2],
      ['?search=prep&roleHint=photocatalyst&pageSize=1&page=2', ['HL-Ir-prep-1'], 2],
    ];
    // Past the first five runs PostgreSQL may keep a generic plan: the answers must not change.
    for (let i = 0; i < 7; i++) {
      for (const [query, expected, total] of asked) {
        const answer = await researcher.get(`${base}${query}`);
        expect(answer.status).toBe(200);
        expect(names(answer.body), query).toEqual(expected);
        expect(answer.body.total, query).toBe(total);
      }
    }
    const prepared = await selectRows<Prepared>(
      sequelize,
      'SELECT statement, generic_plans, custom_plans FROM pg_prepared_statements',
    );
    const lists = prepared.filter((row) => row.statement.includes('AS potentials'));
    // Four texts (search or not, role or not), each run once per round: 7 runs each.
    expect(lists.map((row) => Number(row.generic_plans) + Number(row.custom_plans))).toEqual([7, 7, 7, 7]);
  });

  it('when the list is filtered by emitter, quencher or solvent, then a first page with one filter runs prepared with its count inside, and every round answers as a recount of the studies', async () => {
    const { lab, users } = await createLabWithMembers(sequelize, { roles: ['researcher'] });
    const researcher = await apiClient(testApp.app);
    await researcher.signIn(users.researcher);
    const tag = lab.id.slice(0, 6);
    const first = await createStudy(researcher, lab.id, `filters-a-${tag}`);
    const second = await createStudy(researcher, lab.id, `filters-b-${tag}`, { solventId: 'dichloromethane' });
    const [e1, q1, e2, q2] = [first.emitter.id, first.quencher.id, second.emitter.id, second.quencher.id];
    const reuse = (emitterId: string, quencherId: string, solventId: string) => ({
      newEmitterName: undefined,
      newQuencherName: undefined,
      emitterId,
      quencherId,
      solventId,
    });
    await createStudy(researcher, lab.id, `filters-c-${tag}`, reuse(e1, q2, 'dichloromethane'));
    await createStudy(researcher, lab.id, `filters-d-${tag}`, reuse(e2, q1, 'acetonitrile'));
    await createStudy(researcher, lab.id, `filters-e-${tag}`, reuse(e1, q1, 'dichloromethane'));
    const submitted = await createStudy(researcher, lab.id, `filters-f-${tag}`, reuse(e1, q1, 'acetonitrile'));
    await selectRows(sequelize, "UPDATE studies SET status = 'submitted' WHERE id = $1", [submitted.id]);

    const cases: Array<[string, string, unknown[]]> = [
      [`emitterId=${e1}`, 'AND s.emitter_id = $2', [e1]],
      [`quencherId=${q1}`, 'AND s.quencher_id = $2', [q1]],
      ['solventId=dichloromethane', "AND s.solvent_id = 'dichloromethane'", []],
      [`emitterId=${e1}&solventId=acetonitrile`, "AND s.emitter_id = $2 AND s.solvent_id = 'acetonitrile'", [e1]],
      [
        `emitterId=${e1}&quencherId=${q1}&solventId=dichloromethane`,
        "AND s.emitter_id = $2 AND s.quencher_id = $3 AND s.solvent_id = 'dichloromethane'",
        [e1, q1],
      ],
      [`emitterId=${e1}&status=submitted`, "AND s.emitter_id = $2 AND s.status = 'submitted'", [e1]],
      [`quencherId=${q2}&sort=kq`, 'AND s.quencher_id = $2', [q2]],
    ];
    type Listed = { id: string; emitterName: string; quencherName: string; ownerName: string | null };
    type Summary = { id: string; emitter: { name: string }; quencher: { name: string }; ownerName: string | null };
    // Past the first five runs PostgreSQL may keep a generic plan: every round must still answer
    // what the studies themselves say, names included.
    for (let round = 0; round < 7; round++) {
      for (const [query, condition, extra] of cases) {
        const expected = await selectRows<Listed>(
          sequelize,
          `SELECT s.id, e.name AS "emitterName", q.name AS "quencherName", o.name AS "ownerName"
             FROM studies s JOIN compounds e ON e.id = s.emitter_id JOIN compounds q ON q.id = s.quencher_id
             LEFT JOIN users o ON o.id = s.owner_id
            WHERE s.lab_id = $1 AND s.is_current ${condition}
            ORDER BY ${query.includes('sort=kq') ? 's.kq DESC NULLS LAST' : 's.updated_at DESC'}, s.id`,
          [lab.id, ...extra],
        );
        const answer = await researcher.get(`/api/labs/${lab.id}/studies?${query}`);
        expect(answer.status, query).toBe(200);
        expect(answer.body.total, query).toBe(expected.length);
        expect(
          answer.body.items.map((item: Summary) => ({
            id: item.id,
            emitterName: item.emitter.name,
            quencherName: item.quencher.name,
            ownerName: item.ownerName,
          })),
          query,
        ).toEqual(expected);
      }
    }
    const prepared = await selectRows<Prepared>(
      sequelize,
      'SELECT statement, generic_plans, custom_plans FROM pg_prepared_statements',
    );
    const counts = prepared.filter((row) =>
      row.statement.includes('SELECT count(*)::int AS n FROM (SELECT 1 FROM studies'),
    );
    // A first page carries its count in its own statement (one round trip): with one filter sorted
    // by change one plan suits every lab, so the page runs prepared, one text per filter, 7 runs
    // each. Two filters, or a filter sorted by kq, are planned for their values each time, count
    // and all, so no other prepared text holds the count.
    expect(counts.every((row) => row.statement.trimStart().startsWith('SELECT p.id'))).toBe(true);
    expect(counts.map((row) => Number(row.generic_plans) + Number(row.custom_plans)).sort((a, b) => a - b)).toEqual([
      7, 7, 7,
    ]);
  });
});
