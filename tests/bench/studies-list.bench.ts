/**
 * Studies-list benchmark: `npm run bench:studies`. Starts a throwaway PostgreSQL (temporary
 * folder, free port, the real migrations, as tests/support/global-database.ts does), makes
 * invented studies with generate_series (tests/bench/studies-scale-data.ts): by default 1,000 labs
 * of 1,000 studies (one million) plus one lab of 50,000; then, for a typical lab and for the big
 * one, times the list service (server/services/studies/study-list.service.ts) and the API call
 * GET /api/labs/:labId/studies through HTTP against the real app (signed in as a lab member) per
 * filter, sort and text search, the dashboard and a comparison of one emitter, and shows which
 * indexes PostgreSQL picks. Prints figures only; nothing is asserted. All names and numbers are
 * invented. BENCH_STUDIES_LABS, BENCH_STUDIES_PER_LAB and BENCH_STUDIES_BIG_LAB set other sizes
 * (the seeding of a million rows takes minutes). BENCH_STUDIES_DATA=<folder> keeps the cluster
 * there: a later run with the same folder and sizes skips the seeding (migrations still run, so a
 * new index is built on the kept rows), for timing one change before and after on the same data.
 */
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { listStudiesQuerySchema, type ListStudiesQuery } from '../../shared/schemas/studies';
import { startEmbeddedPostgres } from '../../server/db/embedded-postgres';
import { migrateToLatest } from '../../server/db/migrator';
import { createSequelize } from '../../server/db/sequelize';
import type { LabContext } from '../../server/domain/lab-context';
import { initModels } from '../../server/models';
import { listStudies } from '../../server/services/studies/study-list.service';
import { freePort } from '../support/free-port';
import { createBenchMember, signedInClient, startBenchServer } from './bench-http';
import { seedScaleStudies, seededScaleStudies, type BenchLab } from './studies-scale-data';

const RUNS = 20;
const HTTP_RUNS = 100;
/** Issue 12, "Benchmarks": p95 of the list API with each filter and sort under 30 ms. */
const TARGET_P95_MS = 30;
const LABS = Number(process.env.BENCH_STUDIES_LABS ?? 1000);
const PER_LAB = Number(process.env.BENCH_STUDIES_PER_LAB ?? 1000);
const BIG_LAB = Number(process.env.BENCH_STUDIES_BIG_LAB ?? 50_000);
/** Nearest-rank percentile of sorted values. */
const percentile = (sorted: number[], p: number) => sorted[Math.max(0, Math.ceil(sorted.length * p) - 1)]!;
const loadAverage = () =>
  os
    .loadavg()
    .map((value) => value.toFixed(2))
    .join(' / ');

type Case = [string, Partial<Record<keyof ListStudiesQuery, string>>];
const casesFor = (lab: BenchLab): Case[] => [
  ['no filter (updated, desc)', {}],
  ['status = submitted', { status: 'submitted' }],
  ['emitter', { emitterId: lab.emitterId }],
  ['quencher', { quencherId: lab.quencherId }],
  ['owner', { ownerId: lab.ownerId }],
  ['solvent = dichloromethane', { solventId: 'dichloromethane' }],
  ['flagged only', { flagged: 'true' }],
  ['sort kq (desc)', { sort: 'kq' }],
  ['sort kq (asc)', { sort: 'kq', direction: 'asc' }],
  ['sort K_SV (desc)', { sort: 'k_sv' }],
  ['sort updated (asc)', { sort: 'updated', direction: 'asc' }],
  ['page 40', { page: '40' }],
  ['text search "thiophenol"', { q: 'thiophenol' }],
];

/**
 * Deep pages: by number (OFFSET) and by the cursor the page before gave (keyset), for the page
 * 40 of a typical lab and the last pages of a big one.
 */
async function deepCases(context: LabContext, inLab: number): Promise<Case[]> {
  const pages = [...new Set([40, Math.floor(inLab / 25 / 2), Math.floor(inLab / 25)])].filter(
    (page) => page > 1 && page * 25 <= inLab,
  );
  const cases: Case[] = [];
  for (const page of pages) {
    const before = await listStudies(context, listStudiesQuerySchema.parse({ page: String(page - 1) }));
    cases.push([`page ${page} by number`, { page: String(page) }]);
    cases.push([`page ${page} by cursor`, { cursor: before.nextCursor!, page: String(page) }]);
  }
  return cases;
}

function report(name: string, times: number[], total: number | string) {
  const sorted = [...times].sort((a, b) => a - b);
  const p95 = percentile(sorted, 0.95);
  console.log(
    `  ${name.padEnd(28)} ${percentile(sorted, 0.5).toFixed(2).padStart(7)} ms   p95 ${p95.toFixed(2).padStart(7)} ms   ${total}`,
  );
  return p95;
}

async function serviceTimes(lab: LabContext, cases: Case[]) {
  console.log(`\n  listStudies service, page of 25, median and p95 of ${RUNS} runs (after 2 warm-up runs):`);
  for (const [name, raw] of cases) {
    const query = listStudiesQuerySchema.parse(raw);
    for (let i = 0; i < 2; i++) await listStudies(lab, query);
    const times: number[] = [];
    let total = 0;
    for (let i = 0; i < RUNS; i++) {
      const t0 = performance.now();
      total = (await listStudies(lab, query)).total;
      times.push(performance.now() - t0);
    }
    report(name, times, `${total} matches`);
  }
}

async function httpTimes(client: Awaited<ReturnType<typeof signedInClient>>, lab: BenchLab, cases: Case[]) {
  console.log(
    `\n  GET /api/labs/:labId/studies over HTTP, median and p95 of ${HTTP_RUNS} calls (after 5 warm-up calls):`,
  );
  let worst = 0;
  const timeCalls = async (url: string, runs: number) => {
    const call = async () => {
      const response = await client.get(url);
      if (response.status !== 200) throw new Error(`${url}: ${response.status} ${await response.text()}`);
      return (await response.json()) as { total?: number };
    };
    for (let i = 0; i < 5; i++) await call();
    const times: number[] = [];
    let body: { total?: number } = {};
    for (let i = 0; i < runs; i++) {
      const t0 = performance.now();
      body = await call();
      times.push(performance.now() - t0);
    }
    return { times, body };
  };
  for (const [name, raw] of cases) {
    const { times, body } = await timeCalls(
      `/api/labs/${lab.labId}/studies?${new URLSearchParams(raw as Record<string, string>)}`,
      HTTP_RUNS,
    );
    worst = Math.max(worst, report(name, times, `${body.total} matches`));
  }
  console.log(
    `  Target p95 under ${TARGET_P95_MS} ms: ${worst < TARGET_P95_MS ? 'met' : 'NOT met'} (worst p95 ${worst.toFixed(2)} ms; load average ${loadAverage()}).`,
  );
  console.log('\n  Other screens over HTTP, median and p95 of 30 calls:');
  const dashboard = await timeCalls(`/api/labs/${lab.labId}/dashboard`, 30);
  report('dashboard', dashboard.times, '');
  const comparison = await timeCalls(`/api/labs/${lab.labId}/comparisons/emitter/${lab.emitterId}`, 30);
  report('comparison of one emitter', comparison.times, '');
}

async function explain(sequelize: ReturnType<typeof createSequelize>, lab: LabContext, big: BenchLab) {
  console.log(
    '\nEXPLAIN of the page query the service sends in the big lab (indexes used; "Sort" means PostgreSQL sorted rows itself):',
  );
  const explained: Case[] = [
    ['owner filter', { ownerId: big.ownerId }],
    ['text search "thiophenol"', { q: 'thiophenol' }],
    ['sort kq (desc)', { sort: 'kq' }],
    ['sort kq (asc)', { sort: 'kq', direction: 'asc' }],
    ['sort K_SV (desc)', { sort: 'k_sv' }],
    ['sort K_SV (asc)', { sort: 'k_sv', direction: 'asc' }],
    ['page 1,000 by number', { page: '1000' }],
    ['flagged, page 150', { flagged: 'true', page: '150' }],
  ];
  for (const [name, raw] of explained) {
    const statements: Array<{ sql: string; bind?: unknown[] }> = [];
    // The service sends its statements on pool connections through selectRows (server/db/select-rows.ts),
    // past Sequelize's logging: look at what each connection handed out meanwhile is asked.
    type Asked = string | { text: string; values?: unknown[] };
    type Connection = { query: (asked: Asked, values?: unknown[]) => Promise<unknown> };
    const manager = sequelize.connectionManager as unknown as { getConnection: (o: unknown) => Promise<Connection> };
    const getConnection = manager.getConnection;
    const watched = new Set<Connection>();
    manager.getConnection = async (options) => {
      const connection = await getConnection.call(manager, options);
      if (!watched.has(connection)) {
        watched.add(connection);
        const query = connection.query;
        // An own property over the prototype's method, deleted again below: the pool gets back the
        // very connection it handed out.
        connection.query = (asked, values) => {
          statements.push(
            typeof asked === 'string' ? { sql: asked, bind: values } : { sql: asked.text, bind: asked.values },
          );
          return query.call(connection, asked, values);
        };
      }
      return connection;
    };
    try {
      await listStudies(lab, listStudiesQuerySchema.parse(raw));
    } finally {
      manager.getConnection = getConnection;
      for (const connection of watched) delete (connection as Partial<Connection>).query;
    }
    // The page's statement names its sort key (the count's does not; a text search's window counts
    // its own rows, so "count(" no longer tells them apart); with a text search the last one asked.
    const pageQuery = statements.findLast((statement) => statement.sql.includes('AS "sortKey"'));
    if (!pageQuery) {
      console.log(`  ${name.padEnd(26)} no page statement (past the end of the list at these sizes)`);
      continue;
    }
    const [plan] = (await sequelize.query(`EXPLAIN ${pageQuery.sql}`, { bind: pageQuery.bind })) as [
      Array<{ 'QUERY PLAN': string }>,
      unknown,
    ];
    const lines = plan.map((row) => row['QUERY PLAN']);
    const indexes = [
      ...new Set(
        lines.flatMap((line) =>
          [...line.matchAll(/Index(?: Only)? Scan(?: Backward)? (?:using|on) (\S+)/g)].map((match) => match[1]!),
        ),
      ),
    ];
    // With the rows PostgreSQL expects each to sort: a page's own rows after a read by key, or whole lists.
    const sortRows = lines
      .filter((line) => /\bSort\b/.test(line) && !/Sort Key/.test(line))
      .map((line) => /rows=(\d+)/.exec(line)?.[1] ?? '?');
    const sorts = sortRows.length ? `${sortRows.length} Sort node(s) of ${sortRows.join(', ')} rows (estimated)` : '';
    console.log(
      `  ${name.padEnd(26)} ${indexes.join(', ') || 'no index (sequential scan)'}${sorts ? `; ${sorts}` : '; no Sort node'}`,
    );
  }
}

async function main() {
  const kept = process.env.BENCH_STUDIES_DATA ? path.resolve(process.env.BENCH_STUDIES_DATA) : undefined;
  if (kept) fs.mkdirSync(kept, { recursive: true });
  const dataRoot = kept ?? fs.mkdtempSync(path.join(os.tmpdir(), 'halflight-bench-'));
  const database = await startEmbeddedPostgres({ dataRoot, port: await freePort(), database: 'halflight_bench' });
  const sequelize = createSequelize(database.url);
  try {
    await migrateToLatest(sequelize);
    initModels(sequelize);
    console.log(`bench:studies — load average before start (1 / 5 / 15 min): ${loadAverage()}`);
    const started = performance.now();
    const sizes = { labs: LABS, perLab: PER_LAB, bigLab: BIG_LAB };
    let seeded = kept ? await seededScaleStudies(sequelize, sizes) : undefined;
    if (seeded) console.log(`Kept studies in ${dataRoot} (the same sizes), analysed again:`);
    else {
      console.log(`Making ${LABS} labs x ${PER_LAB} studies and one lab of ${BIG_LAB} (generate_series):`);
      seeded = await seedScaleStudies(sequelize, { ...sizes, log: (line) => console.log(line) });
    }
    console.log(
      `${seeded.total.toLocaleString('en-US')} studies ready in ${((performance.now() - started) / 1000).toFixed(0)} s, VACUUM ANALYZE done.`,
    );
    const server = await startBenchServer(sequelize, database.url);
    try {
      for (const [title, lab] of [
        [
          `A typical lab (${PER_LAB.toLocaleString('en-US')} of the ${seeded.total.toLocaleString('en-US')} studies)`,
          seeded.typical,
        ],
        [`The big lab (${BIG_LAB.toLocaleString('en-US')} studies)`, seeded.big],
      ] as const) {
        console.log(`\n${title}`);
        const context: LabContext = {
          id: lab.labId,
          name: 'Bench lab',
          isDemo: false,
          role: 'admin',
          membershipId: lab.labId,
        };
        const cases = [...casesFor(lab), ...(await deepCases(context, lab === seeded.big ? BIG_LAB : PER_LAB))];
        await serviceTimes(context, cases);
        const client = await signedInClient(server.baseUrl, await createBenchMember(lab.labId, 'viewer'));
        await httpTimes(client, lab, cases);
      }
    } finally {
      await server.close();
    }
    const big: LabContext = {
      id: seeded.big.labId,
      name: 'Bench lab',
      isDemo: false,
      role: 'admin',
      membershipId: seeded.big.labId,
    };
    await explain(sequelize, big, seeded.big);
  } finally {
    await sequelize.close();
    await database.stop();
    if (!kept) fs.rmSync(dataRoot, { recursive: true, force: true });
  }
}

await main();
