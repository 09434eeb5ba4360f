import { expect, test } from 'vitest';
import { advisePass, type Pattern } from '../../shared/analysis';
import type { TileKind } from '../../shared/tiles';
import { seatFigures, type SeatRecord } from '../../server/services/exchange-stats';
import { stepsPattern } from './comparison-fixture';

const list = [stepsPattern] as unknown as Pattern[];
const rack: TileKind[] = ['bam1', 'bam1', 'bam1', 'bam2', 'bam2', 'bam3', 'dot5', 'dot6', 'dot7', 'crack5', 'crack6', 'crack7', 'wind-n', 'wind-s'];

function record(sent: TileKind[], blind = 0, phase: 'first-right' | 'first-left' = 'first-right'): SeatRecord {
  return { start: rack, end: rack, passes: [{ phase, rack, sent, blind }] };
}

test('a pass of the top suggestion’s kinds, in any order, matches the advice', () => {
  const top = advisePass(rack, list, { phase: 'first-right', blindAllowed: false })[0];
  const f = seatFigures(record(top.tiles.slice().reverse()), list, true);
  expect(f.passes[0].asAdvised).toBe(true);
  expect(f.passes[0].advised).toEqual({ tiles: top.tiles, blind: 0 });
});

test('giving up a 1 bam the pattern needs does not match, and breaks the 1 bam pung', () => {
  const f = seatFigures(record(['bam1', 'dot5', 'crack5']), list, true);
  expect(f.passes[0]).toMatchObject({ asAdvised: false, brokePair: true, passedFlower: false });
});

test('a blind count the advice did not give does not match', () => {
  const top = advisePass(rack, list, { phase: 'first-right', blindAllowed: false })[0];
  const f = seatFigures(record(top.tiles.slice(0, 2), 1), list, true);
  expect(f.passes[0].asAdvised).toBe(false);
});

test('without advice nothing matches, and tiles away come from the list: 6 of the pattern fit, 8 away', () => {
  const f = seatFigures(record(['wind-n', 'wind-s', 'crack5']), list, false);
  expect(f).toMatchObject({ awayBefore: 8, awayAfter: 8, nearest: 'Harbor steps' });
  expect(f.passes[0]).toMatchObject({ advised: null, asAdvised: false, brokePair: false });
});

test('a broken pair counts only where the advice kept it: the advised pass itself never counts as breaking one', () => {
  const top = advisePass(rack, list, { phase: 'first-right', blindAllowed: false })[0];
  const advisedBreaks = top.tiles.some((k) => rack.filter((x) => x === k).length >= 2);
  // Passing exactly the advice is never a slip, whatever it breaks.
  expect(seatFigures(record(top.tiles), list, true).passes[0]).toMatchObject({ asAdvised: true, brokePair: false });
  // A pass that breaks the 1 bam pung counts when the advice kept every pair, and not when the advice broke one too.
  expect(seatFigures(record(['bam1', 'dot5', 'crack5']), list, true).passes[0].brokePair).toBe(!advisedBreaks);
});

test('the figures carry the odds of finishing from the dealt rack and from the final one, between 0 and 1', () => {
  const f = seatFigures(record(['wind-n', 'wind-s', 'crack5']), list, false);
  for (const odds of [f.oddsBefore, f.oddsAfter]) {
    expect(odds).toBeGreaterThanOrEqual(0);
    expect(odds).toBeLessThanOrEqual(1);
  }
  expect(f.oddsBefore).toBe(f.oddsAfter); // the same rack, the same seeded figure
});
