/**
 * Study-screen benchmark: `npm run bench:study-screen` (build first: `npm run build`). Starts the
 * production server (dist/server/index.js under plain node) on its own built-in PostgreSQL with the
 * demo data, makes one study of 400 points through the API (invented numbers) and fits it, then
 * opens the study screen in Debian's Chromium several times and records, with a
 * PerformanceObserver for 'longtask' installed before the page's own code runs:
 *   - the time from navigation to the fitted K_SV on screen,
 *   (the page is waited on with querySelector, not role locators, which are long tasks themselves),
 *   - the long tasks (main-thread tasks over 50 ms): how many, the longest, and their sum,
 *   - the same for paging the points grid forward once ("Next rows").
 * Prints the median of the runs and each run's figures with the load average. Figures only;
 * nothing is asserted. BENCH_SCREEN_RUNS sets the number of runs (default 5), BENCH_SCREEN_POINTS
 * the number of points (default 400).
 */
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { pointAt } from '@shared/schemas/study-points';
import { projectRoot } from '../../server/config/env';
import { launchBrowser, signInThroughPage } from '../support/browser';
import { freePort } from '../support/free-port';
import { demoLabPicks, signIn, startProductionServer } from './load-server';

const runs = Number(process.env.BENCH_SCREEN_RUNS ?? 5);
const pointCount = Number(process.env.BENCH_SCREEN_POINTS ?? 400);
const researcher = { email: 'priya.halvorsen@demo.halflight.example', password: 'halflight-demo' };

type LongTasks = { count: number; longest: number; total: number };
type Run = { toResult: number; open: LongTasks; paging: LongTasks; load: string };

const loadAverage = () =>
  os
    .loadavg()
    .map((value) => value.toFixed(2))
    .join(' / ');
const median = (values: number[]) => {
  const sorted = [...values].sort((a, b) => a - b);
  const middle = Math.floor(sorted.length / 2);
  return sorted.length % 2 ? sorted[middle]! : (sorted[middle - 1]! + sorted[middle]!) / 2;
};

/** An invented series, I0/I = 1 + 350 [Q] with a little scatter, 0 to 20 mM. */
function invented400(): ReturnType<typeof pointAt>[] {
  return Array.from({ length: pointCount }, (_, i) => {
    const concentration = (i * 0.02) / pointCount;
    const scatter = 1 + 0.004 * Math.sin(i * 1.7);
    return { ...pointAt(concentration), intensity: (61_000 / (1 + 350 * concentration)) * scatter };
  });
}

async function main() {
  console.log(`bench:study-screen — Node ${process.version}, ${os.cpus().length} cores`);
  console.log(`load average before start (1 / 5 / 15 min): ${loadAverage()}`);
  const dataDir = fs.mkdtempSync(path.join(os.tmpdir(), 'halflight-screen-'));
  const server = await startProductionServer({
    projectRoot,
    dataDir,
    port: await freePort(),
    pgPort: await freePort(),
  });
  const browser = await launchBrowser();
  try {
    const { labId, emitterId, quencherId } = await demoLabPicks(server);
    const headers = { ...(await signIn(server.baseUrl, researcher)), 'content-type': 'application/json' };
    const api = `${server.baseUrl}/api/labs/${labId}/studies`;
    const created = await fetch(api, {
      method: 'POST',
      headers,
      body: JSON.stringify({
        title: `Screen bench study, ${pointCount} points (invented)`,
        emitterId,
        quencherId,
        solventId: 'acetonitrile',
        atmosphere: 'argon',
        degassingMethod: 'sparging',
        tau0: 1.1e-6,
      }),
    });
    if (created.status !== 201) throw new Error(`create: ${created.status} ${await created.text()}`);
    const study = (await created.json()) as { id: string; version: number };
    const patched = await fetch(`${api}/${study.id}/points`, {
      method: 'PATCH',
      headers,
      body: JSON.stringify({ version: study.version, points: invented400() }),
    });
    if (patched.status !== 200) throw new Error(`points: ${patched.status} ${await patched.text()}`);
    const fitted = await fetch(`${api}/${study.id}/fits`, {
      method: 'POST',
      headers,
      body: JSON.stringify({ model: 'linear-free' }),
    });
    if (fitted.status !== 201) throw new Error(`fit: ${fitted.status} ${await fitted.text()}`);

    const context = await browser.newContext({ viewport: { width: 1440, height: 900 } });
    // Installed before any of the page's code: every long task of the page's life is kept.
    await context.addInitScript(() => {
      const seen: Array<{ start: number; duration: number }> = [];
      (window as unknown as { __longTasks: typeof seen }).__longTasks = seen;
      new PerformanceObserver((list) => {
        for (const entry of list.getEntries()) seen.push({ start: entry.startTime, duration: entry.duration });
      }).observe({ type: 'longtask', buffered: true });
    });
    const page = await context.newPage();
    await signInThroughPage(page, server.baseUrl, researcher);
    const summarise = async (from: number): Promise<LongTasks> => {
      const tasks = await page.evaluate(
        (after) =>
          (window as unknown as { __longTasks: Array<{ start: number; duration: number }> }).__longTasks.filter(
            (task) => task.start >= after,
          ),
        from,
      );
      return {
        count: tasks.length,
        longest: Math.max(0, ...tasks.map((task) => task.duration)),
        total: tasks.reduce((sum, task) => sum + task.duration, 0),
      };
    };

    const results: Run[] = [];
    for (let run = 0; run < runs; run++) {
      const started = performance.now();
      await page.goto(`${server.baseUrl}/labs/${labId}/studies/${study.id}`);
      // Waits by querySelector: Playwright's role and text locators run in the page and, on a screen
      // this size, were long tasks of their own (up to 200 ms) counted as the page's.
      await page.waitForFunction(() => document.querySelector('[aria-label="K_SV result"]'));
      const toResult = performance.now() - started;
      await page.waitForFunction(() => document.querySelector('nav[aria-label="Pages of points"]'));
      await page.waitForTimeout(1500); // let charts settle so their tasks are counted
      const open = await summarise(0);
      const pagingFrom = await page.evaluate(() => performance.now());
      await page.locator('nav[aria-label="Pages of points"] button:has-text("Next rows")').click();
      await page.waitForTimeout(1000);
      const paging = await summarise(pagingFrom);
      results.push({ toResult, open, paging, load: loadAverage() });
    }
    await context.close();

    const f = (value: number) => value.toFixed(0).padStart(6);
    console.log(`\nstudy of ${pointCount} points, ${runs} runs, Chromium 1440x900`);
    console.log('run  to K_SV ms  long tasks  longest ms  sum ms | paging: tasks  longest ms  sum ms   load 1/5/15');
    results.forEach((r, i) =>
      console.log(
        `${String(i + 1).padStart(3)}  ${f(r.toResult)}     ${String(r.open.count).padStart(6)}      ${f(r.open.longest)}  ${f(r.open.total)} |         ${String(r.paging.count).padStart(3)}      ${f(r.paging.longest)}  ${f(r.paging.total)}   ${r.load}`,
      ),
    );
    console.log(
      `median: to K_SV ${median(results.map((r) => r.toResult)).toFixed(0)} ms; longest task on opening ${median(results.map((r) => r.open.longest)).toFixed(0)} ms; longest task on paging ${median(results.map((r) => r.paging.longest)).toFixed(0)} ms`,
    );
  } finally {
    await browser.close();
    await server.stop();
    fs.rmSync(dataDir, { recursive: true, force: true });
  }
}

await main();
