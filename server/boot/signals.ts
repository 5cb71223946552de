import type { Logger } from 'pino';

/**
 * Runs `stop` exactly once, on the first SIGINT or SIGTERM or on an error nothing caught, then
 * exits. Signals that arrive while stopping (a second Ctrl-C, or npm forwarding the first one)
 * are noted and otherwise ignored: the shutdown under way always ends with the built-in
 * PostgreSQL stopped, so no signal can leave it running.
 */
export function stopOnSignals(stop: () => Promise<void>, logger: Logger): (exitCode: number) => Promise<void> {
  let stopping: Promise<void> | undefined;
  const stopOnce = (exitCode: number): Promise<void> => {
    stopping ??= stop()
      .catch((error: unknown) => {
        logger.error({ err: error }, 'stopping did not finish cleanly');
        exitCode = exitCode || 1;
      })
      .finally(() => process.exit(exitCode));
    return stopping;
  };
  const onSignal = (signal: NodeJS.Signals) => {
    if (stopping) {
      logger.warn(`${signal} again: already stopping; the database is stopped before Halflight exits.`);
      return;
    }
    logger.info(`${signal}: stopping Halflight (finishing requests in progress) ...`);
    void stopOnce(0);
  };
  process.on('SIGINT', onSignal);
  process.on('SIGTERM', onSignal);
  process.on('uncaughtException', (error) => {
    logger.fatal({ err: error }, 'uncaught error; stopping');
    void stopOnce(1);
  });
  process.on('unhandledRejection', (error) => {
    logger.fatal({ err: error }, 'unhandled promise rejection; stopping');
    void stopOnce(1);
  });
  return stopOnce;
}
