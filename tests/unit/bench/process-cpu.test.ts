import { spawn } from 'node:child_process';
import { once } from 'node:events';
import fs from 'node:fs';
import { describe, expect, it } from 'vitest';
import { serverCpuMs } from '../../bench/process-cpu';

// proc(5): a process's cutime/cstime hold the CPU time of its children that ended and were waited
// for. bench:load divides the server's CPU time by the requests of a phase, so the time of a
// PostgreSQL backend whose connection closed during the phase must still count.
const burnMs = 600;
const parentScript = `
const { spawn } = require('node:child_process');
const child = spawn(process.execPath, ['-e', 'while (process.cpuUsage().user / 1000 < ${burnMs}) {}']);
child.on('exit', () => { process.stdout.write('ended\\n'); });
process.stdin.resume();
`;

describe.runIf(fs.existsSync('/proc/self/stat'))('serverCpuMs', () => {
  it("counts the CPU time of a child that has ended in its parent's tree", async () => {
    const parent = spawn(process.execPath, ['-e', parentScript], { stdio: ['pipe', 'pipe', 'inherit'] });
    try {
      const [chunk] = (await once(parent.stdout, 'data')) as [Buffer];
      expect(chunk.toString()).toBe('ended\n');
      const { node } = serverCpuMs(parent.pid!, '/no/such/cluster');
      // The child alone burned burnMs of user time; ticks are 10 ms each.
      expect(node).toBeGreaterThanOrEqual(burnMs - 20);
    } finally {
      parent.stdin.end();
      await once(parent, 'exit');
    }
  }, 30_000);
});
