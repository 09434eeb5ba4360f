import fc from 'fast-check';
import { expect, test } from 'vitest';
import {
  enumerateAssignments,
  fitDetail,
  groupKind,
  starterPatterns,
  tilesAway,
  validatePattern,
  type Group,
  type Pattern,
} from '../../../shared/analysis';
import { copiesInSet, fullSet, TILE_KINDS, type TileKind } from '../../../shared/tiles';
import { naiveAway, testPattern } from './helpers';

const SEED = 20240601;
const set = fullSet();
const anyPattern = fc.constantFrom(...starterPatterns);
/** A real rack: 13 or 14 distinct tiles of the 152. */
const anyRack = fc
  .shuffledSubarray(
    set.map((_, i) => i),
    { minLength: 13, maxLength: 14 },
  )
  .map((indexes) => indexes.map((i) => set[i]));

/** One tile of a completed hand: the kind its group takes, and whether a joker may stand in for it. */
interface Slot {
  kind: TileKind;
  big: boolean;
}

/** A hand that completes `pattern` by one of its assignments, some big-group tiles swapped for jokers; with each tile's slot. */
function completeSlots(pattern: Pattern, which: number, jokerMask: number): { hand: TileKind[]; slots: Slot[] } {
  const assignments = enumerateAssignments(pattern);
  const assignment = assignments[which % assignments.length];
  const hand: TileKind[] = [];
  const slots: Slot[] = [];
  const used = new Map<TileKind, number>();
  let jokers = 0;
  let bit = 0;
  for (const group of pattern.groups) {
    const kind = groupKind(group, assignment);
    for (let i = 0; i < group.size; i++) {
      const big = group.size >= 3;
      slots.push({ kind, big });
      const over = (used.get(kind) ?? 0) >= copiesInSet(kind);
      // A natural beyond the set's copies must be a joker; otherwise some big-group tiles become jokers at random.
      if (big && jokers < 8 && (over || (jokerMask >> bit++ % 30) & 1)) {
        hand.push('joker');
        jokers++;
      } else {
        hand.push(kind);
        used.set(kind, (used.get(kind) ?? 0) + 1);
      }
    }
  }
  return { hand, slots };
}

function completeHand(pattern: Pattern, which: number, jokerMask: number): TileKind[] {
  return completeSlots(pattern, which, jokerMask).hand;
}

/**
 * A hand that is 0 away by construction: a completed hand, then some tiles traded between their
 * natural and a joker where the rules allow it (a joker only in a group of three or more, at most
 * 8 jokers and as many naturals as the set holds), then put in any order.
 */
const completeVariant = fc
  .tuple(anyPattern, fc.nat(), fc.nat(), fc.array(fc.tuple(fc.nat(13), fc.boolean()), { maxLength: 4 }), fc.array(fc.nat(), { minLength: 14, maxLength: 14 }))
  .map(([pattern, which, mask, trades, order]) => {
    const { hand, slots } = completeSlots(pattern, which, mask);
    for (const [at, toJoker] of trades) {
      const { kind, big } = slots[at];
      const count = (k: TileKind) => hand.filter((h) => h === k).length;
      if (toJoker && big && hand[at] !== 'joker' && count('joker') < 8) hand[at] = 'joker';
      if (!toJoker && hand[at] === 'joker' && count(kind) < copiesInSet(kind)) hand[at] = kind;
    }
    const shuffled = hand.map((kind, i) => ({ kind, key: order[i] })).sort((a, b) => a.key - b.key).map((t) => t.kind);
    return { pattern, hand: shuffled };
  });

test('tilesAway is a whole number from 0 to 14, and at least 1 for a 13-tile rack', () => {
  fc.assert(
    fc.property(anyRack, anyPattern, (hand, pattern) => {
      const away = tilesAway(hand, pattern);
      expect(Number.isInteger(away)).toBe(true);
      expect(away).toBeGreaterThanOrEqual(hand.length === 13 ? 1 : 0);
      expect(away).toBeLessThanOrEqual(14);
    }),
    { seed: SEED, numRuns: 300 },
  );
});

test('a hand built from an explicit assignment is 0 away, and 1 away without one of its tiles', () => {
  fc.assert(
    fc.property(anyPattern, fc.nat(), fc.nat(), fc.nat(13), (pattern, which, mask, drop) => {
      const hand = completeHand(pattern, which, mask);
      expect(hand).toHaveLength(14);
      expect(tilesAway(hand, pattern)).toBe(0);
      expect(tilesAway(hand.filter((_, i) => i !== drop), pattern)).toBe(1);
    }),
    { seed: SEED, numRuns: 300 },
  );
});

test('0 away: the assignment fitDetail names holds every tile of the hand', () => {
  let reached = 0;
  fc.assert(
    fc.property(completeVariant, ({ pattern, hand }) => {
      expect(tilesAway(hand, pattern)).toBe(0);
      const detail = fitDetail(hand, pattern);
      const groups = pattern.groups.map((g) => ({ kind: groupKind(g, detail.assignment), size: g.size }));
      // Place every hand tile in a group of that assignment: naturals by kind, jokers only in groups of 3+.
      const left = groups.map((g) => g.size);
      const naturals = hand.filter((k) => k !== 'joker');
      expect(naturals.length).toBeGreaterThan(0);
      for (const kind of naturals) {
        const smallFirst = groups.map((g, i) => ({ ...g, i })).sort((a, b) => a.size - b.size);
        const slot = smallFirst.find((g) => g.kind === kind && left[g.i] > 0);
        expect(slot, `a place for ${kind}`).toBeDefined();
        left[slot!.i]--;
      }
      const jokers = hand.length - naturals.length;
      const bigRoom = groups.reduce((sum, g, i) => sum + (g.size >= 3 ? left[i] : 0), 0);
      const smallRoom = groups.reduce((sum, g, i) => sum + (g.size < 3 ? left[i] : 0), 0);
      expect(smallRoom).toBe(0);
      expect(bigRoom).toBe(jokers);
      reached++;
    }),
    { seed: SEED, numRuns: 400 },
  );
  // Every run is 0 away by construction, so every run reached the placement check.
  expect(reached).toBe(400);
});

test('swapping a spare tile for a tile the pattern needs takes exactly one tile off', () => {
  fc.assert(
    fc.property(anyRack, anyPattern, fc.nat(), fc.nat(), (hand, pattern, pickSpare, pickNeed) => {
      const before = fitDetail(hand, pattern);
      const spare = [...hand];
      for (const kind of before.keep) spare.splice(spare.indexOf(kind), 1);
      const needed = before.need.filter((k) => hand.filter((h) => h === k).length < copiesInSet(k));
      // A random rack is far from every pattern: it always has a spare tile and a tile to wish for.
      expect(spare.length).toBeGreaterThan(0);
      expect(needed.length).toBeGreaterThan(0);
      const out = spare[pickSpare % spare.length];
      const swapped = [...hand];
      swapped.splice(swapped.indexOf(out), 1, needed[pickNeed % needed.length]);
      const after = tilesAway(swapped, pattern);
      expect(after).toBeLessThanOrEqual(before.away); // never rises
      expect(after).toBe(before.away - 1);
    }),
    { seed: SEED, numRuns: 300 },
  );
});

/** Small hands from a few kinds, so that patterns over those kinds are often close. */
const FEW: TileKind[] = ['bam1', 'bam2', 'bam3', 'crack1', 'crack2', 'dot1', 'dot3', 'flower', 'dragon-green', 'dragon-red', 'wind-n', 'joker'];
const smallHand = fc.array(fc.constantFrom(...FEW), { minLength: 0, maxLength: 14 }).filter((hand) => FEW.every((k) => hand.filter((h) => h === k).length <= copiesInSet(k)));

/** Random valid patterns over suit letters, rank variables, fixed tiles and matching dragons. */
const anyGroup: fc.Arbitrary<Omit<Group, 'size'>> = fc.oneof(
  fc.constantFrom<TileKind>('flower', 'wind-n', 'dragon-red', 'bam1', 'dot3').map((tile) => ({ tile })),
  fc.record({ suit: fc.constantFrom('A', 'B', 'C', 'bam'), rank: fc.integer({ min: 1, max: 3 }) }),
  fc.record({ suit: fc.constantFrom('A', 'B'), rank: fc.record({ var: fc.constantFrom('n', 'm'), offset: fc.integer({ min: -1, max: 2 }) }) }),
  fc.record({ dragon: fc.constant('match' as const), suit: fc.constantFrom('A', 'B') }),
) as fc.Arbitrary<Omit<Group, 'size'>>;
const sizesTo14 = fc.array(fc.integer({ min: 1, max: 6 }), { minLength: 3, maxLength: 10 }).map((sizes) => {
  const out: number[] = [];
  let left = 14;
  for (const s of sizes) {
    if (left === 0) break;
    out.push(Math.min(s, left));
    left -= out[out.length - 1];
  }
  while (left > 0) {
    out.push(Math.min(6, left));
    left -= out[out.length - 1];
  }
  return out;
});
const randomPattern = fc
  .tuple(sizesTo14, fc.array(anyGroup, { minLength: 14, maxLength: 14 }))
  .map(([sizes, shapes]) => testPattern('random-01', sizes.map((size, i) => ({ size, ...shapes[i] }) as Group)))
  .filter((p) => validatePattern(p).length === 0);

test('brute force agrees with the fast path on random patterns and small hands', () => {
  fc.assert(
    fc.property(randomPattern, smallHand, (pattern, hand) => {
      expect(tilesAway(hand, pattern)).toBe(naiveAway(hand, pattern));
    }),
    { seed: SEED, numRuns: 300 },
  );
});

test('brute force agrees with the fast path on the starter list and real racks', () => {
  fc.assert(
    fc.property(fc.oneof(anyRack, smallHand), anyPattern, (hand, pattern) => {
      expect(tilesAway(hand, pattern)).toBe(naiveAway(hand, pattern));
    }),
    { seed: SEED, numRuns: 150 },
  );
});

test('brute force agrees on near-complete hands, where jokers and pairs decide', () => {
  fc.assert(
    fc.property(anyPattern, fc.nat(), fc.nat(), fc.array(fc.tuple(fc.nat(13), fc.constantFrom(...TILE_KINDS)), { maxLength: 3 }), (pattern, which, mask, swaps) => {
      const hand = completeHand(pattern, which, mask);
      for (const [at, kind] of swaps) hand[at] = kind;
      expect(tilesAway(hand, pattern)).toBe(naiveAway(hand, pattern));
    }),
    { seed: SEED, numRuns: 150 },
  );
});
