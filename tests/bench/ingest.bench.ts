/**
 * Ingest benchmark: `npm run bench:ingest`. Builds an invented ~10 MB spectrum-matrix CSV in
 * memory (tests/bench/ingest-data.ts), then in one run times (a) the path the upload routes
 * take through server/services/studies/study-upload.service.ts: receive (keep the bytes, parse,
 * propose a mapping, reduce), preview with that mapping and apply it (reduce by window
 * integration, fit, store; each reads the kept bytes again in a reading thread), against a throwaway
 * PostgreSQL (temporary folder, free port, the real migrations, as
 * tests/support/global-database.ts does; deleted afterwards), and (b) csv-parse alone on the same bytes with the options the reader passes it. Prints the
 * median of 5 runs of each and the ratio (issue 5 target: at most 2). Figures only, no asserts.
 * BENCH_INGEST_MB sets another file size (e.g. to compare a slower build on a smaller file).
 */
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { parse } from 'csv-parse/sync';
import { createStudySchema } from '../../shared/schemas/studies';
import { startEmbeddedPostgres } from '../../server/db/embedded-postgres';
import { migrateToLatest } from '../../server/db/migrator';
import { createSequelize } from '../../server/db/sequelize';
import type { LabContext } from '../../server/domain/lab-context';
import { initModels, Lab, Membership, User } from '../../server/models';
import { createRawFileStore } from '../../server/services/studies/files/raw-file-store';
import { createUploadReader } from '../../server/services/studies/parse/upload-reader';
import { applyUpload, previewUpload, receiveUpload } from '../../server/services/studies/study-upload.service';
import { createStudy, getStudyDetail } from '../../server/services/studies/study.service';
import { freePort } from '../support/free-port';
import { INVENTED_K_SV, spectrumMatrixCsv } from './ingest-data';

const RUNS = 5;
const TARGET_RATIO = 2; // issue 5, "Benchmark"
const SAMPLES = 200;
const targetBytes = Number(process.env.BENCH_INGEST_MB ?? 10) * 1024 * 1024;
const median = (values: number[]) => [...values].sort((a, b) => a - b)[Math.floor(values.length / 2)]!;
// The options server/services/studies/parse/read-text-table.ts passes for a comma-separated file.
const CSV_OPTIONS = {
  delimiter: ',',
  relax_column_count: true,
  skip_empty_lines: true,
  comment: '#',
  info: true,
  trim: true,
  relax_quotes: true,
} as const;

async function main() {
  const { bytes, rows } = spectrumMatrixCsv({ samples: SAMPLES, targetBytes });
  console.log(
    `Invented spectrum matrix: ${(bytes.length / 1024 / 1024).toFixed(2)} MB, ${rows} wavelengths x ${SAMPLES} spectra.`,
  );
  const dataRoot = fs.mkdtempSync(path.join(os.tmpdir(), 'halflight-bench-'));
  const database = await startEmbeddedPostgres({ dataRoot, port: await freePort(), database: 'halflight_bench' });
  const sequelize = createSequelize(database.url);
  try {
    await migrateToLatest(sequelize);
    initModels(sequelize);
    const labRecord = await Lab.create({ name: 'Ingest bench lab (invented)', slug: 'ingest-bench' });
    const user = await User.create({
      email: 'ingest-bench@example.invalid',
      name: 'Bench chemist',
      passwordHash: 'not-a-login',
    });
    const membership = await Membership.create({ labId: labRecord.id, userId: user.id, role: 'researcher' });
    const lab: LabContext = {
      id: labRecord.id,
      name: labRecord.name,
      isDemo: false,
      role: 'researcher',
      membershipId: membership.id,
    };
    const actor = { userId: user.id, ip: null };
    const settings = { solventId: 'acetonitrile', atmosphere: 'argon', degassingMethod: 'sparging', tau0: 1e-6 };
    const first = await createStudy(
      sequelize,
      lab,
      createStudySchema.parse({ ...settings, title: 'Bench 1', newEmitterName: 'HL-Ir-7', newQuencherName: 'HL-Q-3' }),
      actor,
    );
    const compounds = { emitterId: first.emitter.id, quencherId: first.quencher.id };

    const stages = {
      receive: [] as number[],
      preview: [] as number[],
      apply: [] as number[],
      total: [] as number[],
      csvParse: [] as number[],
    };
    let kSv: number | null | undefined;
    const services = {
      sequelize,
      uploadReader: createUploadReader(),
      files: createRawFileStore({ writeTo: 'database', s3: null }),
    };
    for (let run = 0; run < RUNS; run++) {
      // A fresh study per run: the same bytes twice in one study are refused as a duplicate.
      const study =
        run === 0
          ? first
          : await createStudy(
              sequelize,
              lab,
              createStudySchema.parse({ ...settings, ...compounds, title: `Bench ${run + 1}` }),
              actor,
            );
      const file = { originalname: 'bench-spectra.csv', mimetype: 'text/csv', buffer: bytes };
      // csv-parse first, so its garbage is collected during the service's time rather than its own.
      const tParse = performance.now();
      parse(bytes, CSV_OPTIONS);
      stages.csvParse.push(performance.now() - tParse);
      const t0 = performance.now();
      const received = await receiveUpload(services, lab, study.id, file, actor);
      const t1 = performance.now();
      await previewUpload(services, lab, study.id, received.upload.id, received.mapping!);
      const t2 = performance.now();
      await applyUpload(
        services,
        lab,
        study.id,
        received.upload.id,
        { version: study.version, mapping: received.mapping!, mode: 'replace' },
        actor,
      );
      const t3 = performance.now();
      stages.receive.push(t1 - t0);
      stages.preview.push(t2 - t1);
      stages.apply.push(t3 - t2);
      stages.total.push(t3 - t0);
      kSv = (await getStudyDetail(lab, study.id)).latestFit?.kSv;
    }
    const ms = (values: number[]) => `${median(values).toFixed(0).padStart(6)} ms`;
    console.log(`\nMedian of ${RUNS} runs:`);
    // Each step reads the kept bytes again in a reading thread (no table is cached, so any instance can serve the next step).
    console.log(`  upload service, receive (store bytes, parse, propose, reduce) ${ms(stages.receive)}`);
    console.log(`  upload service, preview (reduce with the proposed mapping)    ${ms(stages.preview)}`);
    console.log(`  upload service, apply (reduce, fit, store points and fit)     ${ms(stages.apply)}`);
    console.log(`  upload service, all three                                     ${ms(stages.total)}`);
    console.log(`  csv-parse alone on the same bytes                             ${ms(stages.csvParse)}`);
    const ratio = median(stages.total) / median(stages.csvParse);
    console.log(
      `\nRatio upload service / csv-parse: ${ratio.toFixed(2)} (target at most ${TARGET_RATIO}: ${ratio <= TARGET_RATIO ? 'met' : 'NOT met'}).`,
    );
    console.log(`Fitted K_SV ${kSv?.toFixed(1)} M^-1 (the invented data were built with ${INVENTED_K_SV} M^-1).`);
    await services.uploadReader.close();
  } finally {
    await sequelize.close();
    await database.stop();
    fs.rmSync(dataRoot, { recursive: true, force: true });
  }
}

await main();
