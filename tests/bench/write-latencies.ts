/**
 * Each write of bench:load's writes phase timed on its own, from the moment autocannon builds the
 * request (setupRequest, just before it is written to the socket) to its answer (onResponse).
 *
 * autocannon's own figure for a phase asked at a fixed rate is not a plain percentile: with a rate
 * it records each latency with `recordValueWithExpectedInterval(ms, Math.ceil(1 / rate))`, where
 * `rate` is the connection's requests per second (1 here), so a write of L ms is recorded once and
 * again at L-1, L-2, ... 1 ms (autocannon 9.0.0, lib/run.js, onResponse). A write's weight grows
 * with its own time, and a handful of slow writes set its p99. The figures here count each write
 * once, split by kind and by when in the phase they were sent.
 */
export type WriteKind = 'create' | 'points' | 'upload';
type Timed = { kind: WriteKind; status: number; ms: number; sentAt: number };

const percentile = (sorted: number[], p: number) =>
  sorted.length === 0 ? NaN : sorted[Math.min(sorted.length - 1, Math.ceil((p / 100) * sorted.length) - 1)]!;

const summary = (values: number[]) => {
  const sorted = [...values].sort((a, b) => a - b);
  const cell = (value: number) => (Number.isNaN(value) ? '-' : value.toFixed(0)).padStart(7);
  return `${String(sorted.length).padStart(5)} ${cell(percentile(sorted, 50))} ${cell(percentile(sorted, 90))} ${cell(percentile(sorted, 99))} ${cell(sorted.at(-1) ?? NaN)}`;
};

export function writeLatencies(options: { windowSeconds?: number } = {}) {
  const windowSeconds = options.windowSeconds ?? 5;
  const timed: Timed[] = [];
  let firstSent: number | undefined;
  return {
    /** Call in setupRequest; keep the returned time in the connection's context. */
    sent(): number {
      const now = performance.now();
      firstSent ??= now;
      return now;
    },
    /** Call in onResponse with the time `sent` gave. */
    answered(kind: WriteKind, status: number, sentAt: number) {
      timed.push({ kind, status, ms: performance.now() - sentAt, sentAt });
    },
    /** Lines to print: per kind, per window of the phase, and the slowest writes. */
    lines(): string[] {
      const start = firstSent ?? 0;
      const header = `${'kind'.padEnd(24)} ${'n'.padStart(5)} ${'p50'.padStart(7)} ${'p90'.padStart(7)} ${'p99'.padStart(7)} ${'max'.padStart(7)}`;
      const out = ['\nEach write once (ms from sending to its answer, any status):', header];
      out.push(`${'all writes'.padEnd(24)} ${summary(timed.map((t) => t.ms))}`);
      for (const kind of ['create', 'points', 'upload'] as const)
        out.push(`${kind.padEnd(24)} ${summary(timed.filter((t) => t.kind === kind).map((t) => t.ms))}`);
      const last = Math.max(0, ...timed.map((t) => t.sentAt - start)) / 1000;
      for (let from = 0; from <= last; from += windowSeconds) {
        const inWindow = timed.filter(
          (t) => (t.sentAt - start) / 1000 >= from && (t.sentAt - start) / 1000 < from + windowSeconds,
        );
        out.push(`${`sent at ${from}-${from + windowSeconds} s`.padEnd(24)} ${summary(inWindow.map((t) => t.ms))}`);
      }
      const slowest = [...timed].sort((a, b) => b.ms - a.ms).slice(0, 10);
      out.push(
        `slowest: ${slowest.map((t) => `${t.kind} ${t.status} ${t.ms.toFixed(0)} ms at ${((t.sentAt - start) / 1000).toFixed(1)} s`).join('; ')}`,
      );
      return out;
    },
  };
}
