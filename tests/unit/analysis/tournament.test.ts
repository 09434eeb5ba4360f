import jStat from 'jstat';
import { expect, test } from 'vitest';
import { starterPatterns } from '../../../shared/analysis';
import {
  awayMeasure,
  dealSeed,
  difference,
  lineupFor,
  meanInterval,
  measuredSeats,
  oddsMeasure,
  playDeal,
  playExchange,
  runTournament,
  sameOpponents,
  summarize,
  t975,
  unseenBy,
  type CompletionOddsFn,
  type DealResult,
  type Opponents,
  type SeatFigure,
} from '../../../shared/analysis/tournament';
import type { BotStrategyId } from '../../../shared/analysis';
import { SEATS, type Seat } from '../../../shared/seats';
import { SET_SIZE, type TileKind } from '../../../shared/tiles';

const randomAround = sameOpponents('random');

/** The actions each seat took in one phase, in log order. */
function actionsIn(state: ReturnType<typeof playExchange>, phaseIndex: number, seat: Seat) {
  let phase = 0;
  const out: unknown[] = [];
  for (const entry of state.log) {
    if ('resolve' in entry) phase++;
    else if (phase === phaseIndex && entry.seat === seat) out.push(entry.action);
  }
  return out;
}

test('the same strategy in the measured seat twice gives identical end racks at every seat', () => {
  for (let index = 0; index < 4; index++) {
    for (const seat of SEATS) {
      const lineup = lineupFor(seat, 'random', randomAround);
      const a = playExchange(dealSeed('pairing', index), lineup, starterPatterns);
      const b = playExchange(dealSeed('pairing', index), lineup, starterPatterns);
      for (const s of SEATS) expect(b.racks[s]).toEqual(a.racks[s]);
      expect(b.log).toEqual(a.log);
    }
  }
  const twice = playDeal({ prefix: 'pairing', index: 0, list: starterPatterns, measure: awayMeasure, opponents: randomAround, rotation: 'every-seat', strategies: ['random', 'random'] });
  for (const seat of SEATS) {
    const [first, second] = twice.runs.filter((r) => r.seat === seat);
    expect(second.rack).toEqual(first.rack);
  }
});

test('changing only the measured strategy keeps the deal and the opponents’ own choices until tiles from the measured seat reach them', () => {
  let changed = 0;
  for (let index = 0; index < 6; index++) {
    const seed = dealSeed('paired', index);
    const measured: Seat = SEATS[index % 4];
    const runs = (['random', 'multiples', 'advised'] as BotStrategyId[]).map((s) => playExchange(seed, lineupFor(measured, s, randomAround), starterPatterns));
    for (const run of runs) {
      // The first pass is chosen from the dealt rack alone: a random opponent seeded by deal and seat picks the same tiles.
      for (const seat of SEATS.filter((s) => s !== measured)) {
        expect(actionsIn(run, 0, seat)).toHaveLength(1);
        expect(actionsIn(run, 0, seat)).toEqual(actionsIn(runs[0], 0, seat));
      }
    }
    if (runs.some((run) => JSON.stringify(run.racks[measured]) !== JSON.stringify(runs[0].racks[measured]))) changed++;
  }
  // The strategy is what differs, and it does change where the measured seat ends up.
  expect(changed).toBeGreaterThan(3);
});

test('every seat is measured equally often, under either rotation', () => {
  for (let index = 0; index < 5; index++) expect(measuredSeats(index, 'every-seat')).toEqual([...SEATS]);
  const counts = new Map<Seat, number>();
  for (let index = 0; index < 12; index++) for (const seat of measuredSeats(index, 'one-seat-per-deal')) counts.set(seat, (counts.get(seat) ?? 0) + 1);
  expect(Object.fromEntries(counts)).toEqual({ east: 3, south: 3, west: 3, north: 3 });

  const { deals } = runTournament({ prefix: 'rotation', deals: 2, list: starterPatterns, measure: awayMeasure, opponents: sameOpponents('multiples'), rotation: 'every-seat' });
  for (const deal of deals) {
    for (const seat of SEATS) expect(deal.runs.filter((r) => r.seat === seat).map((r) => r.strategy)).toEqual(['random', 'multiples', 'advised']);
  }
});

test('opponents sit where they are named from the measured seat', () => {
  const mix: Opponents = { right: 'random', across: 'advised', left: 'multiples' };
  // South passes right to west, across to north, left to east (shared/seats.ts).
  expect(lineupFor('south', 'advised', mix)).toEqual({ south: 'advised', west: 'random', north: 'advised', east: 'multiples' });
  expect(lineupFor('east', 'random', sameOpponents('multiples'))).toEqual({ east: 'random', south: 'multiples', west: 'multiples', north: 'multiples' });
});

test('the measured seat has seen only its own rack: unseen is the full set minus it', () => {
  const rack: TileKind[] = ['joker', 'joker', 'flower', 'bam1', 'bam1', 'wind-n'];
  const unseen = unseenBy(rack);
  expect(unseen).toHaveLength(SET_SIZE - rack.length);
  expect(unseen.filter((k) => k === 'joker')).toHaveLength(6);
  expect(unseen.filter((k) => k === 'bam1')).toHaveLength(2);
  expect(unseen.filter((k) => k === 'flower')).toHaveLength(7);
});

test('the odds measure takes the best pattern’s odds, on the seat’s unseen tiles, with one seed per deal and seat', () => {
  const calls: { rack: TileKind[]; unseen: number; seed: string | undefined }[] = [];
  const fake: CompletionOddsFn = (rack, list, options) => {
    calls.push({ rack: [...rack], unseen: options.unseen!.length, seed: options.seed });
    return { patterns: list.map((p, i) => ({ id: p.id, odds: i === 2 ? 0.4 : 0.1 })), families: [] };
  };
  const deal = playDeal({ prefix: 'odds', index: 3, list: starterPatterns, measure: oddsMeasure({}, fake), opponents: sameOpponents('multiples'), rotation: 'every-seat' });
  expect(deal.runs.every((r) => r.figure.odds === 0.4)).toBe(true);
  for (const call of calls) expect(call.unseen).toBe(SET_SIZE - call.rack.length);
  for (const seat of SEATS) {
    const seeds = new Set(calls.filter((_, i) => deal.runs[i].seat === seat).map((c) => c.seed));
    expect(seeds.size).toBe(1);
  }
  expect(new Set(calls.map((c) => c.seed)).size).toBe(4);
  expect(deal.mean.advised.odds).toBe(0.4);
});

test('t(0.975) matches jstat for every degree of freedom', () => {
  // jstat's published studentt.inv; the table below 31 is from memory.
  const studentt = (jStat as unknown as { studentt: { inv(p: number, dof: number): number } }).studentt;
  for (let df = 1; df <= 30; df++) expect(t975(df)).toBeCloseTo(studentt.inv(0.975, df), 3);
  for (const df of [31, 40, 60, 99, 120, 250, 1000, 5000]) expect(Math.abs(t975(df) - studentt.inv(0.975, df))).toBeLessThan(2e-4);
});

test('the 95% interval of a mean, worked by hand', () => {
  // Student-t interval mean ± t(0.975, n−1)·s/√n, from memory. For 1, 2, 3, 4, 5: mean 3,
  // s² = (4 + 1 + 0 + 1 + 4) / 4 = 2.5, s/√n = √0.5 = 0.70711, t(0.975, 4) = 2.776, half = 1.96293.
  const i = meanInterval([1, 2, 3, 4, 5]);
  expect(i.mean).toBe(3);
  expect(i.sd).toBeCloseTo(Math.sqrt(2.5), 10);
  expect(i.half).toBeCloseTo(1.96293, 4);
  expect(i.low).toBeCloseTo(1.03707, 4);
  expect(i.high).toBeCloseTo(4.96293, 4);
  expect(meanInterval([2]).half).toBe(Infinity);
});

function fakeDeal(index: number, figures: Record<BotStrategyId, SeatFigure>): DealResult {
  return { index, seed: `d${index}`, seats: ['east'], runs: [], mean: figures };
}

test('strategies are compared by the per-deal difference, and the goal needs both intervals above 0', () => {
  // Differences advised − multiples per deal: 0.2, 0.1, 0.3: mean 0.2, s = 0.1,
  // half = t(0.975, 2) · 0.1/√3 = 4.303 · 0.057735 = 0.24844, so the interval reaches below 0.
  const odds = [
    [0.1, 0.3, 0.5],
    [0.0, 0.2, 0.3],
    [0.05, 0.0, 0.3],
  ];
  const deals = odds.map(([random, multiples, advised], i) =>
    fakeDeal(i, { random: { odds: random, away: 8 }, multiples: { odds: multiples, away: 7 }, advised: { odds: advised, away: 6 - i / 10 } }),
  );
  const d = difference(deals, 'advised', 'multiples', 'odds');
  expect(d.odds!.mean).toBeCloseTo(0.2, 10);
  expect(d.odds!.half).toBeCloseTo(0.24844, 4);
  expect(d.holds).toBe(false);
  // Tiles closer per deal (worse's away minus better's): 1, 1.1, 1.2; mean 1.1, s = 0.1, the same half.
  expect(d.closer.mean).toBeCloseTo(1.1, 10);
  expect(d.closer.half).toBeCloseTo(0.24844, 4);
  expect(difference(deals, 'advised', 'multiples', 'away').holds).toBe(true);

  const summary = summarize(deals);
  expect(summary.judgedOn).toBe('odds');
  expect(summary.rows.map((r) => r.strategy)).toEqual(['random', 'multiples', 'advised']);
  expect(summary.goalHolds).toBe(false);
  // Without odds the goal is judged on tiles away.
  const awayOnly = deals.map((deal) => fakeDeal(deal.index, Object.fromEntries(Object.entries(deal.mean).map(([k, f]) => [k, { odds: null, away: f.away }])) as Record<BotStrategyId, SeatFigure>));
  const byAway = summarize(awayOnly);
  expect(byAway.judgedOn).toBe('away');
  expect(byAway.rows[0].odds).toBeNull();
  expect(byAway.goalHolds).toBe(true);
});

test('a deal’s figure is the mean over its measured seats', () => {
  const deal = playDeal({ prefix: 'mean', index: 1, list: starterPatterns, measure: awayMeasure, opponents: sameOpponents('multiples'), rotation: 'every-seat' });
  for (const strategy of ['random', 'multiples', 'advised'] as BotStrategyId[]) {
    const aways = deal.runs.filter((r) => r.strategy === strategy).map((r) => r.figure.away);
    expect(aways).toHaveLength(4);
    expect(deal.mean[strategy].away).toBeCloseTo(aways.reduce((a, b) => a + b, 0) / 4, 10);
  }
});

test('a seed gives the same tournament every time, and another seed another', () => {
  const options = { deals: 3, list: starterPatterns, measure: awayMeasure, opponents: randomAround, rotation: 'one-seat-per-deal' as const };
  const a = runTournament({ ...options, prefix: 'same' });
  const b = runTournament({ ...options, prefix: 'same' });
  expect(b).toEqual(a);
  const c = runTournament({ ...options, prefix: 'other' });
  expect(c.deals.map((d) => d.runs.map((r) => r.rack))).not.toEqual(a.deals.map((d) => d.runs.map((r) => r.rack)));
});
