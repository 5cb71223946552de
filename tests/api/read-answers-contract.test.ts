import { afterAll, describe, expect, it } from 'vitest';
import type { z } from 'zod';
import { sessionSchema } from '@shared/schemas/auth';
import { dashboardSchema } from '@shared/schemas/dashboard';
import { compoundListSchema } from '@shared/schemas/library';
import { studyListSchema } from '@shared/schemas/studies';
import { studyDetailSchema } from '@shared/schemas/study-detail';
import { apiClient, createLabWithMembers } from '../support/accounts';
import { createStudy, exactPoints } from '../support/studies';
import { createTestApp } from '../support/test-app';

const testApp = await createTestApp();
afterAll(testApp.close);

/**
 * The answer as its declared schema reads it: every field valid, none missing, and (zod drops keys
 * a schema does not name) none extra when it equals the answer itself. The server builds these
 * answers by hand from plain rows on the hot reads, never validating them at run time; this is
 * where they are held to their contract.
 */
const asDeclared = (schema: z.ZodType, body: unknown) => {
  const parsed = schema.safeParse(body);
  expect(parsed.error?.issues ?? []).toEqual([]);
  return parsed.data;
};

describe('answers of the read mix against their declared schemas', () => {
  it('when the session, the studies list, a study, the compounds and the dashboard are read, then each is exactly its schema', async () => {
    const { lab, users } = await createLabWithMembers(testApp.sequelize, { roles: ['researcher'] });
    const client = await apiClient(testApp.app);
    await client.signIn(users.researcher);
    const study = await createStudy(client, lab.id, 'contract');
    await createStudy(client, lab.id, 'contract-2');
    await client.patch(`/api/labs/${lab.id}/studies/${study.id}/points`, { version: 0, points: exactPoints });
    const base = `/api/labs/${lab.id}`;
    const reads: Array<[string, z.ZodType]> = [
      ['/api/session', sessionSchema],
      [`${base}/studies`, studyListSchema],
      [`${base}/studies?pageSize=100&sort=kq`, studyListSchema],
      [`${base}/studies/${study.id}`, studyDetailSchema],
      [`${base}/compounds`, compoundListSchema],
      [`${base}/dashboard`, dashboardSchema],
    ];
    for (const [url, schema] of reads) {
      const answer = await client.get(url);
      expect(answer.status, url).toBe(200);
      expect(asDeclared(schema, answer.body), url).toEqual(answer.body);
    }
    const list = await client.get(`${base}/studies`);
    expect(list.body.items).toHaveLength(2);
    expect(list.body.items[0]).toMatchObject({
      emitter: { id: study.emitter.id, name: expect.stringMatching(/\S/) },
      ownerId: users.researcher.id,
      ownerName: users.researcher.name,
    });
    const detail = await client.get(`${base}/studies/${study.id}`);
    expect(detail.body).toMatchObject({
      id: study.id,
      quencher: { id: study.quencher.id, name: expect.stringMatching(/\S/) },
      ownerName: users.researcher.name,
    });
    expect(detail.body.points).toHaveLength(exactPoints.length);
  });
});
