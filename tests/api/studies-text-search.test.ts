import crypto from 'node:crypto';
import { QueryTypes } from 'sequelize';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { signedInResearcherAndViewer, type ApiClient } from '../support/accounts';
import { copyStudyInSql, createStudy } from '../support/studies';
import { createTestApp } from '../support/test-app';

const testApp = await createTestApp();
type Client = ApiClient;
let viewer: Client;
let labId = '';
type Page = { items: Array<{ id: string }>; total: number; nextCursor: string | null; previousCursor: string | null };

/**
 * 36 copies of one study made in SQL (invented values): the 16 newest are titled "plain …", the 20
 * oldest "match …"; every third has "Thiophenol run" as notes, the others "amine"; change times
 * come in pairs (ties broken by id) and kq from three values and NULL.
 */
beforeAll(async () => {
  const setUp = await signedInResearcherAndViewer(testApp);
  ({ labId, viewer } = setUp);
  const { researcher } = setUp;
  const template = await createStudy(researcher, labId, crypto.randomBytes(3).toString('hex'));
  await copyStudyInSql(testApp.sequelize, {
    templateId: template.id,
    labId,
    count: 36,
    set: {
      title: "CASE WHEN g <= 16 THEN 'plain ' ELSE 'match ' END || g",
      notes: "CASE WHEN g % 3 = 0 THEN 'Thiophenol run' ELSE 'amine' END",
      kq: 'CASE WHEN g % 5 = 0 THEN NULL ELSE (g % 3) * 1e9 END',
      updated_at: "timestamptz '2026-11-01 10:00:00+00' - (g / 2) * interval '1 minute'",
      created_at: "timestamptz '2026-11-01 10:00:00+00'",
    },
  });
  await testApp.sequelize.query('UPDATE studies SET is_current = false WHERE id = $1', { bind: [template.id] });
});
afterAll(testApp.close);

const list = async (query: string): Promise<Page> => {
  const response = await viewer.get(`/api/labs/${labId}/studies?${query}`);
  expect(response.status, JSON.stringify(response.body)).toBe(200);
  return response.body as Page;
};

/** The matches as the studies say, in the list's order (NULL kq last, then id), counted here. */
async function recount(pattern: string, sort: 'updated_at' | 'kq', direction: 'ASC' | 'DESC') {
  const rows = await testApp.sequelize.query<{ id: string }>(
    `SELECT id FROM studies WHERE lab_id = $1 AND is_current AND (title || ' ' || notes) ILIKE $2
     ORDER BY ${sort} ${direction} NULLS LAST, id`,
    { bind: [labId, pattern], type: QueryTypes.SELECT },
  );
  return rows.map((row) => row.id);
}

const ids = (page: Page) => page.items.map((item) => item.id);

/** Every page by number, then every page by cursor forward and back: each walk is the whole list once. */
async function everyWay(query: string, pageSize: number) {
  const byNumber: string[] = [];
  for (let number = 1; ; number++) {
    const page = await list(`${query}&pageSize=${pageSize}&page=${number}`);
    if (page.items.length === 0) break;
    byNumber.push(...ids(page));
  }
  let page = await list(`${query}&pageSize=${pageSize}`);
  const forward = [ids(page)];
  while (page.nextCursor) {
    page = await list(`${query}&pageSize=${pageSize}&cursor=${encodeURIComponent(page.nextCursor)}`);
    forward.push(ids(page));
  }
  const backward = [ids(page)];
  while (page.previousCursor) {
    page = await list(`${query}&pageSize=${pageSize}&cursor=${encodeURIComponent(page.previousCursor)}`);
    backward.unshift(ids(page));
  }
  expect(backward, query).toEqual(forward);
  return { byNumber, byCursor: forward.flat(), total: page.total };
}

describe('GET /api/labs/:labId/studies?q= (text search)', () => {
  // Words matching every study, the oldest 20 (after 16 that do not match), every third with
  // another case, and none: the page is read from a window over the list's order when the count
  // says matches are dense, through the trigram index otherwise; every way answers as a recount.
  for (const [q, pattern, expected] of [
    ['a', '%a%', 36],
    ['match', '%match%', 20],
    ['THIOPHENOL', '%THIOPHENOL%', 12],
    ['zzz', '%zzz%', 0],
    ['_', '%\\_%', 0],
  ] as const) {
    for (const [sort, column, direction] of [
      ['updated', 'updated_at', 'desc'],
      ['updated', 'updated_at', 'asc'],
      ['kq', 'kq', 'desc'],
    ] as const) {
      it(`when searching "${q}" sorted by ${sort} ${direction}, then every page by number and by cursor is the recount's`, async () => {
        const matches = await recount(pattern, column, direction === 'asc' ? 'ASC' : 'DESC');
        expect(matches).toHaveLength(expected);
        for (const pageSize of [2, 5]) {
          const walked = await everyWay(`q=${encodeURIComponent(q)}&sort=${sort}&direction=${direction}`, pageSize);
          expect(walked.total).toBe(expected);
          expect(walked.byNumber).toEqual(matches);
          expect(walked.byCursor).toEqual(expected === 0 ? [] : matches);
        }
      });
    }
  }
});
