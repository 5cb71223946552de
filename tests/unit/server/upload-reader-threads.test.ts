import { afterEach, describe, expect, it } from 'vitest';
import { createUploadReader, type UploadReader } from '../../../server/services/studies/parse/upload-reader';

/** A small two-column series (invented numbers, the shape an instrument export has). */
const series = (seed: number) =>
  Buffer.from(
    ['quencher (mM),intensity', ...Array.from({ length: 6 }, (_, i) => `${i * 0.5},${50_000 + seed - i * 900}`)].join(
      '\n',
    ),
  );

let reader: UploadReader | undefined;
afterEach(async () => {
  await reader?.close();
  reader = undefined;
});

describe('createUploadReader', () => {
  it('when it is made, then every reading thread is started, before any file arrives', () => {
    reader = createUploadReader({ threads: 2 });
    expect(reader.threads).toBe(2);
  });

  it('when several files arrive at once, then no reading thread is started while they wait', async () => {
    // A thread started for a burst loads the reading code first (hundreds of ms on a busy machine),
    // and the pool hands it a waiting file before it is ready: that file's request waits for the start.
    reader = createUploadReader({ threads: 2 });
    const before = reader.threads;
    const outcomes = await Promise.all(
      Array.from({ length: 6 }, (_, i) => reader!.read(`series-${i}.csv`, series(i), null)),
    );
    expect(outcomes.map((outcome) => outcome.kind)).toEqual(Array(6).fill('read'));
    expect(reader.threads).toBe(before);
  });

  it('when asked for one thread, then it keeps exactly one', async () => {
    reader = createUploadReader({ threads: 1 });
    expect(reader.threads).toBe(1);
    await Promise.all([0, 1, 2].map((i) => reader!.read(`series-${i}.csv`, series(i), null)));
    expect(reader.threads).toBe(1);
  });
});
