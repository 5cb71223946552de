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

describe('a connection cut while it opens', () => {
  it('when a connection that no pool holds yet reports an error, then nothing is thrown out of the event', async () => {
    // What a database restart does to a connection still running its opening statements: pg emits
    // 'error' before Sequelize has given the connection to the read or the write pool. The error
    // listener used to throw "Cannot read properties of undefined (reading 'destroy')" here, an
    // uncaught exception seen once in a run with the database-outage test.
    const manager = sequelize.connectionManager as unknown as {
      config: { replication: { write: object } };
      _connect(config: object): Promise<{ queryType?: string; emit(event: string, error: Error): boolean }>;
      _disconnect(connection: object): Promise<void>;
    };
    const opening = await manager._connect(manager.config.replication.write);
    expect(opening.queryType).toBeUndefined();
    try {
      expect(() =>
        opening.emit('error', new Error('terminating connection due to administrator command')),
      ).not.toThrow();
    } finally {
      await manager._disconnect(opening);
    }
    // The pools still serve queries afterwards.
    const [rows] = await sequelize.query('SELECT 1 AS one');
    expect(rows).toEqual([{ one: 1 }]);
  });
});
