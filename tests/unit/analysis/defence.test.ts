import { expect, test } from 'vitest';
import { advisePass, DEFENCE, passRisk, readNeighbours, type Pattern } from '../../../shared/analysis';
import type { PassRecord, Phase } from '../../../shared/exchange/types';
import { SEATS, type Seat } from '../../../shared/seats';
import type { TileKind } from '../../../shared/tiles';
import { testPattern } from './helpers';

/**
 * A seat's view of the history, built by hand: east's own sent and received tiles per pass,
 * with everyone's blind counts, as shared/exchange/view.ts shows them to east.
 */
function historyOf(passes: { phase: Phase; sent: TileKind[]; received: TileKind[]; blind?: Partial<Record<Seat, number>> }[]) {
  const kinds: Record<string, TileKind> = {};
  let n = 0;
  const ids = (list: TileKind[]) =>
    list.map((kind) => {
      const id = `h${++n}`;
      kinds[id] = kind;
      return id;
    });
  const empty = () => Object.fromEntries(SEATS.map((s) => [s, [] as string[]])) as Record<Seat, string[]>;
  const history: PassRecord[] = passes.map((p) => {
    const sent = empty();
    const received = empty();
    sent.east = ids(p.sent);
    received.east = ids(p.received);
    return { phase: p.phase, sent, forwarded: empty(), received, blind: { east: 0, south: 0, west: 0, north: 0, ...p.blind } };
  });
  return { seat: 'east' as const, history, kinds };
}

// East passes right to south and receives from north in the first right; across with west;
// left to north and from south in the first left (shared/seats.ts).
const dotsFromNorth = historyOf([
  { phase: 'first-right', sent: ['wind-n', 'crack9', 'bam1'], received: ['dot2', 'dot5', 'crack7'] },
  { phase: 'first-across', sent: ['dragon-red', 'crack1', 'bam9'], received: ['wind-e', 'bam3', 'crack2'] },
  { phase: 'first-left', sent: ['dot9', 'crack4', 'bam6'], received: ['bam7', 'bam8', 'dragon-green'] },
  { phase: 'second-left', sent: ['crack6', 'bam2', 'wind-s'], received: ['crack5', 'dot3', 'dot8'] },
]);

test('what a neighbour passed is what they let go; what this seat passed stays with them unless it came back', () => {
  const reads = readNeighbours(dotsFromNorth);
  const north = reads.find((r) => r.seat === 'north')!;
  const south = reads.find((r) => r.seat === 'south')!;
  expect(north.direction).toBe('left');
  expect(north.passedToMe).toEqual(['dot2', 'dot5', 'crack7']);
  expect(north.sheds.map((t) => t.key)).toEqual(expect.arrayContaining(['suit:dot', 'kind:dot2', 'kind:dot5']));
  expect(north.words.join(' ')).toContain('has passed you two dots');
  // Tiles east passed south in the first right stay with south (south never passed them back).
  expect(south.given).toEqual(['wind-n', 'crack9', 'bam1']);
  expect(south.passedToMe).toEqual(['bam7', 'bam8', 'dragon-green', 'crack5', 'dot3', 'dot8']);
});

test('six tiles from a neighbour and not one of a suit: they may be collecting it', () => {
  // South sent bams, dots and a dragon and a crack: after six tiles, no suit is missing.
  const south = readNeighbours(dotsFromNorth).find((r) => r.seat === 'south')!;
  expect(south.collects).toEqual([]);
  const noBams = historyOf([
    { phase: 'first-left', sent: ['wind-e', 'wind-w', 'crack1'], received: ['dot1', 'dot4', 'crack8'] },
    { phase: 'second-left', sent: ['wind-n', 'dot9', 'crack2'], received: ['crack3', 'dot6', 'wind-s'] },
  ]);
  const read = readNeighbours(noBams).find((r) => r.seat === 'south')!;
  expect(read.collects.map((t) => t.key)).toEqual(['suit:bam']);
  expect(read.words.join(' ')).toContain('not one of the bams');
  const risky = passRisk(['bam5'], 'right', read);
  const safe = passRisk(['dot5'], 'right', read);
  expect(risky.score).toBeCloseTo(DEFENCE.collects);
  expect(risky.words[0]).toContain('may be what they collect');
  expect(safe.score).toBeCloseTo(DEFENCE.sheds);
  expect(safe.level).toBe('low');
  expect(safe.words[0]).toBe('the player on your right keeps passing dots, so the 5 dot looks safe with them');
});

test('a second north wind to the neighbour who has the first makes two of one wind for them', () => {
  const south = readNeighbours(dotsFromNorth).find((r) => r.seat === 'south')!;
  const risk = passRisk(['wind-n', 'dragon-white', 'crack2'], 'right', south);
  expect(risk.score).toBeCloseTo(DEFENCE.repeatKind);
  expect(risk.level).toBe('some');
  expect(risk.words[0]).toBe('with the north wind you passed the player on your right before, this makes two for them');
  // A 2 bam beside the 1 bam already passed them: a run taking shape.
  expect(passRisk(['bam2'], 'right', south).words[0]).toContain('starts a run for them');
});

test('a tile forwarded blind was not the neighbour’s choice, so it says less about them', () => {
  const blind = historyOf([{ phase: 'first-right', sent: ['wind-n', 'crack9', 'bam1'], received: ['dot2', 'dot5', 'crack7'], blind: { north: 2 } }]);
  const north = readNeighbours(blind).find((r) => r.seat === 'north')!;
  expect(north.blindToMe).toBe(2);
  expect(north.settled).toBe(true);
  expect(north.sheds.map((t) => t.key)).not.toContain('suit:dot');
  expect(north.words.join(' ')).toContain('seem settled on a hand');
});

test('without history only the pass itself counts: a pair, a run start, flowers', () => {
  expect(passRisk(['wind-n', 'wind-n', 'dot1'], 'right', null).score).toBeCloseTo(DEFENCE.sameKind);
  expect(passRisk(['bam3', 'bam4', 'dot9'], 'across', null).score).toBeCloseTo(DEFENCE.neighbours);
  expect(passRisk(['flower', 'bam4', 'dot9'], 'left', null).score).toBeCloseTo(DEFENCE.flower);
  expect(passRisk(['bam1', 'crack5', 'dot9'], 'left', null)).toMatchObject({ score: 0, level: 'low', words: [] });
});

// A list in cracks and winds only: bams and dots are dead weight, so which of them go is the
// defence's call alone (the odds of keeping either are the same, draw for draw).
const cracksOnly: Pattern[] = [
  testPattern('cracks', [
    { size: 3, suit: 'crack', rank: 1 },
    { size: 3, suit: 'crack', rank: 2 },
    { size: 3, suit: 'crack', rank: 3 },
    { size: 3, tile: 'wind-e' },
    { size: 2, tile: 'wind-w' },
  ]),
];
const rackWithSpares: TileKind[] = ['crack1', 'crack1', 'crack1', 'crack2', 'crack2', 'crack2', 'crack3', 'crack3', 'wind-e', 'bam4', 'bam8', 'dot4', 'dot8'];

test('the advice does not feed the neighbour what they seem to collect, and feeds them what they pass away', () => {
  // Second left: east passes to north, who passed east dots in the first right.
  const withDots = advisePass(rackWithSpares, cracksOnly, { phase: 'second-left', blindAllowed: false, ...dotsFromNorth })[0];
  expect([...withDots.tiles].sort()).toEqual(expect.arrayContaining(['dot4', 'dot8']));
  expect(withDots.risk.words.join(' ')).toContain('keeps passing dots, so the 4 dot looks safe with them');
  // The same rack with a north who passed bams: the bams go to them instead.
  const bamsFromNorth = historyOf([{ phase: 'first-right', sent: ['wind-n', 'crack9', 'bam1'], received: ['bam2', 'bam5', 'crack7'] }]);
  const withBams = advisePass(rackWithSpares, cracksOnly, { phase: 'second-left', blindAllowed: false, ...bamsFromNorth })[0];
  expect([...withBams.tiles].sort()).toEqual(expect.arrayContaining(['bam4', 'bam8']));
});

test('the advice does not hand a neighbour the second of a wind it already gave them', () => {
  // Second right: east passes to south, who holds the north wind east passed in the first right.
  const rack: TileKind[] = ['crack1', 'crack1', 'crack1', 'crack2', 'crack2', 'crack2', 'crack3', 'crack3', 'wind-e', 'wind-n', 'wind-s', 'dot4', 'bam8'];
  const [best] = advisePass(rack, cracksOnly, { phase: 'second-right', blindAllowed: false, ...dotsFromNorth });
  expect(best.tiles).not.toContain('wind-n');
  expect(best.risk.level).toBe('low');
  const fed = advisePass(rack, cracksOnly, { phase: 'second-right', blindAllowed: false, ...dotsFromNorth }).find((a) => a.tiles.includes('wind-n'))!;
  expect(fed.risk.words[0]).toContain('this makes two for them');
  expect(fed.score).toBeLessThan(best.score);
});
