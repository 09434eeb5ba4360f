import bcrypt from 'bcryptjs';
import { User, type Role } from './models';
import { seedTeachingDemo } from './seed-teaching';

/** The demo scenario: Harbor Lane Tile Circle. One password for every demo account. */
export const DEMO_PASSWORD = 'harbor-lane-demo';

export const DEMO_USERS: { email: string; displayName: string; role: Role }[] = [
  { email: 'ines@harborlane.test', displayName: 'Ines Okafor', role: 'teacher' },
  { email: 'theo@harborlane.test', displayName: 'Theo Brandt', role: 'player' },
  { email: 'mina@harborlane.test', displayName: 'Mina Castellanos', role: 'player' },
  { email: 'ruth@harborlane.test', displayName: 'Ruth Adeyemi', role: 'player' },
  { email: 'sol@harborlane.test', displayName: 'Sol Varga', role: 'player' },
  { email: 'pat@harborlane.test', displayName: 'Pat Lindqvist', role: 'admin' },
];

/** Seeds the demo on an empty database; does nothing when any user exists. */
export async function seedDemo(bcryptRounds: number): Promise<boolean> {
  if ((await User.count()) > 0) return false;
  const passwordHash = await bcrypt.hash(DEMO_PASSWORD, bcryptRounds);
  await User.bulkCreate(DEMO_USERS.map((u) => ({ ...u, passwordHash })));
  await seedTeachingDemo();
  return true;
}
