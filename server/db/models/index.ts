import type { Sequelize } from 'sequelize';
import { initAudit } from './audit';
import { initExchange } from './exchange';
import { initTable } from './table';
import { initUser } from './user';

export { User, ROLES, type Role, type PublicUser } from './user';
export { AuditEntry } from './audit';
export { TableRow, type StoredOccupant, type StoredSeats } from './table';
export { ExchangeRow, ExchangeEventRow, HuddleNoteRow, participantsKey, isParticipant, type EventType } from './exchange';

export function initModels(sequelize: Sequelize) {
  initUser(sequelize);
  initTable(sequelize);
  initExchange(sequelize);
  initAudit(sequelize);
}
