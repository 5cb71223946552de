import { Writable } from 'node:stream';
import { pino } from 'pino';

/** A pino logger at `level` and the lines it has written, parsed, for a test to read. */
export function keptLogLines<Line>(level: string) {
  const lines: Line[] = [];
  const sink = new Writable({
    write(chunk: Buffer, _encoding, done) {
      lines.push(JSON.parse(chunk.toString('utf8')) as Line);
      done();
    },
  });
  return { lines, logger: pino({ level }, sink) };
}

/**
 * The lines that `keep` picks, once at least `expected` of them are there. A request's line is written
 * at the response's 'close', which can come after the client has read the answer (later still on a
 * busy machine), and a line of a request made before `lines` was emptied can arrive after it. Bounded
 * at 10 s; one more turn of the event loop lets a line too many show up.
 */
export async function linesWhen<Line>(lines: Line[], keep: (line: Line) => boolean, expected = 1): Promise<Line[]> {
  for (let tries = 0; tries < 500 && lines.filter(keep).length < expected; tries++) {
    await new Promise((resolve) => setTimeout(resolve, 20));
  }
  await new Promise((resolve) => setImmediate(resolve));
  return lines.filter(keep);
}
