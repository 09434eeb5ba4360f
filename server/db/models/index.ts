import type { Sequelize } from 'sequelize';
import { initAudit } from './audit';
import { initDrill } from './drill';
import { initExchange } from './exchange';
import { initLessons } from './lesson';
import { initMail } from './mail';
import { initPayments } from './payment';
import { initPatternList } from './pattern-list';
import { initTable } from './table';
import { initUser } from './user';

export { User, type Role } from './user';
export { AuditEntry } from './audit';
export { TableRow, type StoredSeats, type StoredTableOptions } from './table';
export { PatternListRow } from './pattern-list';
export { DrillRow } from './drill';
export { Lesson, Enrollment, Invitation, LessonTable } from './lesson';
export { Payment, PaymentEvent } from './payment';
export { Mail, PasswordReset } from './mail';
export { ExchangeRow, ExchangeEventRow, HuddleNoteRow, participantsKey, isParticipant, type StoredExchangeOptions } from './exchange';

export function initModels(sequelize: Sequelize) {
  initUser(sequelize);
  initTable(sequelize);
  initExchange(sequelize);
  initLessons(sequelize);
  initPayments(sequelize);
  initMail(sequelize);
  initPatternList(sequelize);
  initDrill(sequelize);
  initAudit(sequelize);
}
