import pg from 'pg';

/** What a sampled backend was doing: its statement's first words and what it waited on. */
const statementKind = (query: string) =>
  query
    .replace(/\s+/g, ' ')
    .trim()
    .replace(/^(\w+(?: INTO| FROM)? "?\w+"?).*$/i, '$1')
    .slice(0, 40);

/**
 * Samples pg_stat_activity every `everyMs` while a phase runs (BENCH_LOAD_WAITS=1 in bench:load):
 * for each active backend of the app, the statement it runs and what it waits on (a lock, the
 * client, nothing: on the CPU). Samples are proportional to the time spent, so the printed shares
 * say where the database side of a phase's time goes, and which statements wait on locks.
 * Statements that only read are left out unless `reads` (the read mix would drown the writes).
 */
export function sampleWaits(databaseUrl: string, options: { everyMs?: number; reads?: boolean } = {}) {
  const everyMs = options.everyMs ?? 10;
  const client = new pg.Client({ connectionString: databaseUrl });
  const counts = new Map<string, number>();
  let samples = 0;
  let stopped = false;
  const running = (async () => {
    await client.connect();
    while (!stopped) {
      const { rows } = await client.query<{ query: string; state: string; wait: string | null; xact: boolean }>(
        `SELECT query, state, wait_event_type || ':' || wait_event AS wait, xact_start IS NOT NULL AS xact
           FROM pg_stat_activity
          WHERE backend_type = 'client backend' AND pid <> pg_backend_pid() AND datname = current_database()
            AND state <> 'idle'`,
      );
      samples += 1;
      for (const row of rows) {
        const kind = statementKind(row.query);
        if (!options.reads && /^SELECT/i.test(kind) && row.state === 'active' && !row.xact) continue;
        // "idle in transaction": the transaction waits for the app's next statement.
        const what = row.state === 'active' ? (row.wait ?? 'CPU') : row.state;
        const key = `${what.padEnd(28)} ${kind}`;
        counts.set(key, (counts.get(key) ?? 0) + 1);
      }
      await new Promise((resolve) => setTimeout(resolve, everyMs));
    }
    await client.end();
  })();
  return {
    /** Stops sampling and gives the lines to print: backends per sample (average) by wait and statement. */
    async stop(): Promise<string[]> {
      stopped = true;
      await running;
      return [...counts]
        .sort((a, b) => b[1] - a[1])
        .slice(0, 25)
        .map(([key, n]) => `${(n / Math.max(samples, 1)).toFixed(3).padStart(7)}  ${key}`);
    },
  };
}
