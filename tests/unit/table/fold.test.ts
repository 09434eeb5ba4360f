/**
 * Folding a stored log gives the live table back: whatever mix of moves, refusals, huddles and
 * resolves a table went through, restoring its exchange from the records it stored (read back as
 * JSON, as a database hands them) equals what it held live, and catching up from any point of the
 * log does too. Property tests pin their seed; FC_SEED=n explores others.
 */
import fc from 'fast-check';
import { expect, test } from 'vitest';
import { rngFor } from '../../../shared/random';
import { SEATS, type Seat } from '../../../shared/seats';
import { dueEvent, foldLog, fromRecord, reduceTable, restoreExchange, toRecord, type LogEvent, type LogRecord, type Table, type TableEvent, type TableExchange } from '../../../shared/table';
import { deepFreeze, illegalAction, legalAction } from '../exchange/helpers';

const seed = Number(process.env.FC_SEED ?? 2_718_281);
const runs = { numRuns: 60, seed };

const options = fc.record({ seed: fc.string({ minLength: 1, maxLength: 16 }), jokers: fc.boolean(), secondCharleston: fc.boolean(), courtesy: fc.boolean() });
const step = fc.record({
  kind: fc.constantFrom(...'legal legal legal legal legal legal illegal due due due release release call reveal note'.split(' ')),
  seat: fc.constantFrom(...SEATS),
  salt: fc.nat(),
});
const steps = fc.array(step, { minLength: 10, maxLength: 300, size: 'max' });
const everyPass = fc.boolean();

interface Played {
  live: TableExchange;
  records: LogRecord[];
  /** The exchange after each stored record, 0 first. */
  after: TableExchange[];
}

/** Plays a dealt table through `steps`, storing each logged event it accepts; refusals change nothing. */
function play(opts: { seed: string; jokers: boolean; secondCharleston: boolean; courtesy: boolean }, plan: { kind: string; seat: Seat; salt: number }[], huddleEveryPass: boolean): Played {
  const bot = { kind: 'bot' as const, strategy: 'random', displayName: 'Wild card' };
  const dealt = reduceTable({ status: 'lobby', seats: { east: bot, south: bot, west: bot, north: bot }, exchange: null }, { type: 'deal', exchangeId: 'x', options: opts });
  if (!dealt.ok) throw new Error(dealt.message);
  let table: Table = dealt.table;
  const records: LogRecord[] = [];
  const after = [table.exchange!];
  let notes = 0;
  plan.forEach(({ kind, seat, salt }, index) => {
    const live = table.exchange!;
    const rng = rngFor('table-fold', salt, index);
    let event: TableEvent | null;
    if (kind === 'legal') {
      // The named seat acts if it has something to do, else the next seat that has.
      const actor = [...SEATS.slice(SEATS.indexOf(seat)), ...SEATS.slice(0, SEATS.indexOf(seat))].find((s) => legalAction(live.state, s, rngFor('probe', salt)));
      const action = actor && legalAction(live.state, actor, rng);
      event = actor && action ? { type: 'act', seat: actor, action } : null;
    }
    else if (kind === 'illegal') event = { type: 'act', seat, action: illegalAction(live.state, seat, rng) };
    else if (kind === 'due') event = dueEvent(live, huddleEveryPass);
    else if (kind === 'call') event = { type: 'huddle-call', auto: false };
    else if (kind === 'reveal') event = { type: 'huddle-reveal', seat };
    else if (kind === 'release') event = { type: 'huddle-release' };
    else event = { type: 'huddle-note', note: { id: ++notes, passIndex: live.state.history.length, phase: live.state.phase, seat: null, authorName: 'Host', text: `note ${notes}`, createdAt: 'then' } };
    if (!event) return;
    const snapshot = JSON.stringify(table);
    const result = reduceTable(deepFreeze(table), event);
    expect(JSON.stringify(table)).toBe(snapshot);
    if (!result.ok) return;
    const logged = result.table.exchange!.seq === live.seq + 1;
    if (logged) {
      records.push(toRecord(event as LogEvent));
      after.push(result.table.exchange!);
    } else {
      // Only a note, or what the table already holds, takes no place in the log.
      expect(event.type === 'huddle-note' || result.table === table).toBe(true);
    }
    table = result.table;
  });
  return { live: table.exchange!, records, after };
}

/** Records as a database hands them back: through JSON. */
const stored = (records: LogRecord[]): LogRecord[] => JSON.parse(JSON.stringify(records));

test('restoring an exchange from its stored records and notes equals the live exchange', () => {
  const reached = new Set<string>();
  fc.assert(
    fc.property(options, steps, everyPass, (opts, plan, hold) => {
      const { live, records } = play(opts, plan, hold);
      for (const r of records) reached.add(r.type);
      reached.add(live.state.phase);
      expect(restoreExchange('x', opts, stored(records), live.notes)).toEqual(live);
    }),
    runs,
  );
  // The runs went through every kind of stored event, and some to the end of the exchange.
  expect([...reached]).toEqual(expect.arrayContaining(['act', 'resolve', 'huddle-call', 'huddle-reveal', 'huddle-release', 'first-left', 'done']));
});

test('catching up from any stored place with the records after it equals the live exchange', () => {
  fc.assert(
    fc.property(options, steps, everyPass, fc.nat(), (opts, plan, hold, cut) => {
      const { live, records, after } = play(opts, plan, hold);
      const from = cut % after.length;
      const caughtUp = foldLog({ ...after[from], notes: live.notes }, stored(records.slice(from)));
      expect(caughtUp).toEqual(live);
    }),
    runs,
  );
});

test('every logged event survives its record: fromRecord(toRecord(e)) is e', () => {
  const events: LogEvent[] = [
    { type: 'act', seat: 'north', action: { type: 'pass', tiles: ['a', 'b'], blind: 1 } },
    { type: 'act', seat: 'east', action: { type: 'vote', stop: true } },
    { type: 'resolve' },
    { type: 'huddle-call', auto: true },
    { type: 'huddle-call', auto: false },
    { type: 'huddle-reveal', seat: 'south' },
    { type: 'huddle-release' },
  ];
  for (const event of events) expect(fromRecord(stored([toRecord(event)])[0])).toEqual(event);
});

test('a stored record that no longer applies stops the fold and names its place', () => {
  const opts = { seed: 'fold-broken' };
  const { records } = play({ ...opts, jokers: true, secondCharleston: true, courtesy: true }, [{ kind: 'legal', seat: 'east', salt: 1 }], false);
  expect(records).toHaveLength(1);
  expect(() => restoreExchange('x', opts, [...records, records[0]])).toThrow(/Stored event 1 of exchange x no longer applies/);
});
