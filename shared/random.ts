/**
 * The only source of chance in Rackside. Every generator is seeded from the exchange's seed
 * plus a label saying what it is for (and, during play, the log position), so the same seed
 * and log give the same choices on any machine. Never the clock, never an unseeded source.
 */
import seedrandom from 'seedrandom';

/** A generator of floats in [0, 1). */
export type Rng = () => number;

/**
 * A generator for one purpose within one exchange. The parts are joined unambiguously, so
 * ('ab', 'c') and ('a', 'bc') give different streams.
 */
export function rngFor(seed: string, ...purpose: (string | number)[]): Rng {
  return seedrandom(JSON.stringify([seed, ...purpose]));
}

/** A whole number in [0, n). */
export function randomInt(rng: Rng, n: number): number {
  return Math.floor(rng() * n);
}

/** A shuffled copy (Fisher–Yates, walking down from the last position). */
export function shuffle<T>(items: readonly T[], rng: Rng): T[] {
  const out = items.slice();
  for (let i = out.length - 1; i > 0; i--) {
    const j = randomInt(rng, i + 1);
    const held = out[i];
    out[i] = out[j];
    out[j] = held;
  }
  return out;
}

/**
 * `count` distinct items chosen at random, and the rest, both in a stable order: the
 * chosen in the order drawn, the rest in their original order. A partial Fisher–Yates.
 */
export function pickSome<T>(items: readonly T[], count: number, rng: Rng): { chosen: T[]; rest: T[] } {
  const pool = items.map((_, index) => index);
  const n = Math.min(count, pool.length);
  for (let i = 0; i < n; i++) {
    const j = i + randomInt(rng, pool.length - i);
    const held = pool[i];
    pool[i] = pool[j];
    pool[j] = held;
  }
  const chosenIndexes = pool.slice(0, n);
  const taken = new Set(chosenIndexes);
  return {
    chosen: chosenIndexes.map((index) => items[index]),
    rest: items.filter((_, index) => !taken.has(index)),
  };
}

/**
 * `count` tile ids for one exchange: the labels t1…tN in an order drawn from the seed. The
 * engine hands them to the tiles of the set in the set's fixed order, so which label a tile
 * gets is random and an id tells nothing about the tile's kind.
 */
export function opaqueIds(seed: string, count: number): string[] {
  const labels = Array.from({ length: count }, (_, index) => `t${index + 1}`);
  return shuffle(labels, rngFor(seed, 'tile-ids'));
}
