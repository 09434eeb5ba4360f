/**
 * A hand-made deal for the comparison and progress tests: preset racks for all four seats, a
 * one-pattern list, and passes chosen so every seat's tiles away are worked out by hand.
 */
import { dealScope, dealSeed } from '../../server/services/deal-seed';
import { randomUUID } from 'node:crypto';
import { act, createExchange, resolve } from '../../shared/exchange';
import type { Action, ExchangeOptions, ExchangeState, LogEntry } from '../../shared/exchange/types';
import type { Seat } from '../../shared/seats';
import type { TileKind } from '../../shared/tiles';
import { DrillRow, Enrollment, ExchangeEventRow, ExchangeRow, Lesson, LessonTable, participantsKey, PatternListRow, TableRow, type StoredSeats, type User } from '../../server/db/models';
import { defaultTableOptions } from '../../server/realtime/table-master';

/** One pattern: four 1 bam, four 2 bam, three 3 bam, three 4 bam (14 tiles). Nothing else counts. */
export const stepsPattern = {
  id: 'harbor-steps',
  name: 'Harbor steps',
  family: 'ladder',
  value: 25,
  sealed: false,
  groups: [
    { size: 4, tile: 'bam1' },
    { size: 4, tile: 'bam2' },
    { size: 3, tile: 'bam3' },
    { size: 3, tile: 'bam4' },
  ],
} as const;

const x = (kind: TileKind, n: number): TileKind[] => Array.from({ length: n }, () => kind);

/**
 * Fits of the one pattern after the deal: east 3 + 2 + 1 = 6 (8 away), south 1 + 2 + 1 + 2 = 6
 * (8 away), west 1 + 1 = 2 (12 away), north none (14 away).
 */
export const racks: Record<Seat, TileKind[]> = {
  east: [...x('bam1', 3), ...x('bam2', 2), 'bam3', 'dot5', 'dot6', 'dot7', 'crack5', 'crack6', 'crack7', 'wind-n', 'wind-s'],
  south: ['bam1', ...x('bam2', 2), 'bam3', ...x('bam4', 2), 'dot1', 'dot2', 'dot3', 'crack1', 'crack2', 'crack3', 'wind-e'],
  west: ['bam3', 'bam4', ...x('dot4', 2), ...x('dot8', 2), ...x('crack4', 2), ...x('crack8', 2), ...x('wind-w', 2), 'dragon-red'],
  north: [...x('dot9', 3), ...x('crack9', 3), ...x('flower', 3), ...x('dragon-green', 2), ...x('dragon-white', 2)],
};

export const dealOptions: ExchangeOptions = { seed: 'harbor-lane-week-01', jokers: false, secondCharleston: false, courtesy: false, racks };

type Plan = Record<'first-right' | 'first-across' | 'first-left', Record<Seat, TileKind[]>>;

/** The others pass the same at both tables; only east differs. */
function planFor(east: Record<keyof Plan, TileKind[]>, southLeft: TileKind[]): Plan {
  return {
    'first-right': { east: east['first-right'], south: ['dot1', 'dot2', 'dot3'], west: ['dragon-red', 'wind-w', 'wind-w'], north: x('dot9', 3) },
    'first-across': { east: east['first-across'], south: ['crack1', 'crack2', 'crack3'], west: ['bam3', 'bam4', 'crack4'], north: x('crack9', 3) },
    'first-left': { east: east['first-left'], south: southLeft, west: ['dot1', 'dot2', 'dot3'], north: x('flower', 3) },
  };
}

/**
 * Table A: east keeps its bams and ends 1 bam ×4, 2 bam ×3, 3 bam ×2, 4 bam ×2: 11 fit, 3 away.
 * South gives up 1, 2 and 4 bam on the left pass (breaking the 2 bam and 4 bam pairs) and ends
 * with 2, 3 and 4 bam: 11 away. West and north end with no bam: 14 away.
 */
export const planA = planFor({ 'first-right': ['wind-n', 'wind-s', 'crack5'], 'first-across': ['dot5', 'dot6', 'dot7'], 'first-left': ['crack4', 'crack6', 'crack7'] }, ['bam1', 'bam2', 'bam4']);

/**
 * Table B: east sends its three 1 bam right at once and ends with 2 bam ×2, 3 bam ×2, 4 bam: 9 away.
 * South so holds 1 bam ×4, 2 bam ×2, 3 bam, 4 bam ×2 and keeps them: 9 fit, 5 away.
 */
export const planB = planFor({ 'first-right': x('bam1', 3), 'first-across': ['dot5', 'dot6', 'dot7'], 'first-left': ['wind-n', 'wind-s', 'crack4'] }, ['wind-e', 'crack9', 'crack9']);

function idsOf(state: ExchangeState, seat: Seat, kinds: TileKind[]): string[] {
  const free = [...state.racks[seat]];
  return kinds.map((kind) => {
    const i = free.findIndex((t) => t.kind === kind);
    if (i < 0) throw new Error(`${seat} holds no ${kind} to pass`);
    return free.splice(i, 1)[0].id;
  });
}

/** Plays a plan through the engine and returns its log. */
export function playPlan(plan: Plan, options: ExchangeOptions = dealOptions): { log: LogEntry[]; state: ExchangeState } {
  let state = createExchange(options);
  const log: LogEntry[] = [];
  for (const phase of ['first-right', 'first-across', 'first-left'] as const) {
    if (state.phase !== phase) throw new Error(`expected ${phase}, at ${state.phase}`);
    for (const seat of ['east', 'south', 'west', 'north'] as const) {
      const action: Action = { type: 'pass', tiles: idsOf(state, seat, plan[phase][seat]) };
      const r = act(state, seat, action);
      if (!r.ok) throw new Error(r.message);
      state = r.state;
      log.push({ seat, action });
    }
    const r = resolve(state);
    if (!r.ok) throw new Error(r.message);
    state = r.state;
    log.push({ resolve: true });
  }
  if (state.phase !== 'done') throw new Error(`expected done, at ${state.phase}`);
  return { log, state };
}

type Occupant = User | 'bot';

function storedSeats(occupants: Record<Seat, Occupant>): StoredSeats {
  const seat = (o: Occupant): StoredSeats[Seat] => (o === 'bot' ? { kind: 'bot', strategy: 'advised', displayName: 'Advised (bot)' } : { kind: 'user', userId: o.id, displayName: o.displayName });
  return { east: seat(occupants.east), south: seat(occupants.south), west: seat(occupants.west), north: seat(occupants.north) };
}

export async function makeDrill(teacher: User) {
  const list = await PatternListRow.create({ id: randomUUID(), ownerId: teacher.id, name: 'Harbor Lane steps list', description: '', patterns: [structuredClone(stepsPattern) as never] });
  const drill = await DrillRow.create({
    id: randomUUID(),
    ownerId: teacher.id,
    name: 'Harbor Lane week 1 drill',
    description: '',
    seed: dealOptions.seed,
    jokers: false,
    secondCharleston: false,
    courtesy: false,
    racks,
    patternListId: list.id,
  });
  return { list, drill };
}

/** A table of the drill hosted by the teacher, and (with a plan) one exchange on it, finished or not. */
export async function makeTable(teacher: User, drill: DrillRow, name: string, occupants: Record<Seat, Occupant>, plan?: Plan, status: 'playing' | 'done' = 'done') {
  const seats = storedSeats(occupants);
  const options = { ...defaultTableOptions({ seed: drill.seed, jokers: false, secondCharleston: false, courtesy: false, patternListId: drill.patternListId }), drillId: drill.id, drillName: drill.name, racks };
  const table = await TableRow.create({ id: randomUUID(), name, hostId: teacher.id, hostName: teacher.displayName, private: true, inviteCode: 'code', options, status: plan ? status : 'lobby', seats, currentExchangeId: null });
  if (!plan) return { table, exchange: null };
  // As a table of the drill deals it: the engine's seed derived from the drill's seed name, first deal.
  const dealt = { ...dealOptions, seed: dealSeed(dealScope(table), drill.seed, 0), seedName: drill.seed };
  const { log } = playPlan(plan, dealt);
  const played = status === 'done' ? log : log.slice(0, 4);
  const ids = Object.values(occupants).flatMap((o) => (o === 'bot' ? [] : [o.id]));
  const exchange = await ExchangeRow.create({
    id: randomUUID(),
    tableId: table.id,
    tableName: name,
    hostId: teacher.id,
    options: dealt,
    seats,
    participants: participantsKey(ids),
    status,
    startedAt: new Date('2030-05-14T23:00:00Z'),
    finishedAt: status === 'done' ? new Date('2030-05-14T23:20:00Z') : null,
  });
  await ExchangeEventRow.bulkCreate(
    played.map((entry, i) => ('resolve' in entry ? { exchangeId: exchange.id, seq: i + 1, type: 'resolve' as const, seat: null, payload: null, userId: null } : { exchangeId: exchange.id, seq: i + 1, type: 'act' as const, seat: entry.seat, payload: entry.action, userId: null })),
  );
  await table.update({ currentExchangeId: exchange.id });
  return { table, exchange };
}

export async function makeLesson(teacher: User, drill: DrillRow, students: User[], tables: TableRow[]) {
  const lesson = await Lesson.create({
    teacherId: teacher.id,
    title: 'Harbor Lane week 1: passing right',
    description: '',
    startsAt: new Date('2030-05-14T23:00:00Z'),
    timeZone: 'America/New_York',
    durationMinutes: 60,
    seats: 8,
    priceCents: 0,
    currency: 'usd',
    drillIds: [drill.id],
    seed: null,
  });
  for (const s of students) await Enrollment.create({ lessonId: lesson.id, userId: s.id, status: 'enrolled' });
  for (const [index, t] of tables.entries()) await LessonTable.create({ lessonId: lesson.id, tableId: t.id, index });
  return lesson;
}
