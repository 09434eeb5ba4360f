import { createServer } from 'node:http';
import type { Logger } from 'pino';
import { createApplication } from './app';
import { loadConfigOrExit, type Config } from './config';
import { openDatabase } from './db';
import { migrate } from './db/migrate';
import { seedDemo } from './db/seed';
import { log } from './log';
import { createRealtime } from './realtime';
import { startLocalFakes } from './services/fakes';

/** Opens the database, migrates, seeds the demo on an empty database, and listens. */
export async function startServer(givenConfig: Config) {
  process.setSourceMapsEnabled(givenConfig.sourceMaps);
  // Mail and payments not configured for real go to local fakes (development and tests).
  const { config, fakes } = await startLocalFakes(givenConfig);
  const sequelize = await openDatabase(config.databaseUrl);
  await migrate(sequelize);
  const seeded = config.seedDemo && (await seedDemo(config.bcryptRounds));
  const application = createApplication({ config, sequelize });
  const { logger } = application;
  if (seeded) logger.info('Seeded the Harbor Lane demo accounts.');
  const httpServer = createServer(application.app);
  const io = createRealtime(httpServer, application);
  const registry = application.registry;
  const restored = await registry.restoreOpenTables((tableId, err) =>
    application.logger.error({ tableId, error: (err as Error).message }, 'a table could not be restored from its log; it stays closed until it is mended'),
  );
  if (restored) logger.info({ restored }, `Restored ${restored} table(s) with an exchange under way.`);
  // Finished and idle tables leave memory; they are read back from the database when next asked for.
  registry.sweepEvery(Math.max(250, Math.min(30_000, config.tableIdleMs / 2)), config.tableIdleMs, (err) => application.logger.error({ error: (err as Error).message }, 'sweeping idle tables failed'));
  await new Promise<void>((resolve) => httpServer.listen(config.port, resolve));
  const address = httpServer.address();
  const port = typeof address === 'object' && address ? address.port : config.port;
  fakes.listening(port);

  /** A clean stop: readiness off, no new connections, every queued action finished and stored, then the database closed. */
  async function close() {
    application.drain();
    httpServer.close();
    await io.drain(config.shutdownGraceMs);
    await registry.closeAll();
    await io.close();
    await io.closePeers();
    await application.close();
    await fakes.close();
    await sequelize.close();
  }
  return { httpServer, io, registry, sequelize, port, close, fakes, config, logger };
}

/**
 * The process's own lines (ready, could not start, did not close cleanly, unhandled rejection) are
 * written whatever LOG_LEVEL says: a supervisor, and every test that starts Rackside as a process,
 * waits for "ready on", and a process that stops should say why.
 */
function lifeLog(logger: Logger): Logger {
  return logger.isLevelEnabled('info') ? logger : logger.child({}, { level: 'info' });
}

const reasonText = (reason: unknown) => (reason instanceof Error ? reason.message : String(reason));

/** A stop after an unhandled rejection gets this long to close cleanly before the process exits anyway. */
const FAILED_CLOSE_DEADLINE_MS = 10_000;

/**
 * Starts Rackside and closes it cleanly on SIGTERM or SIGINT. An unhandled rejection leaves the
 * process in a state nobody knows: it is logged, and Rackside closes and exits with 1 so that its
 * supervisor starts it afresh (every acked action is already stored).
 */
export function serve(config: Config) {
  let running: Awaited<ReturnType<typeof startServer>> | null = null;
  let closing: Promise<void> | null = null;
  let exitCode: number | null = null;
  // A Rackside process logs at LOG_LEVEL, or info. server/log.ts keeps the log silent under the test
  // runner for the servers tests start inside themselves; a process a test starts is read by its output.
  log.level = process.env.LOG_LEVEL || 'info';
  // The application's logger is this same `log` (startServer gives it no other).
  const logger = lifeLog(log);

  function stop(code: number) {
    exitCode = Math.max(exitCode ?? 0, code);
    if (code !== 0) setTimeout(() => process.exit(exitCode ?? code), FAILED_CLOSE_DEADLINE_MS).unref();
    // A stop asked for during startup waits for the server to be up, then closes it.
    if (!running) return;
    closing ??= running
      .close()
      .catch((err) => {
        logger.error({ err }, 'Rackside did not close cleanly.');
        exitCode = Math.max(exitCode ?? 0, 1);
      })
      .finally(() => process.exit(exitCode ?? 0));
  }
  // Kept, not `once`: from a terminal both the shell and npm pass Ctrl-C on, and the second signal
  // must not cut the first one's close short.
  process.on('SIGTERM', () => stop(0));
  process.on('SIGINT', () => stop(0));
  process.on('unhandledRejection', (reason) => {
    // The reason is in the message too, so that it reads in order on one line.
    logger.fatal({ err: reason }, `Unhandled rejection (${reasonText(reason)}): Rackside stops so that its supervisor can start it afresh.`);
    stop(1);
  });

  return startServer(config)
    .then((server) => {
      running = server;
      logger.info({ port: server.port }, `Rackside is ready on http://localhost:${server.port} (process ${process.pid})`);
      if (exitCode !== null) stop(exitCode);
      return server;
    })
    .catch((err) => {
      logger.fatal({ err }, 'Rackside could not start.');
      process.exit(1);
    });
}

const isMain = process.argv[1] && import.meta.url === new URL(`file://${process.argv[1]}`).href;
if (isMain) void serve(loadConfigOrExit());
