import { createServer } from 'node:http';
import { createApplication } from './app';
import { loadConfig, type Config } from './config';
import { openDatabase } from './db';
import { migrate } from './db/migrate';
import { seedDemo } from './db/seed';
import { attachRealtime } from './realtime';
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
  const registry = application.registry;
  const restored = await registry.restoreOpenTables();
  if (restored) console.log(`Restored ${restored} table(s) with an exchange under way.`);
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

/** Starts Rackside and closes it cleanly on SIGTERM or SIGINT. */
export function serve(config: Config) {
  startServer(config)
    .then(({ port, close }) => {
      console.log(`Rackside is ready on http://localhost:${port}`);
      const stop = () => {
        close().finally(() => process.exit(0));
      };
      process.once('SIGTERM', stop);
      process.once('SIGINT', stop);
      // A failure in a connection to Redis or the database (say, while one of them restarts) is
      // logged and lived through: the clients retry, and nothing acked depends on it.
      process.on('unhandledRejection', (reason) => console.error('Unhandled rejection (Rackside keeps running):', reason));
    })
    .catch((err) => {
      console.error('Rackside could not start:', err);
      process.exit(1);
    });
}

const isMain = process.argv[1] && import.meta.url === new URL(`file://${process.argv[1]}`).href;
if (isMain) serve(loadConfig());
