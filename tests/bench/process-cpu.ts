import fs from 'node:fs';

/**
 * CPU time (user + system, ms) spent so far by the server's processes, read from /proc (Linux):
 * the node processes under `serverPid` and the PostgreSQL cluster whose postmaster serves
 * `dataDir` (pg_ctl detaches it, so it is found by its -D argument). Divided by the requests a
 * phase served, it gives the cost of one request, which a machine busy with other work changes
 * far less than it changes requests per second. Zeros where /proc is missing.
 *
 * A process that has ended (a PostgreSQL backend whose connection closed, a replaced web worker) is
 * no longer in /proc: its CPU time went into its parent's cutime and cstime when the parent reaped
 * it (proc(5)). So each process counts its own time plus that of its reaped children; without
 * them, the figure fell whenever a connection closed during a phase.
 */
export function serverCpuMs(serverPid: number, dataDir: string): { node: number; postgres: number } {
  if (!fs.existsSync('/proc/self/stat')) return { node: 0, postgres: 0 };
  const processes = new Map<number, { parent: number; ticks: number; command: string }>();
  for (const entry of fs.readdirSync('/proc')) {
    if (!/^\d+$/.test(entry)) continue;
    try {
      const stat = fs.readFileSync(`/proc/${entry}/stat`, 'utf8');
      // Fields after the command name "(…)": state ppid … utime (14th field) stime (15th), then
      // cutime and cstime (16th, 17th): the time of its children that ended and were waited for.
      const fields = stat.slice(stat.lastIndexOf(')') + 2).split(' ');
      const command = fs.readFileSync(`/proc/${entry}/cmdline`, 'utf8').replaceAll('\0', ' ');
      processes.set(Number(entry), {
        parent: Number(fields[1]),
        ticks: Number(fields[11]) + Number(fields[12]) + Number(fields[13]) + Number(fields[14]),
        command,
      });
    } catch {
      // The process ended while being read.
    }
  }
  const ticksPerMs = 100 / 1000; // USER_HZ is 100 on Linux (getconf CLK_TCK)
  const treeTicks = (root: number): number => {
    let sum = processes.get(root)?.ticks ?? 0;
    for (const [pid, info] of processes) if (info.parent === root) sum += treeTicks(pid);
    return sum;
  };
  const postmaster = [...processes].find(
    ([, info]) => /postgres\s+-D\s/.test(info.command) && info.command.includes(dataDir),
  )?.[0];
  return {
    node: treeTicks(serverPid) / ticksPerMs,
    postgres: postmaster === undefined ? 0 : treeTicks(postmaster) / ticksPerMs,
  };
}
