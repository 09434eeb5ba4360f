import { expect, test } from 'vitest';
import { advisePass, LIVE, missingPrice, rackFocus, starterPatterns, type Pattern } from '../../../shared/analysis';
import { createExchange } from '../../../shared/exchange';
import { rankOf, type TileKind } from '../../../shared/tiles';
import { testPattern } from './helpers';

const evensRack: TileKind[] = ['bam2', 'bam2', 'bam4', 'bam4', 'bam6', 'bam6', 'bam8', 'bam8', 'flower', 'crack3', 'wind-w', 'dot7', 'crack9'];

test('a rack building evens leans to evens, and its odd tiles and the lone wind are spare', () => {
  const focus = rackFocus(evensRack, starterPatterns, { phase: 'first-right' });
  expect(focus.live[0].lean).toBe('evens');
  expect(focus.words.join(' ')).toContain('lean to evens');
  expect([...focus.spare].sort()).toEqual(['crack3', 'crack9', 'dot7', 'wind-w']);
});

test('a rack building evens is not advised to pass an even', () => {
  for (const phase of ['first-right', 'first-across', 'second-left'] as const) {
    const [best] = advisePass(evensRack, starterPatterns, { phase, blindAllowed: false });
    expect(best.tiles.filter((k) => rankOf(k) !== null && rankOf(k)! % 2 === 0)).toEqual([]);
    expect(best.details.find((d) => d.kind === 'pro')!.text).toMatch(/to finish Evens/);
  }
});

const jokerAndFlowers: TileKind[] = ['joker', 'flower', 'flower', 'flower', 'bam3', 'bam7', 'crack2', 'crack5', 'dot9', 'wind-n', 'dragon-red', 'dot4', 'crack8'];

/** Whether a joker can stand in anywhere in the cheapest way to finish the pattern from these tiles. */
const jokerLive = (rack: readonly TileKind[], pattern: Pattern) => missingPrice(rack.filter((k) => k !== 'joker'), pattern).missing.some((m) => m.jokerable);

test('a rack with a joker and several flowers is not pointed at a hand where the joker is dead', () => {
  const focus = rackFocus(jokerAndFlowers, starterPatterns, { phase: 'first-right' });
  expect(focus.deadJokers).toBe(0);
  expect(focus.best!.takesJokers).toBe(true);
  const [best] = advisePass(jokerAndFlowers, starterPatterns, { phase: 'first-right', blindAllowed: false });
  const toward = starterPatterns.find((p) => p.id === best.toward!.id)!;
  const kept = [...jokerAndFlowers];
  for (const k of best.tiles) kept.splice(kept.indexOf(k), 1);
  expect(jokerLive(kept, toward)).toBe(true);
  expect(best.tiles).not.toContain('flower');
});

test('over dealt racks with a joker, the advice points at a hand that can use it', () => {
  let checked = 0;
  for (let i = 0; checked < 10 && i < 400; i++) {
    const rack = createExchange({ seed: `focus-joker-${i}` }).racks.south.map((t) => t.kind);
    if (!rack.includes('joker') || rack.filter((k) => k === 'flower').length < 2) continue;
    checked++;
    const [best] = advisePass(rack, starterPatterns, { phase: 'first-right', blindAllowed: false });
    const toward = starterPatterns.find((p) => p.id === best.toward!.id)!;
    const kept = [...rack];
    for (const k of best.tiles) kept.splice(kept.indexOf(k), 1);
    expect(jokerLive(kept, toward), `${rack.join(' ')} → ${toward.id}`).toBe(true);
  }
  expect(checked).toBe(10);
});

test('runs are told by where they are still open; flexible tiles serve two live families or more', () => {
  const runs: TileKind[] = ['dot3', 'dot4', 'dot4', 'dot5', 'dot6', 'dot6', 'bam1', 'crack9', 'wind-e', 'dragon-red', 'flower', 'bam8', 'crack2'];
  const focus = rackFocus(runs, starterPatterns, { phase: 'first-right' });
  expect(focus.words.join(' ')).toMatch(/Runs still open from \d to \d in dots/);
  const flexible = focus.flexible.find((f) => f.kind === 'dot4')!;
  expect(flexible.families.length).toBeGreaterThanOrEqual(2);
  for (const f of focus.flexible) expect(focus.live.filter((l) => f.families.includes(l.family))).toHaveLength(f.families.length);
  expect(focus.spare).toEqual(expect.arrayContaining(['wind-e', 'dragon-red']));
  expect(focus.live.length).toBeLessThanOrEqual(LIVE.max);
});

test('with several families close, the teacher says to keep gathering; with one far ahead, to pick', () => {
  const scattered: TileKind[] = ['bam1', 'bam5', 'bam9', 'crack2', 'crack6', 'dot3', 'dot7', 'wind-n', 'wind-e', 'dragon-red', 'dragon-green', 'flower', 'dot9'];
  const early = rackFocus(scattered, starterPatterns, { phase: 'first-right' });
  expect(early.pick).toBe(false);
  expect(early.words[0]).toMatch(/^Keep gathering: (two|three|four|five) families still live/);
  const near = rackFocus(['bam2', 'bam2', 'bam2', 'bam4', 'bam4', 'bam4', 'bam6', 'bam6', 'bam6', 'bam8', 'bam8', 'bam8', 'flower'], starterPatterns, { phase: 'first-right' });
  expect(near.pick).toBe(true);
  expect(near.best!.id).toBe('skip-1');
  expect(near.words[0]).toMatch(/^Time to pick: lean to evens/);
});

test('a joker no live hand has room for is called dead', () => {
  // Only singles and pairs: no group a joker may fill (jokers stand in for pungs and up; common practice, no published source).
  const pairsOnly = testPattern('pairs', [
    { size: 2, suit: 'dot', rank: 1 },
    { size: 2, suit: 'dot', rank: 2 },
    { size: 2, suit: 'dot', rank: 3 },
    { size: 2, suit: 'dot', rank: 4 },
    { size: 2, suit: 'dot', rank: 5 },
    { size: 2, suit: 'dot', rank: 6 },
    { size: 2, suit: 'dot', rank: 7 },
  ]);
  const focus = rackFocus(['joker', 'dot1', 'dot1', 'dot2', 'dot3', 'dot4', 'dot5', 'dot6', 'dot7', 'bam1', 'bam2', 'crack3', 'wind-n'], [pairsOnly]);
  expect(focus.deadJokers).toBe(1);
  expect(focus.live[0].lean).toBe('runs from 1 to 7 in dots in singles and pairs, no jokers');
  expect(focus.words.join(' ')).toContain('No live family has room for your joker');
});
