/** The exchange list says how many tables played each finished exchange's deal, so a lone table offers no comparison. */
import { afterAll, beforeAll, expect, test } from 'vitest';
import { createUser, makeApp, signedIn, type TestApp } from './helpers';
import { makeDrill, makeTable, planA, planB } from './comparison-fixture';

let app: TestApp;
const ids: Record<string, string> = {};

beforeAll(async () => {
  app = await makeApp();
  const ines = await createUser('ines@harborlane.test', 'teacher');
  const [theo, sol, mina] = await Promise.all(['theo', 'sol', 'mina'].map((n) => createUser(`${n}@harborlane.test`)));
  // Two tables of one drill play one deal; a second drill's only table plays another.
  const { drill } = await makeDrill(ines);
  ids.a = (await makeTable(ines, drill, 'Week 1 · table 1', { east: theo, south: 'bot', west: 'bot', north: 'bot' }, planA)).exchange!.id;
  ids.b = (await makeTable(ines, drill, 'Week 1 · table 2', { east: sol, south: 'bot', west: 'bot', north: 'bot' }, planB)).exchange!.id;
  const { drill: other } = await makeDrill(ines);
  ids.lone = (await makeTable(ines, other, 'Week 2 · table 1', { east: mina, south: 'bot', west: 'bot', north: 'bot' }, planA)).exchange!.id;
});
afterAll(() => app.dispose());

test('a finished exchange counts the tables of its host on the same deal, itself included', async () => {
  const theo = (await (await signedIn(app.app, 'theo@harborlane.test')).get('/api/exchanges')).body.exchanges;
  expect(theo).toMatchObject([{ id: ids.a, sameDeal: 2 }]);
  const mina = (await (await signedIn(app.app, 'mina@harborlane.test')).get('/api/exchanges')).body.exchanges;
  expect(mina).toMatchObject([{ id: ids.lone, sameDeal: 1 }]);
  // The host sees every table: both of the first deal count two, the lone one one.
  const ines = (await (await signedIn(app.app, 'ines@harborlane.test')).get('/api/exchanges')).body.exchanges as { id: string; sameDeal: number }[];
  expect(Object.fromEntries(ines.map((e) => [e.id, e.sameDeal]))).toEqual({ [ids.a]: 2, [ids.b]: 2, [ids.lone]: 1 });
});
