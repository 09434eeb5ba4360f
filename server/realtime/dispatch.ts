/**
 * The commands a table takes, and the fixed order a master checks them in before the reducer:
 * known command, who is asking, role, phase, allowed now, stale version. What passes becomes a plan
 * the master carries out (the reducer, then the store, then telling the viewers).
 */
import { isBotStrategyId } from '../../shared/analysis/bots';
import type { Action } from '../../shared/exchange/types';
import { seatOfUser, type Seat } from '../../shared/seats';
import type { LogEvent, Table, TableEvent } from '../../shared/table';
import type { Member } from './table-views';

export class TableError extends Error {
  constructor(
    readonly code: string,
    message: string,
  ) {
    super(message);
  }
}

/** One command per client message that changes a table, named as the message is. */
export type TableCommand =
  | { type: 'table:sit'; seat: Seat }
  | { type: 'table:stand' }
  | { type: 'table:bot'; seat: Seat; strategy: string }
  | { type: 'table:start' }
  | { type: 'table:close' }
  | { type: 'table:advice'; hidden: boolean }
  | { type: 'exchange:act'; action: Action; version?: number }
  | { type: 'huddle:call' }
  | { type: 'huddle:reveal'; seat: Seat }
  | { type: 'huddle:note'; text: string; seat?: Seat }
  | { type: 'huddle:release' };

/** What a checked command does: a row change, a deal, a logged event, a note, or nothing. */
export type Plan =
  | { kind: 'row'; event: TableEvent }
  | { kind: 'advice'; hidden: boolean }
  | { kind: 'deal' }
  | { kind: 'log'; event: LogEvent; seat: Seat | null }
  | { kind: 'note'; text: string; seat: Seat | null };

/** What the checks read of the table and this process. */
export interface Situation {
  table: Table;
  hostId: number;
  /** Whether the user has a connection to this table. */
  present(userId: number): boolean;
  /** How long, in ms, until a bot may take this player's seat (0: now). */
  graceLeft(userId: number): number;
  /** The version at which the current step (phase and passes resolved) began. */
  stepVersion: number;
  /** How many moves one seat may make in one exchange before take-backs are refused. */
  movesPerExchange: number;
}

interface Asker {
  member: Member;
  seat: Seat | null;
  host: boolean;
}

type Role = 'anyone' | 'player' | 'seated' | 'host';

interface Spec<C extends TableCommand> {
  role: Role;
  /** 'exchange': only while an exchange is under way. */
  phase: 'any' | 'exchange';
  allowed?(command: C, asker: Asker, s: Situation): void;
  plan(command: C, asker: Asker, s: Situation): Plan;
}

type Specs = { [T in TableCommand['type']]: Spec<Extract<TableCommand, { type: T }>> };

const log = (event: LogEvent, seat: Seat | null = null): Plan => ({ kind: 'log', event, seat });

const SPECS: Specs = {
  'table:sit': { role: 'player', phase: 'any', plan: (c, a) => ({ kind: 'row', event: { type: 'sit', seat: c.seat, userId: a.member.userId, displayName: a.member.displayName } }) },
  'table:stand': { role: 'anyone', phase: 'any', plan: (_c, a) => ({ kind: 'row', event: { type: 'stand', userId: a.member.userId } }) },
  'table:bot': {
    role: 'host',
    phase: 'any',
    allowed(c, _a, s) {
      if (!isBotStrategyId(c.strategy)) throw new TableError('BAD_INPUT', 'Unknown bot strategy.');
      const occupant = s.table.seats[c.seat];
      // A player who is still here keeps the seat; one who left may be replaced once the grace time is over.
      if (occupant?.kind !== 'user' || s.table.status !== 'playing') return;
      if (s.present(occupant.userId)) {
        throw new TableError('SEAT_TAKEN', `${occupant.displayName} is sitting ${c.seat}. A bot can only replace a player who has left during an exchange.`);
      }
      const wait = s.graceLeft(occupant.userId);
      if (wait > 0) throw new TableError('GRACE_TIME', `${occupant.displayName} may be back soon: a bot can take the ${c.seat} seat in ${Math.ceil(wait / 1000)} s.`);
    },
    plan: (c) => ({ kind: 'row', event: { type: 'bot', seat: c.seat, strategy: c.strategy } }),
  },
  'table:start': { role: 'host', phase: 'any', plan: () => ({ kind: 'deal' }) },
  'table:close': { role: 'host', phase: 'any', plan: () => ({ kind: 'row', event: { type: 'close' } }) },
  'table:advice': { role: 'host', phase: 'any', plan: (c) => ({ kind: 'advice', hidden: c.hidden }) },
  'exchange:act': {
    role: 'seated',
    phase: 'exchange',
    allowed(c, a, s) {
      // A log grows only as far as real play takes it: a whole exchange is a few dozen moves a seat.
      // Past the budget only take-backs are refused, so a seat can always still commit its choice.
      const made = s.table.exchange!.state.log.reduce((n, e) => n + ('seat' in e && e.seat === a.seat ? 1 : 0), 0);
      if (c.action.type === 'withdraw' && made >= s.movesPerExchange) {
        throw new TableError('TOO_MANY_MOVES', `Your seat has made ${s.movesPerExchange} moves in this exchange, far more than a Charleston needs, so choices can no longer be taken back. Commit your pass and let the table go on.`);
      }
    },
    plan: (c, a) => log({ type: 'act', seat: a.seat!, action: c.action }, a.seat),
  },
  'huddle:call': { role: 'host', phase: 'exchange', plan: () => log({ type: 'huddle-call', auto: false }) },
  'huddle:reveal': { role: 'host', phase: 'exchange', plan: (c) => log({ type: 'huddle-reveal', seat: c.seat }) },
  'huddle:note': { role: 'host', phase: 'exchange', plan: (c) => ({ kind: 'note', text: c.text, seat: c.seat ?? null }) },
  'huddle:release': { role: 'host', phase: 'exchange', plan: () => log({ type: 'huddle-release' }) },
};

function requireRole(role: Role, asker: Asker) {
  if (role === 'host' && !asker.host) throw new TableError('NOT_HOST', 'Only the host of this table can do that.');
  if (role === 'player' && asker.member.as !== 'player') throw new TableError('SPECTATOR', 'You joined to watch. Join as a player to take a seat.');
  if (role === 'seated' && (!asker.seat || asker.member.as !== 'player')) throw new TableError('NOT_SEATED', 'Take a seat at this table to play.');
}

/** Runs the checks in their fixed order and answers the plan, or throws the first refusal as a TableError. */
export function decide(command: TableCommand, member: Member, s: Situation): Plan {
  const spec = Object.hasOwn(SPECS, command?.type) ? (SPECS[command.type] as Spec<TableCommand>) : null;
  if (!spec) throw new TableError('UNKNOWN_COMMAND', 'Rackside has no such table command.');
  const asker: Asker = { member, seat: seatOfUser(s.table.seats, member.userId), host: member.userId === s.hostId };
  requireRole(spec.role, asker);
  if (spec.phase === 'exchange' && (s.table.status !== 'playing' || !s.table.exchange)) throw new TableError('NOT_STARTED', 'No exchange is under way at this table.');
  spec.allowed?.(command, asker, s);
  // Only a move to another step makes a choice stale: other seats committing meanwhile does not.
  if (command.type === 'exchange:act' && command.version !== undefined && command.version < s.stepVersion) {
    throw new TableError('STALE', 'The table moved on while you were choosing. Look again and resend.');
  }
  return spec.plan(command, asker, s);
}
