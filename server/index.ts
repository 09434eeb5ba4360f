import { createServer } from 'node:http';
import { createApplication } from './app';
import { loadConfigOrExit, type Config } from './config';
import { openDatabase } from './db';
import { migrate } from './db/migrate';
import { seedDemo } from './db/seed';
import { attachRealtime } from './realtime';
import { bindUserSockets } from './realtime/sessions';
import { startLocalFakes } from './services/fakes';

/** Opens the database, migrates, seeds the demo on an empty database, and listens. */
export async function startServer(givenConfig: Config) {
  process.setSourceMapsEnabled(givenConfig.sourceMaps);
  // Mail and payments not configured for real go to local fakes (development and tests).
  const { config, fakes } = await startLocalFakes(givenConfig);
  const sequelize = await openDatabase(config.databaseUrl);
  await migrate(sequelize);
  if (config.seedDemo && (await seedDemo(config.bcryptRounds))) console.log('Seeded the Harbor Lane demo accounts.');
  const application = createApplication({ config, sequelize });
  const httpServer = createServer(application.app);
  const io = attachRealtime(httpServer, application);
  bindUserSockets(io, application);
  const registry = application.registry;
  const restored = await registry.restoreOpenTables((tableId, err) =>
    application.logger.error({ tableId, error: (err as Error).message }, 'a table could not be restored from its log; it stays closed until it is mended'),
  );
  if (restored) console.log(`Restored ${restored} table(s) with an exchange under way.`);
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
  return { httpServer, io, registry, sequelize, port, close, fakes, config };
}

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

  function stop(code: number) {
    exitCode = Math.max(exitCode ?? 0, code);
    if (code !== 0) setTimeout(() => process.exit(exitCode ?? code), FAILED_CLOSE_DEADLINE_MS).unref();
    // A stop asked for during startup waits for the server to be up, then closes it.
    if (!running) return;
    closing ??= running
      .close()
      .catch((err) => {
        console.error('Rackside did not close cleanly:', err);
        exitCode = Math.max(exitCode ?? 0, 1);
      })
      .finally(() => process.exit(exitCode ?? 0));
  }
  // Kept, not `once`: from a terminal both the shell and npm pass Ctrl-C on, and the second signal
  // must not cut the first one's close short.
  process.on('SIGTERM', () => stop(0));
  process.on('SIGINT', () => stop(0));
  process.on('unhandledRejection', (reason) => {
    console.error('Unhandled rejection: Rackside stops so that its supervisor can start it afresh.', reason);
    stop(1);
  });

  return startServer(config)
    .then((server) => {
      running = server;
      console.log(`Rackside is ready on http://localhost:${server.port}`);
      if (exitCode !== null) stop(exitCode);
      return server;
    })
    .catch((err) => {
      console.error('Rackside could not start:', err);
      process.exit(1);
    });
}

const isMain = process.argv[1] && import.meta.url === new URL(`file://${process.argv[1]}`).href;
if (isMain) void serve(loadConfigOrExit());
