/**
 * Recovery benchmark: `npm run bench:recovery` (after `npm run build`). Runs the compiled
 * production server (dist/server/index.js under plain node) on a throwaway PostgreSQL cluster
 * (temporary folder, free loopback port, deleted afterwards), then, 3 times each, (a) restarts the
 * cluster with `pg_ctl restart -m fast` and (b) ends every connection of the app with
 * `pg_terminate_backend`, while /api/health is polled every 50 ms. Prints, for each, the time
 * until the same process answers /api/health 200 again, counted from the start of the disruption
 * and from its end (PostgreSQL taking connections again; the connections ended), the answers
 * that were not 200, the load average beside each run, and the median. Figures only, no asserts.
 */
import crypto from 'node:crypto';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { setTimeout as sleep } from 'node:timers/promises';
import { startServerProcess } from '../support/server-process';
import { startThrowawayCluster } from '../support/throwaway-cluster';

const RUNS = 3;
const POLL_MS = 50;
const median = (values: number[]) => [...values].sort((a, b) => a - b)[Math.floor(values.length / 2)]!;
const load = () => os.loadavg()[0]!.toFixed(2);

async function health(baseUrl: string): Promise<number> {
  try {
    return (await fetch(`${baseUrl}/api/health`, { signal: AbortSignal.timeout(2_000) })).status;
  } catch {
    return 0;
  }
}

interface Recovery {
  /** ms from the start of the disruption to the first 200 after it */
  fromStart: number;
  /** ms from the end of the disruption (pg_ctl restart returned; connections ended) to the first 200 */
  fromBack: number;
  notOk: number;
  load: string;
}

/** Runs `disrupt` while polling /api/health; resolves when a 200 comes after `disrupt` finished. */
async function timeRecovery(baseUrl: string, disrupt: () => Promise<unknown>): Promise<Recovery> {
  const began = performance.now();
  let back = Number.POSITIVE_INFINITY;
  const disruption = disrupt().then(() => (back = performance.now()));
  let notOk = 0;
  for (;;) {
    const status = await health(baseUrl);
    const now = performance.now();
    if (status === 200 && now > back) {
      await disruption;
      return { fromStart: now - began, fromBack: now - back, notOk, load: load() };
    }
    if (status !== 200) notOk += 1;
    if (now - began > 60_000) throw new Error('/api/health did not answer 200 within 60 s');
    await sleep(POLL_MS);
  }
}

function report(label: string, after: string, runs: Recovery[]) {
  const rows = runs.map(
    (run, i) =>
      `    run ${i + 1}: ${run.fromStart.toFixed(0)} ms from the start, ${run.fromBack.toFixed(0)} ms ${after}, ` +
      `non-200 answers: ${run.notOk} (load ${run.load})`,
  );
  console.log(
    `${label}: median ${median(runs.map((run) => run.fromStart)).toFixed(0)} ms from the start, ` +
      `${median(runs.map((run) => run.fromBack)).toFixed(0)} ms ${after}\n${rows.join('\n')}`,
  );
}

async function main() {
  const cluster = await startThrowawayCluster();
  const dataRoot = fs.mkdtempSync(path.join(os.tmpdir(), 'halflight-bench-recovery-'));
  const server = await startServerProcess({
    DATABASE_URL: cluster.url,
    SESSION_SECRET: crypto.randomBytes(32).toString('hex'),
    HALFLIGHT_DATA_DIR: dataRoot,
    HALFLIGHT_DEMO_DATA: 'false',
    NODE_ENV: 'production',
  });
  try {
    await server.waitForHealthy();
    console.log(`Before: load ${load()} on ${os.cpus().length} cores; polling /api/health every ${POLL_MS} ms.`);
    const restarts: Recovery[] = [];
    const terminations: Recovery[] = [];
    for (let run = 0; run < RUNS; run += 1) {
      await sleep(1_000);
      restarts.push(await timeRecovery(server.baseUrl, () => cluster.restart()));
      await sleep(1_000);
      terminations.push(await timeRecovery(server.baseUrl, () => cluster.terminateOthers()));
    }
    report('pg_ctl restart -m fast', 'after PostgreSQL took connections again', restarts);
    report('pg_terminate_backend of every app connection', 'after the connections were ended', terminations);
    if (server.child.exitCode !== null) console.log(`The server exited (${server.child.exitCode}).`);
  } finally {
    server.kill('SIGTERM');
    await server.waitForExit().catch(() => {});
    await cluster.stop();
    fs.rmSync(dataRoot, { recursive: true, force: true });
  }
}

await main();
