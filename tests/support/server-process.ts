import { spawn } from 'node:child_process';
import fs from 'node:fs';
import path from 'node:path';
import { setTimeout as sleep } from 'node:timers/promises';
import { projectRoot } from '../../server/config/env';
import { freePort } from './free-port';

const entry = path.join(projectRoot, 'dist', 'server', 'index.js');

/**
 * The production server (the compiled dist/server/index.js under plain node, as `npm start` runs
 * it) as a child process on a free loopback port, for tests of starting and stopping.
 */
export async function startServerProcess(env: Record<string, string>) {
  if (!fs.existsSync(entry))
    throw new Error('The server is not compiled: run "npm run build" (npm test does this first).');
  const port = await freePort();
  const child = spawn(process.execPath, [entry], {
    cwd: projectRoot,
    env: { ...process.env, HOST: '127.0.0.1', PORT: String(port), LOG_LEVEL: 'info', ...env },
    stdio: ['ignore', 'pipe', 'pipe'],
  });
  let output = '';
  child.stdout.on('data', (chunk: Buffer) => (output += chunk.toString()));
  child.stderr.on('data', (chunk: Buffer) => (output += chunk.toString()));
  const exited = new Promise<number | null>((resolve) => child.once('exit', (code) => resolve(code)));
  const baseUrl = `http://127.0.0.1:${port}`;

  return {
    child,
    baseUrl,
    output: () => output,
    exited,
    /** Resolves when the output contains `text`; fails if the process ends first or after `ms`. */
    async waitForOutput(text: string | RegExp, ms = 90_000) {
      const began = Date.now();
      const found = () => (typeof text === 'string' ? output.includes(text) : text.test(output));
      while (!found()) {
        if (child.exitCode !== null)
          throw new Error(`The server exited (${child.exitCode}) before "${text}":\n${output}`);
        if (Date.now() - began > ms) throw new Error(`No "${text}" within ${ms} ms:\n${output}`);
        await sleep(50);
      }
    },
    /** Resolves when /api/health answers 200; fails if the process ends first or after `ms`. */
    async waitForHealthy(ms = 90_000) {
      const began = Date.now();
      for (;;) {
        if (child.exitCode !== null) throw new Error(`The server exited (${child.exitCode}):\n${output}`);
        const status = await fetch(`${baseUrl}/api/health`, { signal: AbortSignal.timeout(5_000) }).then(
          (response) => response.status,
          () => 0,
        );
        // Only our process prints this: a 200 from another program that took the port does not count.
        if (status === 200 && output.includes('Halflight is ready')) return;
        if (Date.now() - began > ms) throw new Error(`Not healthy within ${ms} ms:\n${output}`);
        await sleep(200);
      }
    },
    /** Waits for the process to end (at most `ms`) and returns its exit code. */
    async waitForExit(ms = 90_000): Promise<number | null> {
      const timeout = sleep(ms).then(() => {
        throw new Error(`The server did not exit within ${ms} ms:\n${output}`);
      });
      return Promise.race([exited, timeout]);
    },
    kill(signal: NodeJS.Signals) {
      if (child.exitCode === null) child.kill(signal);
    },
  };
}

/** Pids of running PostgreSQL server processes whose command line names this data folder. */
export function postgresProcessesOf(pgdata: string): number[] {
  const pids: number[] = [];
  for (const entry of fs.readdirSync('/proc')) {
    if (!/^\d+$/.test(entry)) continue;
    try {
      const commandLine = fs.readFileSync(`/proc/${entry}/cmdline`, 'utf8').split('\0');
      if (commandLine.some((part) => part === pgdata) && commandLine[0]?.endsWith('postgres')) pids.push(Number(entry));
    } catch {
      // The process ended while we looked.
    }
  }
  return pids;
}
