import { afterAll, describe, expect, it } from 'vitest';
import { inject } from 'vitest';
import { createSequelize, poolSizesOf } from '../../server/db/sequelize';
import { initModels } from '../../server/models';
import { apiClient, createLabWithMembers } from '../support/accounts';
import { createStudy, exactPoints } from '../support/studies';
import { createTestApp } from '../support/test-app';

// Small pools, so the test can hold every read connection itself.
const sequelize = createSequelize(inject('databaseUrl'), { pools: { read: 2, write: 2 } });
initModels(sequelize);
const testApp = await createTestApp({ sequelize });
afterAll(async () => {
  await testApp.close();
  await sequelize.close();
});

/** Settles with the answer's status, or 'waiting' if it has not come within `ms`. */
const within = (ms: number, request: PromiseLike<{ status: number }>) =>
  Promise.race([
    Promise.resolve(request).then((response) => response.status),
    new Promise<'waiting'>((resolve) => setTimeout(() => resolve('waiting'), ms)),
  ]);

describe('connections kept for writes', () => {
  it('when the pools are sized, then each has its own size', () => {
    expect(poolSizesOf(sequelize)).toEqual({ read: 2, write: 2 });
  });

  it('when every read connection is taken, then a write still answers and the read waits for its turn', async () => {
    const { lab, users } = await createLabWithMembers(testApp.sequelize, { roles: ['researcher'] });
    const client = await apiClient(testApp.app);
    await client.signIn(users.researcher);
    const study = await createStudy(client, lab.id, 'write-pools');
    const url = `/api/labs/${lab.id}/studies/${study.id}`;
    // What a saturating read load does to the read pool: every connection busy.
    const manager = sequelize.connectionManager;
    const held = [
      await manager.getConnection({ type: 'SELECT' as 'read' }),
      await manager.getConnection({ type: 'SELECT' as 'read' }),
    ];
    const read = client.get(url).then((response) => response);
    try {
      const write = client.patch(`${url}/points`, { version: study.version, points: exactPoints });
      expect(await within(10_000, write)).toBe(200);
      expect(await within(50, read)).toBe('waiting');
    } finally {
      for (const connection of held) manager.releaseConnection(connection);
    }
    const answer = await read;
    expect(answer.status).toBe(200);
    expect(answer.body.points).toHaveLength(exactPoints.length);
  });
});
