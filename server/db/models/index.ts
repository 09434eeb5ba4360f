import type { Sequelize } from 'sequelize';
import { initAudit } from './audit';
import { initDrill } from './drill';
import { initExchange } from './exchange';
import { initPatternList } from './pattern-list';
import { initTable } from './table';
import { initUser } from './user';

export { User, ROLES, type Role, type PublicUser } from './user';
export { AuditEntry } from './audit';
export { TableRow, type StoredOccupant, type StoredSeats, type StoredTableOptions } from './table';
export { PatternListRow } from './pattern-list';
export { DrillRow } from './drill';
export { ExchangeRow, ExchangeEventRow, HuddleNoteRow, participantsKey, isParticipant, type EventType } from './exchange';

export function initModels(sequelize: Sequelize) {
  initUser(sequelize);
  initTable(sequelize);
  initExchange(sequelize);
  initPatternList(sequelize);
  initDrill(sequelize);
  initAudit(sequelize);
}
