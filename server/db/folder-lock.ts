import fs from 'node:fs';

export interface FolderLock {
  release(): void;
}

function isAlive(pid: number): boolean {
  try {
    process.kill(pid, 0);
    return true;
  } catch (error) {
    return (error as NodeJS.ErrnoException).code === 'EPERM';
  }
}

/**
 * Takes an exclusive lock file holding our pid, so two starts on one data folder cannot both
 * drive the same cluster. A lock left by a dead process is taken over.
 */
export function acquireFolderLock(lockFile: string): FolderLock {
  for (let attempt = 0; attempt < 2; attempt++) {
    try {
      fs.writeFileSync(lockFile, String(process.pid), { flag: 'wx', mode: 0o600 });
      let held = true;
      return {
        release() {
          if (held && fs.existsSync(lockFile)) fs.rmSync(lockFile, { force: true });
          held = false;
        },
      };
    } catch (error) {
      if ((error as NodeJS.ErrnoException).code !== 'EEXIST') throw error;
      const owner = Number(fs.readFileSync(lockFile, 'utf8').trim());
      if (Number.isInteger(owner) && owner > 0 && owner !== process.pid && isAlive(owner)) {
        throw new Error(
          `Another Halflight process (pid ${owner}) is already using the database folder ` +
            `${lockFile.replace(/\/[^/]+$/, '')}. Stop it first (Ctrl-C in its terminal), ` +
            'or point HALFLIGHT_DATA_DIR at another folder.',
        );
      }
      fs.rmSync(lockFile, { force: true });
    }
  }
  throw new Error(`Could not take the lock ${lockFile}.`);
}
