import { QueryTypes } from 'sequelize';
import { afterAll, describe, expect, it } from 'vitest';
import { inject } from 'vitest';
import { createSequelize } from '../../server/db/sequelize';
import { initModels } from '../../server/models';
import { loadSessionState } from '../../server/services/session-user.service';
import { apiClient, createLabWithMembers } from '../support/accounts';
import { createStudy, exactPoints } from '../support/studies';
import { keptLogLines, linesWhen } from '../support/log-lines';
import { createTestApp } from '../support/test-app';

// At debug level each request's log line counts its database round trips (Sequelize's, the plain
// reads' and the session store's): what a read costs besides its answer, checked route by route.
const sequelize = createSequelize(inject('databaseUrl'), { timeQueries: true });
initModels(sequelize);
const { lines, logger } = keptLogLines<Line>('debug');
const testApp = await createTestApp({ sequelize, logger });
afterAll(async () => {
  await testApp.close();
  await sequelize.close();
});

type Line = { req?: { method: string; url: string }; res?: { statusCode: number }; database?: { queries: number } };

/** The round trips of the last request to `url`, read from its log line. */
async function roundTripsOf(send: () => Promise<{ status: number }>, url: string): Promise<number> {
  lines.length = 0;
  expect((await send()).status).toBe(200);
  const [line] = await linesWhen(lines, (entry) => entry.req?.url === url && entry.res?.statusCode === 200);
  expect(line, `no log line for ${url}`).toBeDefined();
  return line!.database?.queries ?? 0;
}

describe('round trips of the reads every screen makes', () => {
  it('when a signed-in person asks for the session, then the session row and the person with their labs are one statement', async () => {
    const { users } = await createLabWithMembers(testApp.sequelize, { roles: ['researcher'] });
    const client = await apiClient(testApp.app);
    await client.signIn(users.researcher);
    const session = await client.get('/api/session');
    expect(session.body.user.labs).toHaveLength(1);
    expect(session.body.twoFactor).toEqual({ enabled: false, verified: false, recoveryCodesLeft: 0 });
    // The same person and labs as the statement of their own that sign-in answers with.
    expect(session.body.user).toEqual((await loadSessionState(users.researcher.id)).user);
    expect(await roundTripsOf(() => client.get('/api/session'), '/api/session')).toBe(1);
  });

  it('when a signed-in person opens one study, then it costs the session row with the membership, and one statement', async () => {
    const { lab, users } = await createLabWithMembers(testApp.sequelize, { roles: ['researcher'] });
    const client = await apiClient(testApp.app);
    await client.signIn(users.researcher);
    const study = await createStudy(client, lab.id, 'round-trips');
    await client.patch(`/api/labs/${lab.id}/studies/${study.id}/points`, { version: 0, points: exactPoints });
    const url = `/api/labs/${lab.id}/studies/${study.id}`;
    expect((await client.get(url)).body.points).toHaveLength(exactPoints.length);
    expect(await roundTripsOf(() => client.get(url), url)).toBe(2);
  });

  it('when a signed-in person reads, then the session row is not written again', async () => {
    const { lab, users } = await createLabWithMembers(testApp.sequelize, { roles: ['researcher'] });
    const client = await apiClient(testApp.app);
    await client.signIn(users.researcher);
    const expiry = () =>
      sequelize.query<{ expire: Date }>(`SELECT expire FROM sessions WHERE sess #>> '{passport,user}' = $1`, {
        bind: [users.researcher.id],
        type: QueryTypes.SELECT,
      });
    const before = await expiry();
    for (let i = 0; i < 3; i++) expect((await client.get(`/api/labs/${lab.id}/studies`)).status).toBe(200);
    expect(await expiry()).toEqual(before);
  });
});

describe('round trips of the rest of the read mix (tests/bench/load.bench.ts)', () => {
  it('when the dashboard, the studies list (filtered and sorted) and the compounds are read, then none costs a query per row', async () => {
    const { lab, users } = await createLabWithMembers(testApp.sequelize, { roles: ['researcher', 'reviewer'] });
    const researcher = await apiClient(testApp.app);
    await researcher.signIn(users.researcher);
    // Enough rows that a query per row would show: five studies, each with its own two compounds.
    const studies = [];
    for (const tag of ['a', 'b', 'c', 'd', 'e']) studies.push(await createStudy(researcher, lab.id, `mix-${tag}`));
    const reviewer = await apiClient(testApp.app);
    await reviewer.signIn(users.reviewer);
    const base = `/api/labs/${lab.id}`;
    const dashboard = await reviewer.get(`${base}/dashboard`);
    expect(dashboard.body.recentActivity.length).toBeGreaterThanOrEqual(10);
    expect(dashboard.body.myDrafts).toEqual([]);
    expect((await researcher.get(`${base}/dashboard`)).body.myDrafts).toHaveLength(5);
    // Session row with the membership; the four lists and the activity with its names, in one statement.
    expect(await roundTripsOf(() => reviewer.get(`${base}/dashboard`), `${base}/dashboard`)).toBe(2);
    expect(await roundTripsOf(() => researcher.get(`${base}/dashboard`), `${base}/dashboard`)).toBe(2);

    const compounds = await researcher.get(`${base}/compounds`);
    expect(compounds.body.items.length).toBeGreaterThanOrEqual(10);
    // Session row with the membership; the compounds with what the list shows of each.
    expect(await roundTripsOf(() => researcher.get(`${base}/compounds`), `${base}/compounds`)).toBe(2);

    const firstOfTwo = await researcher.get(`${base}/studies?pageSize=2`);
    expect(firstOfTwo.body.total).toBe(5);
    for (const url of [
      `${base}/studies`,
      `${base}/studies?status=draft&sort=kq&pageSize=25`,
      `${base}/studies?emitterId=${studies[0]!.emitter.id}&solventId=acetonitrile`,
      `${base}/studies?pageSize=2&cursor=${encodeURIComponent(firstOfTwo.body.nextCursor)}`,
    ]) {
      expect((await researcher.get(url)).status).toBe(200);
      // Session row with the membership; the page with its names and its count, in one statement.
      expect(await roundTripsOf(() => researcher.get(url), url), url).toBe(2);
    }
  });
});
