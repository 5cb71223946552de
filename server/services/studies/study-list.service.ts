import { z } from 'zod';
import type { ListStudiesQuery, StudyList } from '@shared/schemas/studies';
import type { LabContext } from '../../domain/lab-context';
import { fixedStatementOf, selectRows } from '../../db/select-rows';
import { AppError } from '../../lib/app-error';
import { Study } from '../../models';
import { toSummary, type SummaryRow } from './study-serialize';

/** Counting stops here: past it the list says "more than 10,000" instead of reading every match. */
export const STUDY_COUNT_CAP = 10_000;

const escapeLike = (text: string) => text.replace(/[\\%_]/g, '\\$&');

type Sort = ListStudiesQuery['sort'];
type Direction = ListStudiesQuery['direction'];
const sortColumn: Record<Sort, 'updated_at' | 'kq' | 'k_sv'> = { updated: 'updated_at', kq: 'kq', k_sv: 'k_sv' };

/**
 * A cursor names the row a page starts after (or ends before) by its sort value and id, as the
 * database prints them (text keeps the microseconds of a timestamp and every digit of a double),
 * with the sort it belongs to. It is base64url JSON: not secret, and a changed one only names
 * another place in the same lab's list.
 */
const timestampText = /^\d{4}-\d{2}-\d{2} \d{2}:\d{2}:\d{2}(\.\d{1,6})?[+-]\d{2}(:\d{2})?$/;
const doubleText = /^-?(\d+(\.\d*)?|\.\d+)(e[+-]?\d+)?$/i;
const cursorSchema = z.object({
  s: z.enum(['updated', 'kq', 'k_sv']),
  d: z.enum(['asc', 'desc']),
  k: z.enum(['after', 'before']),
  v: z.string().max(64).nullable(),
  i: z.string().uuid(),
});
type Cursor = z.infer<typeof cursorSchema>;

const encodeCursor = (cursor: Cursor) => Buffer.from(JSON.stringify(cursor)).toString('base64url');

const badCursor = (reason: string) =>
  new AppError('validation_failed', `The request query has a problem: query.cursor: ${reason}`, 400, [
    { path: 'query.cursor', message: reason },
  ]);

function decodeCursor(text: string, sort: Sort, direction: Direction): Cursor {
  let parsed: unknown;
  try {
    parsed = JSON.parse(Buffer.from(text, 'base64url').toString('utf8'));
  } catch {
    throw badCursor('not a cursor this list gave out (take nextCursor or previousCursor of a page)');
  }
  const result = cursorSchema.safeParse(parsed);
  const cursor = result.data;
  const valueFits =
    cursor &&
    (cursor.s === 'updated'
      ? cursor.v !== null && timestampText.test(cursor.v)
      : cursor.v === null || doubleText.test(cursor.v));
  if (!cursor || !valueFits) {
    throw badCursor('not a cursor this list gave out (take nextCursor or previousCursor of a page)');
  }
  if (cursor.s !== sort || cursor.d !== direction) {
    throw badCursor(
      `made for sort=${cursor.s}&direction=${cursor.d}, not sort=${sort}&direction=${direction}; start again from the first page`,
    );
  }
  return cursor;
}

type Row = SummaryRow & { sortKey: string | null; matches?: number };

/** Binds values as $1, $2, … in the order they are added. */
class Binds {
  readonly values: unknown[] = [];
  add(value: unknown): string {
    this.values.push(value);
    return `$${this.values.length}`;
  }
}

/**
 * The list's statements, prepared when one plan suits every lab: PostgreSQL spent about 1.7 ms
 * planning a page (the studies table's many indexes and the three name joins) against about 1 ms
 * running it (a 100-study page of the load benchmark's lab, timed in a PL/pgSQL loop). A page is
 * prepared only when an index gives its order after its filter (no filter with any sort, or one
 * filter sorted by change: migrations 0008, 20261203-1500, -1545 and -1830), so the kept plan walks
 * that index and stops after the page, for a lab of 10 studies or of 50,000. A numbered page binds
 * its offset (and one read from the far end its limit too), so all page numbers share one text
 * and the kept plan skips along the same index. Text search, two filters, or a filter sorted by kq
 * or K_SV are planned for their values each time. Page sizes other than the usual ones are not
 * prepared either, so the texts kept per connection stay few.
 */
const preparedPageSizes = new Set([10, 25, 50, 100]);

function onePlanSuits(query: ListStudiesQuery): boolean {
  if (query.q || !preparedPageSizes.has(query.pageSize)) return false;
  const filters =
    [query.emitterId, query.quencherId, query.solventId, query.status, query.ownerId].filter(Boolean).length +
    (query.flagged === 'true' ? 1 : 0);
  return filters === 0 || (filters === 1 && query.sort === 'updated');
}

/**
 * How many current studies match, up to STUDY_COUNT_CAP + 1, as one SELECT of one value `n` over
 * the list's own binds (the placeholders of its WHERE). Filtered by owner, status and flag only
 * (or not at all), the answer is a sum over the lab's rows of lab_study_counts, which triggers keep
 * equal to the studies (migration 20261203-0910), so it is exact; other filters count the matching
 * rows, stopping after the cap.
 */
function countSql(query: ListStudiesQuery, where: string[], placeholders: Placeholders): string {
  if (query.q || query.emitterId || query.quencherId || query.solventId) {
    return `SELECT count(*)::int AS n FROM (SELECT 1 FROM studies s WHERE ${where.join(' AND ')} LIMIT ${STUDY_COUNT_CAP + 1}) c`;
  }
  const kept = [`c.lab_id = ${placeholders.lab}`];
  if (placeholders.status) kept.push(`c.status = ${placeholders.status}`);
  if (placeholders.owner) kept.push(`c.owner_id = ${placeholders.owner}`);
  if (query.flagged === 'true') kept.push('c.flagged');
  return `SELECT coalesce(sum(c.n), 0)::int AS n FROM lab_study_counts c WHERE ${kept.join(' AND ')}`;
}

/** Where the list's WHERE binds the values the kept counts are looked up by. */
interface Placeholders {
  lab: string;
  status?: string;
  owner?: string;
}

/**
 * The count on its own (for pages that need it before they are read). Without a text search one
 * plan suits every lab, so it runs prepared (one text per combination of filters): whatever plan
 * PostgreSQL keeps reads one filter's index within the lab and stops at the cap, or looks the
 * kept counts up by key; planning it on every call took about 0.32 ms beside 0.68 ms of running
 * (emitter and solvent, the load benchmark's read mix, pg_stat_statements). A text search's count
 * comes with the lab's own total beside it (lab_study_counts), which textSearchPage weighs the
 * matches against.
 */
function countMatches(
  query: ListStudiesQuery,
  where: string[],
  placeholders: Placeholders,
  whereValues: unknown[],
): Promise<Array<{ n: number; labTotal?: number }>> {
  const sequelize = Study.sequelize!;
  const count = countSql(query, where, placeholders);
  if (query.q) {
    const text =
      `SELECT (${count}) AS n, ` +
      `(SELECT coalesce(sum(t.n), 0)::int FROM lab_study_counts t WHERE t.lab_id = ${placeholders.lab}) AS "labTotal"`;
    return selectRows(sequelize, text, whereValues);
  }
  return selectRows<{ n: number }>(sequelize, fixedStatementOf(count), whereValues);
}

/**
 * A text search's page read from a window at the head of the list's own order (its index walked,
 * each row's title and notes matched on the way) instead of through the trigram index, which hands
 * PostgreSQL every match to read and sort: one page of a word in 7,143 of a lab's 50,000 studies
 * read 7,143 rows and took about 42 ms that way (EXPLAIN ANALYZE, bench:studies data). PostgreSQL
 * guesses a few matches for any ILIKE and would take the trigram index (or read the whole lab)
 * however many there are, so the walk's statement leaves the text out of its WHERE; the caller asks
 * for it only when the count says matches are dense. The window's answer is the page when it
 * holds the page (and the row after it) or the window ran out before its end (it then read the
 * whole list); otherwise matches bunch up further down, and the indexed statement answers.
 */
async function textSearchWindow(
  walk: string,
  window: number,
  limit: number,
  values: unknown[],
  indexed: () => Promise<Row[]>,
): Promise<Row[]> {
  const rows = await selectRows<Row & { scanned: number }>(Study.sequelize!, walk, values);
  // No row at all says nothing of how far the window reached (the count found matches).
  if (rows.length === limit || (rows.length > 0 && rows[0]!.scanned < window)) return rows;
  return indexed();
}

/**
 * One page of the lab's current study revisions. Every filter maps to an index in the list's order
 * (lab_id first, current revisions only, id last: migrations 20261203-1545 and -1830), the kq and
 * K_SV sorts to those of migration 0008 (same NULLS LAST and id tie-breaker as the ORDER BY here),
 * text search to the lab's trigram index of migration 20261202-1000 (or, when its count says
 * matches are dense, to a window over the sort's own index: textSearchWindow). Pages come by number
 * (OFFSET over ids read from the sort's index, migration 20261203-1500) or by cursor (keyset: the
 * index is entered at the cursor's row, so page 2,000 costs what page 1 does). The total comes from
 * countSql, in the page's own statement or asked before it.
 */
export async function listStudies(lab: LabContext, query: ListStudiesQuery): Promise<StudyList> {
  const sequelize = Study.sequelize!;
  const binds = new Binds();
  const placeholders: Placeholders = { lab: binds.add(lab.id) };
  const where = [`s.lab_id = ${placeholders.lab}`, 's.is_current'];
  if (query.emitterId) where.push(`s.emitter_id = ${binds.add(query.emitterId)}`);
  if (query.quencherId) where.push(`s.quencher_id = ${binds.add(query.quencherId)}`);
  if (query.solventId) where.push(`s.solvent_id = ${binds.add(query.solventId)}`);
  if (query.status) where.push(`s.status = ${(placeholders.status = binds.add(query.status))}`);
  if (query.ownerId) where.push(`s.owner_id = ${(placeholders.owner = binds.add(query.ownerId))}`);
  if (query.flagged === 'true') where.push('s.flagged');
  const text = query.q ? `(s.title || ' ' || s.notes) ILIKE ${binds.add(`%${escapeLike(query.q)}%`)}` : null;
  if (text) where.push(text);

  const filterBinds = binds.values.length;

  const column = sortColumn[query.sort];
  const nullable = column !== 'updated_at';
  const cast = column === 'updated_at' ? 'timestamptz' : 'float8';
  const cursor = query.cursor ? decodeCursor(query.cursor, query.sort, query.direction) : null;
  const backwards = cursor?.k === 'before';
  // The list's order, or (for a page before a cursor, or counted from the end) the same order read
  // from the other end.
  const orderOf = (alias: string, reversed: boolean) =>
    `${alias}.${column} ${(query.direction === 'asc') !== reversed ? 'ASC' : 'DESC'}` +
    `${nullable ? (reversed ? ' NULLS FIRST' : ' NULLS LAST') : ''}, ${alias}.id ${reversed ? 'DESC' : 'ASC'}`;
  const order = (alias: string) => orderOf(alias, backwards);
  const up = (query.direction === 'asc') !== backwards;
  const limit = query.pageSize + 1; // one more than a page says whether another page follows

  // Each part reads one stretch of an index in order; a cursor inside the non-NULL values needs a
  // second part for the NULLs (kept at the end of the list in both directions).
  const parts: string[][] = [];
  if (!cursor) parts.push([]);
  else {
    const id = binds.add(cursor.i);
    if (cursor.v === null) {
      // Among the NULLs, which are ordered by id alone; before the first NULL come all the values.
      parts.push([`s.${column} IS NULL`, `s.id ${backwards ? '<' : '>'} ${id}`]);
      if (backwards) parts.push([`s.${column} IS NOT NULL`]);
    } else {
      const value = `${binds.add(cursor.v)}::${cast}`;
      const further = up ? '>' : '<';
      parts.push([
        `s.${column} ${further}= ${value}`,
        `(s.${column} ${further} ${value} OR s.id ${backwards ? '<' : '>'} ${id})`,
      ]);
      if (nullable && !backwards) parts.push([`s.${column} IS NULL`]);
    }
  }
  // Numbered pages skip rows inside the one part there is (no cursor), so only a page's rows are
  // named. The names are looked up by key per row of the page rather than joined: three LEFT JOINs
  // made PostgreSQL search join orders, 0.70 ms of planning against 0.22 ms with the lookups, and
  // the run took 0.52 against 0.31 ms (status and kq sort, the load benchmark's 5,000 studies, mean
  // of 30 EXPLAIN ANALYZE). A key matches one row or none, as the LEFT JOIN did.
  const offset = cursor ? 0 : (query.page - 1) * query.pageSize;
  const columns =
    's.id, s.title, s.emitter_id, s.quencher_id, s.solvent_id, s.custom_solvent_name, s.status, s.revision, ' +
    `s.owner_id, s.k_sv, s.kq, s.flagged, s.updated_at, s.${column}::text AS sort_key`;
  const selects = parts.map((extra) => {
    const stretch = `FROM studies s WHERE ${[...where, ...extra].join(' AND ')} ORDER BY ${order('s')} LIMIT ${limit}`;
    // A page by number skips (page - 1) x pageSize rows: their ids alone come from the sort's index
    // (lab, sort value, id) without touching the table, then the page's rows are read by key. Page
    // 2,000 of a 50,000-study lab took 180-250 ms reading and sorting whole rows, 23-33 ms this way
    // (psql, bench:studies data, load average 6). Without a text search the offset is a bind: one
    // text for every page number, prepared when onePlanSuits.
    return offset > 0
      ? `(SELECT ${columns} FROM studies s JOIN (SELECT s.id ${stretch} OFFSET ${text ? offset : binds.add(offset)}) k ON k.id = s.id)`
      : `(SELECT ${columns} ${stretch})`;
  });
  const named = `p.id, p.title, p.emitter_id AS "emitterId", p.quencher_id AS "quencherId", p.solvent_id AS "solventId",
           p.custom_solvent_name AS "customSolventName", p.status, p.revision, p.owner_id AS "ownerId",
           p.k_sv AS "kSv", p.kq, p.flagged, p.updated_at AS "updatedAt", p.sort_key AS "sortKey",
           (SELECT e.name FROM compounds e WHERE e.id = p.emitter_id) AS "emitterName",
           (SELECT q.name FROM compounds q WHERE q.id = p.quencher_id) AS "quencherName",
           (SELECT o.name FROM users o WHERE o.id = p.owner_id) AS "ownerName"`;
  const pageSql = (counted: boolean) =>
    `SELECT ${named}${counted ? `, (${countSql(query, where, placeholders)}) AS "matches"` : ''} ` +
    `FROM (${selects.join(' UNION ALL ')}) p ORDER BY ${order('p')} LIMIT ${limit}`;
  // With the count beside each row (a subquery PostgreSQL runs once, when the first row goes out,
  // in the page's own snapshot): one round trip instead of two.
  const pageRows = (counted = false) => {
    const sql = pageSql(counted);
    return selectRows<Row>(sequelize, onePlanSuits(query) ? fixedStatementOf(sql) : sql, binds.values);
  };
  const counting = () => countMatches(query, where, placeholders, binds.values.slice(0, filterBinds));
  let rows: Row[];
  let counted: { n: number; labTotal?: number } | undefined;
  if (text && parts.length === 1) {
    [counted] = await counting();
    // A window over the list's own order, a few times the stretch that holds the page's matches
    // when they are spread evenly; asked for only when it reads fewer rows than the matches are.
    const matches = counted?.n ?? 0;
    const window = Math.ceil((3 * (offset + limit) * (counted?.labTotal ?? 0)) / Math.max(matches, 1));
    const walk = `
      WITH p AS MATERIALIZED (
        SELECT ${columns}, ${text} AS hit FROM studies s
        WHERE ${[...where.filter((condition) => condition !== text), ...parts[0]!].join(' AND ')}
        ORDER BY ${order('s')} LIMIT ${window})
      SELECT ${named}, (SELECT count(*) FROM p)::int AS scanned FROM p
      WHERE p.hit ORDER BY ${order('p')} LIMIT ${limit} OFFSET ${offset}`;
    rows =
      matches === 0
        ? []
        : window < matches
          ? await textSearchWindow(walk, window, limit, binds.values, pageRows)
          : await pageRows();
  } else if (offset > 0 && !text) {
    // A page by number: its total first. Past the middle of a list whose length is exact (a count
    // under the cap, or any count from lab_study_counts), the page is the same stretch read from
    // the far end, so fewer than half the list is skipped: page 2,000 of 2,000 costs what page 1
    // does, page 1,000 the most.
    [counted] = await counting();
    const total = counted?.n ?? 0;
    const exact = total <= STUDY_COUNT_CAP || !(query.emitterId || query.quencherId || query.solventId);
    if (exact && offset >= total) rows = [];
    else if (exact && offset > total - offset) {
      // Rows offset … offset + limit - 1 of the list are rows total - end … total - offset - 1 read from its end.
      const end = Math.min(offset + limit, total);
      const [skipped, taken] = [total - end, end - offset];
      const fromEnd =
        `SELECT ${named} FROM (SELECT ${columns} FROM studies s JOIN (SELECT s.id FROM studies s ` +
        `WHERE ${where.join(' AND ')} ORDER BY ${orderOf('s', true)} LIMIT $${filterBinds + 1} OFFSET $${filterBinds + 2}) k ` +
        `ON k.id = s.id) p ORDER BY ${order('p')} LIMIT ${limit}`;
      rows = await selectRows<Row>(sequelize, onePlanSuits(query) ? fixedStatementOf(fromEnd) : fromEnd, [
        ...binds.values.slice(0, filterBinds),
        taken,
        skipped,
      ]);
    } else rows = await pageRows();
  } else {
    rows = await pageRows(true);
    // No row, no count beside it: a first page without a row has no match; past a cursor (the list
    // changed since it was given out) the count is asked on its own.
    if (rows.length > 0) counted = { n: rows[0]!.matches! };
    else if (!cursor) counted = { n: 0 };
    else [counted] = await counting();
  }
  const more = rows.length > query.pageSize;
  const page = rows.slice(0, query.pageSize);
  if (backwards) page.reverse();
  if (backwards && page.length < query.pageSize) {
    // Back at the start (rows were added or removed since): the first page itself.
    return listStudies(lab, { ...query, cursor: undefined, page: 1 });
  }
  const cursorAt = (row: Row | undefined, k: Cursor['k']) =>
    row ? encodeCursor({ s: query.sort, d: query.direction, k, v: row.sortKey, i: row.id }) : null;
  const hasNext = backwards || more;
  const hasPrevious = backwards ? more : cursor !== null || offset > 0;
  const total = counted?.n ?? 0;
  return {
    items: page.map((row) => toSummary(row)),
    total: Math.min(total, STUDY_COUNT_CAP),
    totalCapped: total > STUDY_COUNT_CAP,
    page: query.page,
    pageSize: query.pageSize,
    nextCursor: hasNext ? cursorAt(page.at(-1), 'after') : null,
    previousCursor: hasPrevious ? cursorAt(page[0], 'before') : null,
  };
}
