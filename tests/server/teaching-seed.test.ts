import { expect } from 'vitest';
import { starterPatterns } from '../../shared/analysis';
import { DrillRow, PatternListRow } from '../../server/db/models';
import { seedDemo } from '../../server/db/seed';
import { appTest, signedIn } from './helpers';

/** Every test has its own app (`app`); disposed after the test. */
const test = appTest.extend('app', { auto: true }, async ({ apps }) => apps.make());

test('the demo gives Ines a copy of the starter list and the week 1 drill that uses it, once', async ({ app }) => {
  expect(await seedDemo(4)).toBe(true);
  const ines = await signedIn(app.app, 'ines@harborlane.test', 'harbor-lane-demo');
  const drills = (await ines.get('/api/drills')).body.drills;
  expect(drills).toEqual([
    expect.objectContaining({ name: 'Harbor Lane week 1', seed: 'harbor-lane-week-01', patternListName: 'Harbor Lane practice list', racks: { east: ['bam2', 'bam2', 'dot8', 'dot8', 'flower', 'joker'] } }),
  ]);
  const list = (await ines.get(`/api/pattern-lists/${drills[0].patternListId}`)).body.list;
  expect(list.patterns).toEqual(starterPatterns);
  expect(await seedDemo(4)).toBe(false);
  expect([await DrillRow.count(), await PatternListRow.count()]).toEqual([1, 1]);
});
