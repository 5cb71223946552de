/**
 * Studies-list benchmark: `npm run bench:studies`. Starts a throwaway PostgreSQL (temporary
 * folder, free port, the real migrations, as tests/support/global-database.ts does), bulk-inserts
 * 10,000 invented studies in one lab (plus 1,000 in a second lab, so lab_id is not the whole
 * table), then times the list service (server/services/studies/study-list.service.ts) and the
 * API call GET /api/labs/:labId/studies through HTTP against the real app (signed in as a lab
 * member) per filter, sort and text search, and shows which indexes PostgreSQL picks.
 * Prints figures only; nothing is asserted. All names and numbers are invented.
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
import { seedBenchStudies } from './studies-list-data';

const RUNS = 20;
const HTTP_RUNS = 100;
/** Issue 5, "Benchmark": p95 of the list API call under 50 ms on this machine. */
const TARGET_P95_MS = 50;
/** Nearest-rank percentile of sorted values. */
const percentile = (sorted: number[], p: number) => sorted[Math.max(0, Math.ceil(sorted.length * p) - 1)]!;

async function main() {
  const dataRoot = fs.mkdtempSync(path.join(os.tmpdir(), 'halflight-bench-'));
  const database = await startEmbeddedPostgres({ dataRoot, port: await freePort(), database: 'halflight_bench' });
  const sequelize = createSequelize(database.url);
  try {
    await migrateToLatest(sequelize);
    initModels(sequelize);
    const started = performance.now();
    const seeded = await seedBenchStudies(sequelize);
    console.log(
      `Inserted ${seeded.total} studies (${seeded.inLab} in the measured lab) in ${((performance.now() - started) / 1000).toFixed(1)} s; ANALYZE done.`,
    );
    const lab: LabContext = {
      id: seeded.labId,
      name: 'Bench lab',
      isDemo: false,
      role: 'admin',
      membershipId: seeded.labId,
    };

    const cases: Array<[string, Partial<Record<keyof ListStudiesQuery, string>>]> = [
      ['no filter (updated, desc)', {}],
      ['status = submitted', { status: 'submitted' }],
      ['emitter', { emitterId: seeded.emitterId }],
      ['quencher', { quencherId: seeded.quencherId }],
      ['owner', { ownerId: seeded.ownerId }],
      ['solvent = dichloromethane', { solventId: 'dichloromethane' }],
      ['flagged only', { flagged: 'true' }],
      ['sort kq (desc)', { sort: 'kq' }],
      ['sort K_SV (desc)', { sort: 'k_sv' }],
      ['sort updated (asc)', { sort: 'updated', direction: 'asc' }],
      ['text search "thiophenol"', { q: 'thiophenol' }],
    ];
    const report = (name: string, times: number[], total: number) => {
      const sorted = [...times].sort((a, b) => a - b);
      const p95 = percentile(sorted, 0.95);
      console.log(
        `  ${name.padEnd(28)} ${percentile(sorted, 0.5).toFixed(2).padStart(7)} ms   p95 ${p95.toFixed(2).padStart(6)} ms   ${total} matches`,
      );
      return p95;
    };
    console.log(`\nlistStudies service, page 1 of 25, median and p95 of ${RUNS} runs (after 2 warm-up runs):`);
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
      report(name, times, total);
    }

    // The issue's target is the API call: the real app on 127.0.0.1, signed in as a lab viewer.
    const server = await startBenchServer(sequelize, database.url);
    try {
      const client = await signedInClient(server.baseUrl, await createBenchMember(seeded.labId, 'viewer'));
      console.log(
        `\nGET /api/labs/:labId/studies over HTTP, median and p95 of ${HTTP_RUNS} calls (after 5 warm-up calls):`,
      );
      let worst = 0;
      for (const [name, raw] of cases) {
        const url = `/api/labs/${seeded.labId}/studies?${new URLSearchParams(raw as Record<string, string>)}`;
        const call = async () => {
          const response = await client.get(url);
          if (response.status !== 200) throw new Error(`${url}: ${response.status} ${await response.text()}`);
          return ((await response.json()) as { total: number }).total;
        };
        for (let i = 0; i < 5; i++) await call();
        const times: number[] = [];
        let total = 0;
        for (let i = 0; i < HTTP_RUNS; i++) {
          const t0 = performance.now();
          total = await call();
          times.push(performance.now() - t0);
        }
        worst = Math.max(worst, report(name, times, total));
      }
      console.log(
        `  Target p95 under ${TARGET_P95_MS} ms: ${worst < TARGET_P95_MS ? 'met' : 'NOT met'} (worst p95 ${worst.toFixed(2)} ms).`,
      );
    } finally {
      await server.close();
    }

    console.log(
      '\nEXPLAIN of the page query the service sends (indexes used; "Sort" means PostgreSQL sorted rows itself):',
    );
    const explained: Array<[string, Partial<Record<keyof ListStudiesQuery, string>>]> = [
      ['owner filter', { ownerId: seeded.ownerId }],
      ['text search "thiophenol"', { q: 'thiophenol' }],
      ['sort kq (desc)', { sort: 'kq' }],
      ['sort kq (asc)', { sort: 'kq', direction: 'asc' }],
      ['sort K_SV (desc)', { sort: 'k_sv' }],
      ['sort K_SV (asc)', { sort: 'k_sv', direction: 'asc' }],
    ];
    for (const [name, raw] of explained) {
      const statements: string[] = [];
      // Sequelize 6 keeps its options at runtime (the typings leave them out): log the SQL the service sends.
      const options = (sequelize as unknown as { options: { logging: false | ((sql: string) => void) } }).options;
      options.logging = (sql) => statements.push(sql.replace(/^Executing \([^)]*\): /, ''));
      await listStudies(lab, listStudiesQuerySchema.parse(raw));
      options.logging = false;
      const pageQuery = statements.find((sql) => !/count\(/i.test(sql))!;
      const [plan] = (await sequelize.query(`EXPLAIN ${pageQuery}`)) as [Array<{ 'QUERY PLAN': string }>, unknown];
      const lines = plan.map((row) => row['QUERY PLAN']);
      const indexes = [
        ...new Set(
          lines.flatMap((line) =>
            [...line.matchAll(/Index(?: Only)? Scan(?: Backward)? (?:using|on) (\S+)/g)].map((match) => match[1]!),
          ),
        ),
      ];
      const sorts = lines.filter((line) => /\bSort\b/.test(line) && !/Sort Key/.test(line)).length;
      console.log(
        `  ${name.padEnd(26)} ${indexes.join(', ') || 'no index (sequential scan)'}${sorts ? `; ${sorts} Sort node(s)` : '; no Sort node'}`,
      );
    }
  } finally {
    await sequelize.close();
    await database.stop();
    fs.rmSync(dataRoot, { recursive: true, force: true });
  }
}

await main();
