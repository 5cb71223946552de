import { QueryTypes } from 'sequelize';
import { afterAll, describe, expect, it } from 'vitest';
import { inject } from 'vitest';
import { createSequelize } from '../../server/db/sequelize';
import { initModels } from '../../server/models';
import { signedInResearcher } from '../support/accounts';
import { createStudy, exactPoints, studyBody } from '../support/studies';
import { keptLogLines, linesWhen } from '../support/log-lines';
import { createTestApp } from '../support/test-app';

// At debug level each request's log line counts its database round trips (Sequelize's, the plain
// reads' and the session store's): the writes of bench:load's write mix, checked one by one.
const sequelize = createSequelize(inject('databaseUrl'), { timeQueries: true });
initModels(sequelize);
const { lines, logger } = keptLogLines<Line>('debug');
const testApp = await createTestApp({ sequelize, logger });
/** Each statement Sequelize ran, with the transaction it ran in. */
const statements: Array<{ sql: string; transaction: string | undefined }> = [];
sequelize.addHook('afterQuery', (options, query) => {
  const { sql } = query as unknown as { sql?: string };
  const transaction = (options.transaction as { id?: string } | null | undefined)?.id;
  if (sql) statements.push({ sql: sql.trimStart(), transaction });
});
afterAll(async () => {
  await testApp.close();
  await sequelize.close();
});

type Line = { req?: { method: string; url: string }; res?: { statusCode: number }; database?: { queries: number } };

/** The round trips of the request to `url` answered with `status`, read from its log line. */
async function roundTripsOf(send: () => PromiseLike<{ status: number }>, url: string, status: number) {
  lines.length = 0;
  expect((await send()).status).toBe(status);
  const [line] = await linesWhen(lines, (entry) => entry.req?.url === url && entry.res?.statusCode === status);
  expect(line, `no log line for ${url}`).toBeDefined();
  return line!.database?.queries ?? 0;
}

describe('round trips of the writes people make most', () => {
  it('when a study is created, its points replaced and a small file uploaded, then each takes only the steps it needs', async () => {
    const { client, csrf, labId } = await signedInResearcher(testApp);
    const first = await createStudy(client, labId, 'write-round-trips');
    const studies = `/api/labs/${labId}/studies`;
    const body = {
      ...studyBody('write-round-trips-2', { emitterId: first.emitter.id, quencherId: first.quencher.id }),
      newEmitterName: undefined,
      newQuencherName: undefined,
    };
    let created = { id: '', version: 0 };
    // Session row with the membership (one query); emitter and quencher (one query); the study with
    // its audit entry (one statement, no BEGIN or COMMIT: see the next test); the answer.
    expect(
      await roundTripsOf(
        async () => {
          const response = await client.post(studies, body);
          created = response.body;
          return response;
        },
        studies,
        201,
      ),
    ).toBe(4);
    const study = `${studies}/${created.id}`;
    // Session row with the membership; BEGIN, the study (locked), the old points; the old points
    // out, the new points, the fit, the study's version and numbers and both audit entries (one
    // statement); COMMIT; the answer.
    expect(
      await roundTripsOf(
        () => client.patch(`${study}/points`, { version: created.version, points: exactPoints }),
        `${study}/points`,
        200,
      ),
    ).toBe(7);
    // Session row with the membership, the study with any earlier upload of the same bytes (one
    // query); the upload with its bytes and its audit entry (one statement, no transaction). A
    // small series (invented numbers).
    const csv = Buffer.from('quencher (mM),intensity\n0,1000\n1,800\n2,660\n3,570\n');
    expect(
      await roundTripsOf(
        () => client.agent.post(`${study}/uploads`).set('x-csrf-token', csrf).attach('file', csv, 'series.csv'),
        `${study}/uploads`,
        201,
      ),
    ).toBe(3);
  });

  it('when a study is created, then the study and its audit entry are one statement outside any transaction', async () => {
    // The study's INSERT moves the lab's row of lab_study_counts (a trigger), locked until the
    // change commits: every other create in the lab waits for it. As one statement on its own, the
    // row is locked only while PostgreSQL runs it, never across a round trip to the app.
    const { client, labId } = await signedInResearcher(testApp);
    const first = await createStudy(client, labId, 'write-order');
    statements.length = 0;
    const response = await client.post(`/api/labs/${labId}/studies`, {
      ...studyBody('write-order-2', { emitterId: first.emitter.id, quencherId: first.quencher.id }),
      newEmitterName: undefined,
      newQuencherName: undefined,
    });
    expect(response.status).toBe(201);
    const writes = statements.filter((statement) => /INSERT INTO "(studies|audit_events)"/.test(statement.sql));
    expect(writes).toHaveLength(1);
    expect(writes[0]!.transaction).toBeUndefined();
    expect(writes[0]!.sql).toMatch(/^WITH w0 AS \(INSERT INTO "audit_events" .*\) INSERT INTO "studies" /s);
    expect(statements.some((statement) => /^(START TRANSACTION|BEGIN|COMMIT)/.test(statement.sql))).toBe(false);
    // Both rows are there, the audit entry naming the study with its settings.
    const [audit] = await sequelize.query<{ action: string; details: { after: { title: string } } }>(
      `SELECT action, details FROM audit_events WHERE target_type = 'study' AND target_id = $1`,
      { bind: [response.body.id], type: QueryTypes.SELECT },
    );
    expect(audit).toMatchObject({ action: 'study_created', details: { after: { title: response.body.title } } });
  });

  it('when a study is created with a compound named anew, then the compound, the study and their audit entries commit together', async () => {
    const { client, labId } = await signedInResearcher(testApp);
    statements.length = 0;
    const created = await createStudy(client, labId, 'write-new-names');
    const insert = statements.find((statement) => statement.sql.includes('INSERT INTO "studies"'));
    expect(insert?.transaction).toBeDefined();
    const compounds = statements.filter(
      (statement) =>
        statement.sql.startsWith('INSERT INTO "compounds"') && statement.transaction === insert!.transaction,
    );
    expect(compounds).toHaveLength(2);
    const [{ n }] = (await sequelize.query<{ n: number }>(
      `SELECT count(*)::int AS n FROM audit_events WHERE lab_id = $1 AND target_id IN ($2, $3, $4)`,
      { bind: [labId, created.id, created.emitter.id, created.quencher.id], type: QueryTypes.SELECT },
    )) as [{ n: number }];
    expect(n).toBe(3);
  });

  it('when the points are replaced, then the study is marked changed at that time, as a save would', async () => {
    const { client, labId } = await signedInResearcher(testApp);
    const study = await createStudy(client, labId, 'write-round-trips-changed');
    // Sequelize's set() leaves an existing row's timestamps alone (they are read-only there); the
    // one-statement update must still write the time of the change, as study.update() did.
    await new Promise((resolve) => setTimeout(resolve, 20));
    const before = Date.now();
    const replaced = await client.patch(`/api/labs/${labId}/studies/${study.id}/points`, {
      version: 0,
      points: exactPoints,
    });
    expect(replaced.status).toBe(200);
    expect(Date.parse(replaced.body.updatedAt)).toBeGreaterThanOrEqual(before);
    const [row] = await sequelize.query<{ updated_at: Date; created_at: Date }>(
      'SELECT updated_at, created_at FROM studies WHERE id = $1',
      { bind: [study.id], type: QueryTypes.SELECT },
    );
    expect(row!.updated_at.getTime()).toBeGreaterThanOrEqual(before);
    expect(row!.updated_at.getTime()).toBeGreaterThan(row!.created_at.getTime());
  });
});
