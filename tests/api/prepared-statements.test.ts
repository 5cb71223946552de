import { afterAll, describe, expect, it } from 'vitest';
import { inject } from 'vitest';
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
  it('when one study is opened again and again, then its statement and the membership check are planned once and kept', async () => {
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
    const prepared = await selectRows<Prepared>(
      sequelize,
      'SELECT statement, generic_plans, custom_plans FROM pg_prepared_statements',
    );
    // PostgreSQL plans a prepared statement for its values the first five times, then keeps one
    // generic plan when that costs no more ("PREPARE", PostgreSQL documentation, plan_cache_mode).
    for (const marker of ['AS reviews', 'FROM memberships m JOIN labs l']) {
      const statement = prepared.find((row) => row.statement.includes(marker));
      expect(statement, marker).toBeDefined();
      expect(Number(statement!.generic_plans), marker).toBeGreaterThanOrEqual(1);
      expect(Number(statement!.custom_plans), marker).toBeLessThanOrEqual(5);
    }
  });
});
