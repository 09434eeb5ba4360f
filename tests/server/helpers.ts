import request from 'supertest';
import { createApplication } from '../../server/app';
import { testConfig, type Config } from '../../server/config';
import { openDatabase } from '../../server/db';
import { migrate } from '../../server/db/migrate';
import { User, type Role } from '../../server/db/models';
import bcrypt from 'bcryptjs';
import { test } from 'vitest';

/** A fresh app on its own in-memory database. */
export async function makeApp(overrides: Partial<Config> = {}) {
  const config = testConfig(overrides);
  const sequelize = await openDatabase(config.databaseUrl);
  await migrate(sequelize);
  const application = createApplication({ config, sequelize });
  return {
    ...application,
    config,
    sequelize,
    async dispose() {
      await application.close();
      await sequelize.close();
    },
  };
}

export type TestApp = Awaited<ReturnType<typeof makeApp>>;

/** What an app test holds: every app it made or handed over, disposed after the test, newest first. */
export class AppKit {
  private readonly disposers: (() => Promise<unknown>)[] = [];

  /** A fresh app on its own in-memory database, disposed after the test. */
  async make(overrides: Partial<Config> = {}): Promise<TestApp> {
    return this.adopt(await makeApp(overrides));
  }

  /** Disposes (or closes) this after the test; returns it. */
  adopt<T extends { dispose(): Promise<unknown> } | { close(): unknown }>(app: T): T {
    this.disposers.push(async () => ('dispose' in app ? app.dispose() : app.close()));
    return app;
  }

  async close() {
    for (const dispose of this.disposers.splice(0).reverse()) await dispose();
  }
}

/** Tests with an app kit, `apps`: whatever a test makes through it is disposed when the test ends. */
export const appTest = test.extend(
  'apps',
  // eslint-disable-next-line no-empty-pattern -- vitest reads a fixture's dependencies from this pattern
  async ({}, { onCleanup }) => {
    const kit = new AppKit();
    onCleanup(() => kit.close());
    return kit;
  },
);

export async function createUser(email: string, role: Role = 'player', password = 'correct horse') {
  return User.create({ email, displayName: email.split('@')[0], role, passwordHash: await bcrypt.hash(password, 4) });
}

/** A supertest agent (it keeps cookies) signed in as the given user. */
export async function signedIn(app: TestApp['app'], email: string, password = 'correct horse') {
  const agent = request.agent(app);
  const res = await agent.post('/api/auth/login').send({ email, password });
  if (res.status !== 200) throw new Error(`sign-in failed: ${res.status} ${JSON.stringify(res.body)}`);
  return agent;
}

export function sessionCookie(res: request.Response): string | undefined {
  const raw = res.headers['set-cookie'] as unknown as string[] | undefined;
  return raw?.find((c) => c.startsWith('rackside.sid='));
}
