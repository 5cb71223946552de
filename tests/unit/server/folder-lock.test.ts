import { spawn } from 'node:child_process';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { afterEach, describe, expect, it } from 'vitest';
import { acquireFolderLock } from '../../../server/db/folder-lock';

const folders: string[] = [];
const lockIn = () => {
  const folder = fs.mkdtempSync(path.join(os.tmpdir(), 'halflight-lock-'));
  folders.push(folder);
  return path.join(folder, 'halflight.lock');
};
afterEach(() => folders.splice(0).forEach((folder) => fs.rmSync(folder, { recursive: true, force: true })));

describe('acquireFolderLock', () => {
  it('when another live process holds the folder, then a second start is refused with a clear message', async () => {
    const lockFile = lockIn();
    const other = spawn(process.execPath, ['-e', 'setTimeout(() => {}, 10000)']);
    try {
      fs.writeFileSync(lockFile, String(other.pid));
      expect(() => acquireFolderLock(lockFile)).toThrowError(
        new RegExp(`Another Halflight process \\(pid ${other.pid}\\) is already using`),
      );
      expect(fs.readFileSync(lockFile, 'utf8')).toBe(String(other.pid));
    } finally {
      other.kill();
    }
  });

  it('when the holder died, then the stale lock is taken over and released again', async () => {
    const lockFile = lockIn();
    const gone = spawn(process.execPath, ['-e', '0']);
    await new Promise((resolve) => gone.on('exit', resolve));
    fs.writeFileSync(lockFile, String(gone.pid));
    const lock = acquireFolderLock(lockFile);
    expect(JSON.parse(fs.readFileSync(lockFile, 'utf8'))).toMatchObject({ pid: process.pid });
    lock.release();
    expect(fs.existsSync(lockFile)).toBe(false);
  });
});
