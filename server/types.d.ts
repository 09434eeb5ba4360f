import type { User as RacksideUser } from './db/models';

declare global {
  namespace Express {
    // eslint-disable-next-line @typescript-eslint/no-empty-object-type
    interface User extends RacksideUser {}
  }
}
