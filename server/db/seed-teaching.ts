import { randomUUID } from 'node:crypto';
import { starterPatterns } from '../../shared/analysis';
import { DrillRow, PatternListRow, User } from './models';

const DEMO_LIST_NAME = 'Harbor Lane practice list';
const DEMO_DRILL_NAME = 'Harbor Lane week 1';

/** The demo teacher's own copy of the starter list and a first drill that deals from it. */
export async function seedTeachingDemo(teacherEmail = 'ines@harborlane.test') {
  const teacher = await User.findOne({ where: { email: teacherEmail } });
  if (!teacher) return;
  const list = await PatternListRow.create({
    id: randomUUID(),
    ownerId: teacher.id,
    name: DEMO_LIST_NAME,
    description: 'A copy of the starter list for the Tuesday group, to trim as the weeks go on.',
    patterns: structuredClone(starterPatterns),
  });
  await DrillRow.create({
    id: randomUUID(),
    ownerId: teacher.id,
    name: DEMO_DRILL_NAME,
    description: 'East starts with a pair of 2 bam, a pair of 8 dot, a flower and a joker. Before each pass, say what you keep and why.',
    seed: 'harbor-lane-week-01',
    jokers: true,
    secondCharleston: true,
    courtesy: true,
    racks: { east: ['bam2', 'bam2', 'dot8', 'dot8', 'flower', 'joker'] },
    patternListId: list.id,
  });
}
