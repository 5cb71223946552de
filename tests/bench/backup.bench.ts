/**
 * Backup and restore benchmark: `npm run bench:backup`. Times `npm run backup` and
 * `npm run restore` as an operator runs them on the built-in database (createBackup and
 * restoreBackup of server/db/backup.ts; with Halflight stopped, so each time includes starting
 * and stopping the cluster, and a restore includes initdb of the new folder), first with the demo
 * data, then after adding 1,000 invented studies (10 points, one ~3 kB raw file and two audit
 * rows each). Prints the median of 3 runs, the backup size and the load average beside each.
 * Figures only, no asserts. BENCH_BACKUP_STUDIES sets another number of added studies.
 */
import crypto from 'node:crypto';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { loadConfig } from '../../server/config/env';
import { createBackup, restoreBackup } from '../../server/db/backup';
import { startEmbeddedPostgres } from '../../server/db/embedded-postgres';
import { migrateToLatest } from '../../server/db/migrator';
import { createSequelize } from '../../server/db/sequelize';
import { AuditEvent, initModels, Study, StudyPoint, StudyUpload } from '../../server/models';
import { seedDemoData } from '../../server/seed/demo';
import { freePort } from '../support/free-port';
import { seedBenchStudies } from './studies-list-data';

const RUNS = 3;
const ADDED_STUDIES = Number(process.env.BENCH_BACKUP_STUDIES ?? 1000);
const median = (values: number[]) => [...values].sort((a, b) => a - b)[Math.floor(values.length / 2)]!;
const load = () => `load ${os.loadavg()[0]!.toFixed(2)} on ${os.cpus().length} cores`;
const seconds = async (job: () => Promise<unknown>) => {
  const began = performance.now();
  await job();
  return (performance.now() - began) / 1000;
};

/** The demo data, and optionally `added` invented studies with points, a raw file and audit rows each. */
async function fill(dataRoot: string, port: number, added: number) {
  const database = await startEmbeddedPostgres({ dataRoot, port });
  const sequelize = createSequelize(database.url);
  try {
    await migrateToLatest(sequelize);
    initModels(sequelize);
    await seedDemoData(sequelize);
    if (!added) return;
    const { labId, ownerId } = await seedBenchStudies(sequelize, added, 0);
    const studies = await Study.findAll({ where: { labId }, attributes: ['id'] });
    for (let start = 0; start < studies.length; start += 200) {
      const chunk = studies.slice(start, start + 200);
      const files = chunk.map((study, i) => {
        const lines = ['[Q] (mM),intensity'];
        for (let p = 0; p < 120; p += 1)
          lines.push(`${(p * 0.05).toFixed(2)},${(1000 / (1 + 0.4 * p * 0.05)).toFixed(3)}`);
        const content = Buffer.from(`${lines.join('\n')}\n# invented bench file ${start + i}\n`);
        return {
          labId,
          studyId: study.id,
          fileName: `bench-${start + i}.csv`,
          mediaType: 'text/csv',
          size: content.length,
          sha256: crypto.createHash('sha256').update(content).digest('hex'),
          content,
          uploadedById: ownerId,
          parseStatus: 'applied' as const,
          parseReport: {},
        };
      });
      await StudyUpload.bulkCreate(files, { validate: false, hooks: false });
      await StudyPoint.bulkCreate(
        chunk.flatMap((study) =>
          Array.from({ length: 10 }, (_, position) => ({
            studyId: study.id,
            position,
            concentration: position * 1e-3,
            intensity: 1000 / (1 + 400 * position * 1e-3),
            excluded: false,
          })),
        ),
        { validate: false, hooks: false },
      );
      await AuditEvent.bulkCreate(
        chunk.flatMap((study) =>
          ['study.created', 'study.points_replaced'].map((action) => ({
            labId,
            actorId: ownerId,
            action,
            targetType: 'study',
            targetId: study.id,
            details: { bench: true },
          })),
        ),
        { validate: false, hooks: false },
      );
    }
  } finally {
    await sequelize.close();
    await database.stop();
  }
}

async function measure(label: string, dataRoot: string, port: number) {
  const backupDir = fs.mkdtempSync(path.join(os.tmpdir(), 'halflight-bench-backups-'));
  const config = loadConfig({ HALFLIGHT_DATA_DIR: dataRoot, HALFLIGHT_PG_PORT: String(port) });
  const backups: number[] = [];
  const restores: number[] = [];
  const loads: string[] = [];
  let file = '';
  let bytes = 0;
  let counts: Record<string, number> = {};
  try {
    for (let run = 0; run < RUNS; run += 1) {
      backups.push(
        await seconds(async () => {
          const made = await createBackup(config, { outDir: backupDir });
          ({ file, bytes } = made);
          counts = made.manifest.counts;
        }),
      );
      const target = fs.mkdtempSync(path.join(os.tmpdir(), 'halflight-bench-restore-'));
      const targetConfig = loadConfig({
        HALFLIGHT_DATA_DIR: target,
        HALFLIGHT_PG_PORT: String(await freePort()),
      });
      restores.push(await seconds(() => restoreBackup(targetConfig, file)));
      loads.push(load());
      fs.rmSync(target, { recursive: true, force: true });
    }
  } finally {
    fs.rmSync(backupDir, { recursive: true, force: true });
  }
  console.log(
    `${label}: ${counts.studies} studies, ${counts.uploads} files, ${counts.audit} audit rows; ` +
      `backup ${(bytes / 1e6).toFixed(2)} MB\n` +
      `  backup  median ${median(backups).toFixed(2)} s (runs ${backups.map((s) => s.toFixed(2)).join(', ')})\n` +
      `  restore median ${median(restores).toFixed(2)} s (runs ${restores.map((s) => s.toFixed(2)).join(', ')})\n` +
      `  ${loads.join('; ')}`,
  );
}

async function main() {
  const dataRoot = fs.mkdtempSync(path.join(os.tmpdir(), 'halflight-bench-backup-'));
  const port = await freePort();
  try {
    console.log(`Before: ${load()}. Built-in cluster, Halflight stopped (each time includes starting PostgreSQL).`);
    await fill(dataRoot, port, 0);
    await measure('Demo data', dataRoot, port);
    await fill(dataRoot, port, ADDED_STUDIES);
    await measure(`Demo data + ${ADDED_STUDIES} invented studies`, dataRoot, port);
  } finally {
    fs.rmSync(dataRoot, { recursive: true, force: true });
  }
}

await main();
