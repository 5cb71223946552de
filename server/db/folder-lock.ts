import { spawnSync } from 'node:child_process';
import fs from 'node:fs';

export interface FolderLock {
  release(): void;
}

export interface LockOwner {
  pid: number;
  /** When the owner process started (ms since 1970); absent in lock files of older versions. */
  startedAt?: number;
}

// Start times read from /proc have a resolution of one clock tick and a boot time rounded to the
// second, so two readings of the same process may differ by about a second.
const sameProcessToleranceMs = 2_000;

function isAlive(pid: number): boolean {
  try {
    process.kill(pid, 0);
    return true;
  } catch (error) {
    return (error as NodeJS.ErrnoException).code === 'EPERM';
  }
}

let clockTicks: number | undefined;

/**
 * When a process started, in ms since 1970, or null when this system cannot tell. Linux: field 22
 * of /proc/<pid>/stat (clock ticks after boot) plus the boot time in /proc/stat (proc(5)); other
 * systems: `ps -o lstart=`.
 */
export function processStartTime(pid: number): number | null {
  try {
    const stat = fs.readFileSync(`/proc/${pid}/stat`, 'utf8');
    // The command name (field 2) may hold spaces; fields from the third on follow the last ')'.
    const ticks = Number(stat.slice(stat.lastIndexOf(')') + 2).split(' ')[19]);
    const bootSeconds = Number(/^btime (\d+)$/m.exec(fs.readFileSync('/proc/stat', 'utf8'))?.[1]);
    clockTicks ??= Number(spawnSync('getconf', ['CLK_TCK'], { encoding: 'utf8' }).stdout.trim()) || 100;
    if (Number.isFinite(ticks) && Number.isFinite(bootSeconds)) return bootSeconds * 1000 + (ticks * 1000) / clockTicks;
  } catch {
    // No /proc here (macOS, BSD): ask ps.
  }
  const ps = spawnSync('ps', ['-o', 'lstart=', '-p', String(pid)], { encoding: 'utf8' });
  const started = ps.status === 0 ? Date.parse(ps.stdout.trim()) : NaN;
  return Number.isFinite(started) ? started : null;
}

function readOwner(lockFile: string): LockOwner | null {
  const text = fs.readFileSync(lockFile, 'utf8').trim();
  if (/^\d+$/.test(text)) return { pid: Number(text) };
  try {
    const parsed = JSON.parse(text) as Partial<LockOwner>;
    return Number.isInteger(parsed.pid) && parsed.pid! > 0 ? (parsed as LockOwner) : null;
  } catch {
    return null;
  }
}

/**
 * Whether the lock's owner still runs. A live pid is not enough: after a reboot or in a container
 * the pid may belong to another process now, so the process must also have started when the
 * lock says (or, for a lock file without that, before the file was written).
 */
function ownerRuns(owner: LockOwner, lockFile: string): boolean {
  if (!isAlive(owner.pid)) return false;
  const started = processStartTime(owner.pid);
  if (started === null) return true;
  if (owner.startedAt !== undefined) return Math.abs(started - owner.startedAt) < sameProcessToleranceMs;
  return started <= fs.statSync(lockFile).mtimeMs + sameProcessToleranceMs;
}

/** The process holding the lock file that still runs, or null (no lock file, or a stale one). */
export function folderLockOwner(lockFile: string): LockOwner | null {
  if (!fs.existsSync(lockFile)) return null;
  const owner = readOwner(lockFile);
  return owner && ownerRuns(owner, lockFile) ? owner : null;
}

/**
 * Takes an exclusive lock file holding our pid and start time, so two starts on one data folder
 * cannot both drive the same cluster. A lock whose owner no longer runs is taken over.
 */
export function acquireFolderLock(lockFile: string): FolderLock {
  const me: LockOwner = { pid: process.pid, startedAt: processStartTime(process.pid) ?? undefined };
  for (let attempt = 0; attempt < 2; attempt++) {
    try {
      fs.writeFileSync(lockFile, JSON.stringify(me), { flag: 'wx', mode: 0o600 });
      let held = true;
      return {
        release() {
          if (held && fs.existsSync(lockFile)) fs.rmSync(lockFile, { force: true });
          held = false;
        },
      };
    } catch (error) {
      if ((error as NodeJS.ErrnoException).code !== 'EEXIST') throw error;
      const owner = readOwner(lockFile);
      if (owner && ownerRuns(owner, lockFile)) {
        throw new Error(
          `Another Halflight process (pid ${owner.pid}) is already using the database folder ` +
            `${lockFile.replace(/\/[^/]+$/, '')}. Stop it first (Ctrl-C in its terminal), ` +
            'or point HALFLIGHT_DATA_DIR at another folder.',
        );
      }
      fs.rmSync(lockFile, { force: true });
    }
  }
  throw new Error(`Could not take the lock ${lockFile}.`);
}
