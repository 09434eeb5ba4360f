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
