import crypto from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { signedInResearcher, signedInResearcherAndViewer, type ApiClient } from '../support/accounts';
import { copyStudyInSql, createStudy } from '../support/studies';
import { createTestApp } from '../support/test-app';

const testApp = await createTestApp();
type Client = ApiClient;
let viewer: Client;
let labId = '';
type Summary = { id: string; kq: number | null; status: string; updatedAt: string };
type Page = {
  items: Summary[];
  total: number;
  totalCapped: boolean;
  nextCursor: string | null;
  previousCursor: string | null;
};

/**
 * Copies of one study made in SQL, with many ties on purpose: four change times, kq from three
 * values and NULL, drafts and submitted ones alternating (invented values).
 */
async function copyStudies(lab: string, templateId: string, count: number) {
  await copyStudyInSql(testApp.sequelize, {
    templateId,
    labId: lab,
    count,
    set: {
      title: "'copy ' || g",
      kq: 'CASE WHEN g % 5 = 0 THEN NULL ELSE (g % 3) * 1e9 END',
      k_sv: 'CASE WHEN g % 5 = 0 THEN NULL ELSE (g % 3) * 1e3 END',
      status: "(CASE WHEN g % 2 = 0 THEN 'draft' ELSE 'submitted' END)::enum_studies_status",
      updated_at: "timestamptz '2026-11-01 10:00:00.123456+00' + (g % 4) * interval '1 second'",
      created_at: "timestamptz '2026-11-01 10:00:00+00'",
    },
  });
}

/** A new lab of `count` studies (one made through the API, copies of it in SQL), its researcher signed in. */
async function labOfCopies(count: number) {
  const setUp = await signedInResearcher(testApp);
  const template = await createStudy(setUp.client, setUp.labId, crypto.randomBytes(3).toString('hex'));
  await copyStudies(setUp.labId, template.id, count - 1);
  return setUp;
}

beforeAll(async () => {
  const setUp = await signedInResearcherAndViewer(testApp);
  ({ labId, viewer } = setUp);
  const { researcher } = setUp;
  const template = await createStudy(researcher, labId, crypto.randomBytes(3).toString('hex'));
  // The template itself leaves the list, so the lab holds exactly the 23 copies.
  await copyStudies(labId, template.id, 23);
  await testApp.sequelize.query('UPDATE studies SET is_current = false WHERE id = $1', { bind: [template.id] });
});
afterAll(testApp.close);

const list = async (query: string): Promise<Page> => {
  const response = await viewer.get(`/api/labs/${labId}/studies?${query}`);
  expect(response.status, JSON.stringify(response.body)).toBe(200);
  return response.body as Page;
};

/** Every page from the first, following nextCursor; then back again following previousCursor. */
async function walk(query: string, pageSize: number) {
  const forward: Summary[][] = [];
  let page = await list(`${query}&pageSize=${pageSize}`);
  expect(page.previousCursor).toBeNull();
  forward.push(page.items);
  while (page.nextCursor) {
    page = await list(`${query}&pageSize=${pageSize}&cursor=${encodeURIComponent(page.nextCursor)}`);
    forward.push(page.items);
  }
  const backward: Summary[][] = [page.items];
  while (page.previousCursor) {
    page = await list(`${query}&pageSize=${pageSize}&cursor=${encodeURIComponent(page.previousCursor)}`);
    backward.unshift(page.items);
  }
  return { forward, backward, total: page.total };
}

const ids = (items: Summary[]) => items.map((item) => item.id);

/**
 * The order the list promises, written out here from its definition (common practice for a
 * keyset: the sort value, NULLs last in both directions, then id ascending as the tie-breaker).
 */
function expectedOrder(items: Summary[], key: 'kq' | 'updatedAt', direction: 'asc' | 'desc') {
  const sign = direction === 'asc' ? 1 : -1;
  return [...items].sort((a, b) => {
    const x = a[key];
    const y = b[key];
    if (x !== y) {
      if (x === null) return 1;
      if (y === null) return -1;
      return (x < y ? -1 : 1) * sign;
    }
    return a.id < b.id ? -1 : a.id > b.id ? 1 : 0;
  });
}

describe('GET /api/labs/:labId/studies with a cursor', () => {
  for (const [sort, key, direction] of [
    ['updated', 'updatedAt', 'desc'],
    ['updated', 'updatedAt', 'asc'],
    ['kq', 'kq', 'desc'],
    ['kq', 'kq', 'asc'],
  ] as const) {
    it(`when paging by cursor sorted by ${sort} ${direction} over ties and NULLs, then every study comes once in a stable order, forward and back`, async () => {
      const all = await list(`sort=${sort}&direction=${direction}&pageSize=100`);
      expect(all.total).toBe(23);
      expect(all.totalCapped).toBe(false);
      expect(all.nextCursor).toBeNull();
      expect(ids(all.items)).toEqual(ids(expectedOrder(all.items, key, direction)));
      const { forward, backward } = await walk(`sort=${sort}&direction=${direction}`, 4);
      expect(forward.map((items) => items.length)).toEqual([4, 4, 4, 4, 4, 3]);
      expect(ids(forward.flat())).toEqual(ids(all.items));
      expect(backward.map(ids)).toEqual(forward.map(ids));
    });
  }

  it('when a filter is given with the cursor, then every page keeps it and the total counts only matches', async () => {
    const { forward, total } = await walk('status=draft&sort=kq', 5);
    const drafts = forward.flat();
    expect(total).toBe(11); // g = 2, 4, …, 22
    expect(drafts).toHaveLength(11);
    expect(drafts.every((item) => item.status === 'draft')).toBe(true);
    expect(new Set(ids(drafts)).size).toBe(11);
  });

  it('when numbered pages are asked, then they carry cursors too and agree with them', async () => {
    const second = await list('pageSize=5&page=2');
    const first = await list(`pageSize=5&cursor=${encodeURIComponent(second.previousCursor!)}`);
    const third = await list(`pageSize=5&cursor=${encodeURIComponent(second.nextCursor!)}`);
    const all = await list('pageSize=15');
    expect([...ids(first.items), ...ids(second.items), ...ids(third.items)]).toEqual(ids(all.items));
    expect(first.previousCursor).toBeNull();
  });

  it('when numbered pages are asked in each sort, direction and filter, then each is its slice of the whole list in order', async () => {
    for (const query of [
      'sort=updated&direction=desc',
      'sort=updated&direction=asc',
      'sort=kq&direction=desc',
      'sort=kq&direction=asc',
      'sort=k_sv&direction=asc',
      'status=draft&sort=kq',
      'q=copy%201&sort=updated',
    ]) {
      const all = await list(`${query}&pageSize=100`);
      // 4 a page, planned each time; 10, a usual size, prepared (one text for every page number).
      for (const size of [4, 10]) {
        const pages: Summary[][] = [];
        for (let page = 1; page <= Math.ceil(all.total / size) + 1; page++) {
          const answer = await list(`${query}&pageSize=${size}&page=${page}`);
          expect(answer.total, query).toBe(all.total);
          pages.push(answer.items);
        }
        // Past the last page, an empty one.
        expect(pages.at(-1), query).toEqual([]);
        expect(ids(pages.flat()), `${query}, ${size} a page`).toEqual(ids(all.items));
      }
    }
  });

  it('when every study past a cursor has left the list, then its page is empty and the total counts what is left', async () => {
    const { labId: id, client: researcher } = await labOfCopies(6);
    const first = (await researcher.get(`/api/labs/${id}/studies?sort=kq&pageSize=3`)).body as Page;
    expect(first.total).toBe(6);
    const rest = (await researcher.get(`/api/labs/${id}/studies?sort=kq&pageSize=100`)).body as Page;
    await testApp.sequelize.query('UPDATE studies SET is_current = false WHERE id IN (:ids)', {
      replacements: { ids: ids(rest.items.slice(3)) },
    });
    const response = await researcher.get(
      `/api/labs/${id}/studies?sort=kq&pageSize=3&cursor=${encodeURIComponent(first.nextCursor!)}`,
    );
    expect(response.status).toBe(200);
    expect(response.body).toMatchObject({ items: [], total: 3, totalCapped: false, nextCursor: null });
  });

  it('when the cursor is not one the list gave out, then 400 names query.cursor', async () => {
    for (const cursor of ['not-a-cursor', Buffer.from('{"s":"updated"}').toString('base64url')]) {
      const response = await viewer.get(`/api/labs/${labId}/studies?cursor=${cursor}`);
      expect(response.status).toBe(400);
      expect(response.body.error.details).toEqual([expect.objectContaining({ path: 'query.cursor' })]);
    }
    const forged = Buffer.from(
      JSON.stringify({
        s: 'updated',
        d: 'desc',
        k: 'after',
        v: "now'); DROP TABLE studies; --",
        i: crypto.randomUUID(),
      }),
    ).toString('base64url');
    expect((await viewer.get(`/api/labs/${labId}/studies?cursor=${forged}`)).status).toBe(400);
  });

  it('when a cursor of another sort is sent, then 400 says which sort it was made for', async () => {
    const byKq = await list('sort=kq&pageSize=5');
    const response = await viewer.get(
      `/api/labs/${labId}/studies?sort=updated&pageSize=5&cursor=${encodeURIComponent(byKq.nextCursor!)}`,
    );
    expect(response.status).toBe(400);
    expect(response.body.error.message).toContain('query.cursor: made for sort=kq&direction=desc');
  });
});

describe('GET /api/labs/:labId/studies in a lab of more than 10,000 studies', () => {
  it('when it is counted, then the total stops at 10,000 and says there are more', async () => {
    const { labId: id, client: researcher } = await labOfCopies(10_006);
    const response = await researcher.get(`/api/labs/${id}/studies?pageSize=2`);
    expect(response.status).toBe(200);
    expect(response.body).toMatchObject({ total: 10_000, totalCapped: true, pageSize: 2 });
    expect(response.body.items).toHaveLength(2);
  });
});
