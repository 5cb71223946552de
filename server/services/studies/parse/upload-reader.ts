import fs from 'node:fs';
import { Piscina } from 'piscina';
import type { UploadMapping } from '@shared/schemas/study-uploads';
import { unavailable } from '../../../lib/app-error';
import type { DecayReadOutcome, DecayReadTask } from '../../decays/read-decays';
import type { AbsorptionTitrationOutcome, AbsorptionTitrationTask } from '../../mechanism/read-absorption-titration';
import type { SpectrumMatrixOutcome, SpectrumMatrixTask } from '../../mechanism/read-spectrum-matrix';
import type { StudyReading } from './propose-mapping';
import type { ReadOutcome, ReadTask } from './read-and-map';
import { DEFAULT_UPLOAD_LIMITS, limitMessage, type UploadLimits } from './upload-limits';

export interface UploadReader {
  readonly limits: UploadLimits;
  /** Reads the bytes and applies the mapping (or proposes one) off the main thread, within the limits. */
  read(fileName: string, bytes: Uint8Array, mapping: UploadMapping | null, study?: StudyReading): Promise<ReadOutcome>;
  /** Reads and fits a decay set in the same threads, under the same limits. */
  readDecays(task: Omit<DecayReadTask, 'limits'>): Promise<DecayReadOutcome>;
  /** Reads and analyses a spectrum matrix (wavelength-resolved K_SV) in the same threads. */
  readSpectrumMatrix(task: Omit<SpectrumMatrixTask, 'limits'>): Promise<SpectrumMatrixOutcome>;
  /** Reads and analyses an absorption titration (ground-state complex evidence) in the same threads. */
  readAbsorptionTitration(task: Omit<AbsorptionTitrationTask, 'limits'>): Promise<AbsorptionTitrationOutcome>;
  /** Reading threads running or starting now (for tests and diagnostics). */
  readonly threads: number;
  close(): Promise<void>;
}

export interface UploadReaderOptions {
  limits?: Partial<UploadLimits>;
  /** reading threads, all started with the reader (default 2: the machine's web process keeps a core) */
  threads?: number;
  /** files waiting for a thread before new ones get 503 */
  queue?: number;
}

/**
 * From source (tsx, vitest) the thread loads the TypeScript file and needs tsx's loader;
 * compiled, the .js beside this module, or, when the server is bundled into one entry file,
 * the worker's own entry under the same folder layout as the source.
 */
function findWorkerFile(): URL {
  const here = import.meta.url;
  const candidates = here.endsWith('.ts')
    ? [new URL('./read-upload.worker.ts', here)]
    : [new URL('./read-upload.worker.js', here), new URL('./services/studies/parse/read-upload.worker.js', here)];
  return candidates.find((candidate) => fs.existsSync(candidate)) ?? candidates[0]!;
}
const workerFile = findWorkerFile();
/** A full reading queue empties within seconds (each file has at most `seconds` to be read). */
const uploadsBusyRetryAfterSeconds = 10;
const threadArguments = () =>
  workerFile.pathname.endsWith('.ts') && !process.execArgv.some((argument) => argument.includes('tsx'))
    ? [...process.execArgv, '--import', 'tsx']
    : process.execArgv;

/**
 * A small pool of worker threads that read untrusted files: a file that takes seconds or
 * hundreds of megabytes costs a thread, never the event loop that answers everyone else. Each
 * thread has a heap cap (limits.memoryMb) and each file a time limit (limits.seconds); a thread
 * that runs over either is ended and replaced, and the file gets an outcome naming the limit.
 */
export function createUploadReader(options: UploadReaderOptions = {}): UploadReader {
  const limits: UploadLimits = { ...DEFAULT_UPLOAD_LIMITS, ...options.limits };
  const threads = options.threads ?? 2;
  const pool = new Piscina<
    ReadTask | DecayReadTask | SpectrumMatrixTask | AbsorptionTitrationTask,
    ReadOutcome | DecayReadOutcome | SpectrumMatrixOutcome | AbsorptionTitrationOutcome
  >({
    filename: workerFile.href,
    // Every thread is started with the reader and kept, so no start-up falls inside a request. With
    // fewer at first, a burst of files made the pool start another thread and hand it a waiting file
    // before that thread had loaded the reading code: bench:load's first burst of uploads (10 at
    // once per web process, reads saturating both cores) had one upload per process wait 0.9-1.2 s
    // for it, the others of the burst at most 160 ms. The cost: an idle thread with the reading code
    // loaded holds about 40 MB of resident memory (99.5 -> 139.4 MB for a second thread, node 20).
    minThreads: threads,
    maxThreads: threads,
    maxQueue: options.queue ?? 16,
    execArgv: threadArguments(),
    resourceLimits: { maxOldGenerationSizeMb: limits.memoryMb, maxYoungGenerationSizeMb: 32 },
  });
  /** Runs one task in a thread; time and memory overruns become outcomes naming the limit. */
  async function run<T, O>(task: T, name?: string): Promise<O | Extract<ReadOutcome, { kind: 'limit' }>> {
    try {
      return (await pool.run(task as ReadTask | DecayReadTask | SpectrumMatrixTask | AbsorptionTitrationTask, {
        signal: AbortSignal.timeout(limits.seconds * 1000),
        ...(name ? { name } : {}),
      })) as O;
    } catch (error) {
      const { name: errorName, code, message } = error as { name?: string; code?: string; message?: string };
      if (errorName === 'AbortError' || errorName === 'TimeoutError')
        return { kind: 'limit', limit: 'seconds', message: limitMessage.seconds(limits) };
      if (code === 'ERR_WORKER_OUT_OF_MEMORY')
        return { kind: 'limit', limit: 'memoryMb', message: limitMessage.memoryMb(limits) };
      if (message?.includes('queue is at limit'))
        throw unavailable(
          'uploads_busy',
          'Halflight is reading many files just now; nothing was kept. Send the file again in a few seconds.',
          uploadsBusyRetryAfterSeconds,
        );
      throw error;
    }
  }
  return {
    limits,
    get threads() {
      return pool.threads.length;
    },
    read: (fileName, bytes, mapping, study) => run<ReadTask, ReadOutcome>({ fileName, bytes, mapping, limits, study }),
    readDecays: (task) => run<DecayReadTask, DecayReadOutcome>({ ...task, limits }, 'readDecays'),
    readSpectrumMatrix: (task) =>
      run<SpectrumMatrixTask, SpectrumMatrixOutcome>({ ...task, limits }, 'readSpectrumMatrix'),
    readAbsorptionTitration: (task) =>
      run<AbsorptionTitrationTask, AbsorptionTitrationOutcome>({ ...task, limits }, 'readAbsorptionTitration'),
    close: () => pool.destroy(),
  };
}
