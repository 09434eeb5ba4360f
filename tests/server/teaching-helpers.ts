/** Shared pieces of the drill and pattern-list tests: teachers on a fresh app, a small valid list, uploads. */
import type request from 'supertest';
import { appTest, createUser, signedIn, type AppKit, type TestApp } from './helpers';

/** A valid pattern in Rackside's own format: 2 + 3 + 3 + 3 + 3 = 14 tiles. */
export const windsPattern = {
  id: 'harbor-01',
  name: 'Harbor winds',
  family: 'compass',
  value: 25,
  sealed: false,
  groups: [
    { size: 2, tile: 'flower' },
    { size: 3, tile: 'wind-n' },
    { size: 3, tile: 'wind-e' },
    { size: 3, suit: 'A', rank: { var: 'n', offset: 0 } },
    { size: 3, dragon: 'match', suit: 'A' },
  ],
};

export const smallList = { name: 'Harbor Lane week 1 list', description: 'Two patterns to start with.', patterns: [windsPattern, { ...windsPattern, id: 'harbor-02', name: 'Harbor winds, south', groups: [...windsPattern.groups.slice(0, 2), { size: 3, tile: 'wind-s' }, ...windsPattern.groups.slice(3)] }] };

/** A fresh app, disposed with the kit, where Ines and Pat teach and Theo plays, each signed in. */
export async function teachingApp(apps: AppKit) {
  const app = await apps.make();
  await createUser('ines@harborlane.test', 'teacher');
  await createUser('pat@harborlane.test', 'teacher');
  await createUser('theo@harborlane.test', 'player');
  return {
    app,
    ines: await signedIn(app.app, 'ines@harborlane.test'),
    pat: await signedIn(app.app, 'pat@harborlane.test'),
    theo: await signedIn(app.app, 'theo@harborlane.test'),
  };
}

/** Every test has a teaching app (`teaching`), disposed after it. */
export const teachingTest = appTest.extend('teaching', { auto: true }, async ({ apps }) => teachingApp(apps));

export type Agent = ReturnType<typeof request.agent>;
export type { TestApp };
export type TestTeaching = Awaited<ReturnType<typeof teachingApp>>;

/** Uploads text as a file, the way a browser's file input sends it. */
export function upload(agent: Agent, path: string, text: string | Buffer, filename: string, contentType = filename.endsWith('.csv') ? 'text/csv' : 'application/json') {
  return agent.post(path).attach('file', Buffer.isBuffer(text) ? text : Buffer.from(text, 'utf8'), { filename, contentType });
}
