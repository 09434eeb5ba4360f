/**
 * Rackside's own starter list: practice hands in families we named, in the pattern format.
 * Suit letters A, B, C are distinct suits and the number letter n is any number that keeps every
 * rank within 1 to 9, so one pattern covers every run or match of its shape.
 *
 * Families run by how much the hand leans on jokers and calls: first the hands jokers must fill
 * (quints and sextets), then pungs and kongs of numbers that may take any number (anchor, tide,
 * current), then pungs and kongs of set numbers (skip, shore, scales), then winds, dragons and
 * flowers, and last the sealed hands of singles and pairs, which take no joker and no call.
 * Within a family, from the lowest value up. Sealed hands are built from the player's own draws.
 *
 * Values are measured, not chosen: `npm run bench:list -- --odds-racks 800 --samples 150`
 * dealt 2,000 seeded deals (seed "list-balance"), played each of the first 800 racks out 150
 * times with completionOdds (18 draws, its default call rate, every pattern simulated), and
 * mapped each pattern's mean finishing odds onto Rackside's scale with valueFromOdds
 * (tests/bench/balance-measure.ts): the likeliest pattern 10, the rarest 100, log scale, steps
 * of 5. The odds behind each value are noted above its pattern. Run the bench again after
 * changing a pattern, and write the value it prints.
 *
 * Balance, over the same 2,000 deals (8,000 racks): no pattern is the nearest hand (fewest tiles
 * away) of more than 8% of racks, and the hands of singles and pairs alone are nearest on at
 * most 25% together; tests/unit/analysis/starter-balance.test.ts holds both on pinned deals.
 *
 * Long because it is data: forty patterns in ten families, each with its name, value and words.
 */
import type { Pattern } from './pattern';

export const STARTER_FAMILIES: Readonly<Record<string, string>> = {
  cargo: 'Quints and sextets: more of one tile than the set holds, so jokers are a must.',
  anchor: 'One number held fast in two or three suits.',
  tide: 'Numbers rising in one suit, one step at a time.',
  current: 'Numbers rising while the suit changes at each step.',
  skip: 'Every other number: evens only, or odds only.',
  shore: 'The edges of the suits: ones and nines.',
  scales: 'Numbers in couples that weigh ten together.',
  lighthouse: 'Winds and dragons, with few numbers or none.',
  meadow: 'Flowers, four or more.',
  pebbles: 'Singles and pairs only, sealed: no jokers, no calls.',
};

export const starterPatterns: Pattern[] = [
  // finishes from 0.222% of dealt racks
  {
    id: 'cargo-1', name: 'One number, heavy', family: 'cargo', value: 35, sealed: false,
    groups: [
      { size: 5, suit: 'A', rank: { var: 'n', offset: 0 } },
      { size: 5, suit: 'B', rank: { var: 'n', offset: 0 } },
      { size: 4, tile: 'flower' },
    ],
  },
  // finishes from 0.217% of dealt racks
  {
    id: 'cargo-2', name: 'Sextet under its dragon', family: 'cargo', value: 35, sealed: false,
    groups: [
      { size: 6, suit: 'A', rank: { var: 'n', offset: 0 } },
      { size: 4, dragon: 'match', suit: 'A' },
      { size: 4, tile: 'flower' },
    ],
  },
  // finishes from 0.292% of dealt racks
  {
    id: 'cargo-3', name: 'Flowers by the crate', family: 'cargo', value: 35, sealed: false,
    groups: [
      { size: 5, tile: 'flower' },
      { size: 5, suit: 'A', rank: { var: 'n', offset: 0 } },
      { size: 4, suit: 'A', rank: { var: 'n', offset: 1 } },
    ],
  },
  // finishes from 0.145% of dealt racks
  {
    id: 'cargo-4', name: 'Quint between two kongs', family: 'cargo', value: 40, sealed: false,
    groups: [
      { size: 4, suit: 'A', rank: { var: 'n', offset: 0 } },
      { size: 5, suit: 'A', rank: { var: 'n', offset: 1 } },
      { size: 4, suit: 'A', rank: { var: 'n', offset: 2 } },
      { size: 1, tile: 'flower' },
    ],
  },
  // finishes from 1.322% of dealt racks
  {
    id: 'anchor-1', name: 'Anchored in three suits', family: 'anchor', value: 15, sealed: false,
    groups: [
      { size: 4, suit: 'A', rank: { var: 'n', offset: 0 } },
      { size: 4, suit: 'B', rank: { var: 'n', offset: 0 } },
      { size: 3, suit: 'C', rank: { var: 'n', offset: 0 } },
      { size: 3, tile: 'flower' },
    ],
  },
  // finishes from 0.840% of dealt racks
  {
    id: 'anchor-2', name: 'Anchor and its neighbour', family: 'anchor', value: 20, sealed: false,
    groups: [
      { size: 4, suit: 'A', rank: { var: 'n', offset: 0 } },
      { size: 4, suit: 'B', rank: { var: 'n', offset: 0 } },
      { size: 3, suit: 'A', rank: { var: 'n', offset: 1 } },
      { size: 3, suit: 'B', rank: { var: 'n', offset: 1 } },
    ],
  },
  // finishes from 0.902% of dealt racks
  {
    id: 'anchor-3', name: 'Anchor and two dragons', family: 'anchor', value: 20, sealed: false,
    groups: [
      { size: 4, suit: 'A', rank: { var: 'n', offset: 0 } },
      { size: 4, suit: 'B', rank: { var: 'n', offset: 0 } },
      { size: 3, dragon: 'match', suit: 'A' },
      { size: 3, dragon: 'match', suit: 'B' },
    ],
  },
  // finishes from 0.996% of dealt racks
  {
    id: 'anchor-4', name: 'Anchor in the west wind', family: 'anchor', value: 20, sealed: false,
    groups: [
      { size: 3, suit: 'A', rank: { var: 'n', offset: 0 } },
      { size: 3, suit: 'B', rank: { var: 'n', offset: 0 } },
      { size: 3, suit: 'C', rank: { var: 'n', offset: 0 } },
      { size: 3, tile: 'wind-w' },
      { size: 2, tile: 'wind-e' },
    ],
  },
  // finishes from 0.732% of dealt racks
  {
    id: 'anchor-5', name: 'Anchor between north and south', family: 'anchor', value: 25, sealed: false,
    groups: [
      { size: 4, suit: 'A', rank: { var: 'n', offset: 0 } },
      { size: 4, suit: 'B', rank: { var: 'n', offset: 0 } },
      { size: 3, tile: 'wind-n' },
      { size: 3, tile: 'wind-s' },
    ],
  },
  // finishes from 1.917% of dealt racks
  {
    id: 'tide-1', name: 'Steps to the dragon', family: 'tide', value: 10, sealed: false,
    groups: [
      { size: 3, suit: 'A', rank: { var: 'n', offset: 0 } },
      { size: 3, suit: 'A', rank: { var: 'n', offset: 1 } },
      { size: 3, suit: 'A', rank: { var: 'n', offset: 2 } },
      { size: 2, suit: 'A', rank: { var: 'n', offset: 3 } },
      { size: 3, dragon: 'match', suit: 'A' },
    ],
  },
  // finishes from 1.629% of dealt racks
  {
    id: 'tide-2', name: 'Four steps and a dragon pair', family: 'tide', value: 15, sealed: false,
    groups: [
      { size: 3, suit: 'A', rank: { var: 'n', offset: 0 } },
      { size: 3, suit: 'A', rank: { var: 'n', offset: 1 } },
      { size: 3, suit: 'A', rank: { var: 'n', offset: 2 } },
      { size: 3, suit: 'A', rank: { var: 'n', offset: 3 } },
      { size: 2, dragon: 'match', suit: 'A' },
    ],
  },
  // finishes from 0.625% of dealt racks
  {
    id: 'tide-3', name: 'Climb into the south wind', family: 'tide', value: 25, sealed: false,
    groups: [
      { size: 4, suit: 'A', rank: { var: 'n', offset: 0 } },
      { size: 3, suit: 'A', rank: { var: 'n', offset: 1 } },
      { size: 3, suit: 'A', rank: { var: 'n', offset: 2 } },
      { size: 4, tile: 'wind-s' },
    ],
  },
  // finishes from 0.434% of dealt racks
  {
    id: 'tide-4', name: 'Three steps up', family: 'tide', value: 30, sealed: false,
    groups: [
      { size: 4, suit: 'A', rank: { var: 'n', offset: 0 } },
      { size: 4, suit: 'A', rank: { var: 'n', offset: 1 } },
      { size: 4, suit: 'A', rank: { var: 'n', offset: 2 } },
      { size: 2, tile: 'flower' },
    ],
  },
  // finishes from 0.424% of dealt racks
  {
    id: 'tide-5', name: 'Long tide, pairs and pungs', family: 'tide', value: 30, sealed: false,
    groups: [
      { size: 2, suit: 'A', rank: { var: 'n', offset: 0 } },
      { size: 3, suit: 'A', rank: { var: 'n', offset: 1 } },
      { size: 2, suit: 'A', rank: { var: 'n', offset: 2 } },
      { size: 3, suit: 'A', rank: { var: 'n', offset: 3 } },
      { size: 4, suit: 'A', rank: { var: 'n', offset: 4 } },
    ],
  },
  // finishes from 0.013% of dealt racks
  {
    id: 'tide-6', name: 'Sealed stairs', family: 'tide', value: 70, sealed: true,
    groups: [
      { size: 4, suit: 'A', rank: { var: 'n', offset: 0 } },
      { size: 4, suit: 'A', rank: { var: 'n', offset: 1 } },
      { size: 4, suit: 'A', rank: { var: 'n', offset: 2 } },
      { size: 2, suit: 'A', rank: { var: 'n', offset: 3 } },
    ],
  },
  // finishes from 0.860% of dealt racks
  {
    id: 'current-1', name: 'Across the three suits', family: 'current', value: 20, sealed: false,
    groups: [
      { size: 4, suit: 'A', rank: { var: 'n', offset: 0 } },
      { size: 3, suit: 'B', rank: { var: 'n', offset: 1 } },
      { size: 4, suit: 'C', rank: { var: 'n', offset: 2 } },
      { size: 3, tile: 'wind-n' },
    ],
  },
  // finishes from 0.782% of dealt racks
  {
    id: 'current-2', name: 'Back and forth', family: 'current', value: 20, sealed: false,
    groups: [
      { size: 4, suit: 'A', rank: { var: 'n', offset: 0 } },
      { size: 3, suit: 'B', rank: { var: 'n', offset: 1 } },
      { size: 3, suit: 'A', rank: { var: 'n', offset: 2 } },
      { size: 4, suit: 'B', rank: { var: 'n', offset: 3 } },
    ],
  },
  // finishes from 0.847% of dealt racks
  {
    id: 'current-3', name: 'Four-step braid', family: 'current', value: 20, sealed: false,
    groups: [
      { size: 4, suit: 'A', rank: { var: 'n', offset: 0 } },
      { size: 3, suit: 'B', rank: { var: 'n', offset: 1 } },
      { size: 3, suit: 'C', rank: { var: 'n', offset: 2 } },
      { size: 4, suit: 'A', rank: { var: 'n', offset: 3 } },
    ],
  },
  // finishes from 0.663% of dealt racks
  {
    id: 'current-4', name: 'Current past the east wind', family: 'current', value: 25, sealed: false,
    groups: [
      { size: 4, suit: 'A', rank: { var: 'n', offset: 0 } },
      { size: 3, suit: 'B', rank: { var: 'n', offset: 1 } },
      { size: 3, suit: 'C', rank: { var: 'n', offset: 2 } },
      { size: 4, tile: 'wind-e' },
    ],
  },
  // finishes from 1.844% of dealt racks
  {
    id: 'skip-1', name: 'Evens in a row', family: 'skip', value: 10, sealed: false,
    groups: [
      { size: 3, suit: 'A', rank: 2 },
      { size: 3, suit: 'A', rank: 4 },
      { size: 3, suit: 'A', rank: 6 },
      { size: 3, suit: 'A', rank: 8 },
      { size: 2, tile: 'flower' },
    ],
  },
  // finishes from 2.200% of dealt racks
  {
    id: 'skip-2', name: 'Odds with a flower pair', family: 'skip', value: 10, sealed: false,
    groups: [
      { size: 2, tile: 'flower' },
      { size: 3, suit: 'A', rank: 1 },
      { size: 3, suit: 'A', rank: 5 },
      { size: 3, suit: 'A', rank: 9 },
      { size: 3, suit: 'B', rank: 3 },
    ],
  },
  // finishes from 1.069% of dealt racks
  {
    id: 'skip-3', name: 'Evens split by a dragon', family: 'skip', value: 20, sealed: false,
    groups: [
      { size: 3, suit: 'A', rank: 2 },
      { size: 3, suit: 'A', rank: 4 },
      { size: 3, suit: 'B', rank: 6 },
      { size: 3, suit: 'B', rank: 8 },
      { size: 2, dragon: 'match', suit: 'C' },
    ],
  },
  // finishes from 1.018% of dealt racks
  {
    id: 'skip-4', name: 'Odds woven through three suits', family: 'skip', value: 20, sealed: false,
    groups: [
      { size: 3, suit: 'A', rank: 3 },
      { size: 3, suit: 'B', rank: 5 },
      { size: 3, suit: 'C', rank: 7 },
      { size: 2, suit: 'A', rank: 9 },
      { size: 3, dragon: 'match', suit: 'C' },
    ],
  },
  // finishes from 0.301% of dealt racks
  {
    id: 'skip-5', name: 'High odds in two suits', family: 'skip', value: 35, sealed: false,
    groups: [
      { size: 4, suit: 'A', rank: 3 },
      { size: 3, suit: 'A', rank: 5 },
      { size: 3, suit: 'B', rank: 7 },
      { size: 4, suit: 'B', rank: 9 },
    ],
  },
  // finishes from 1.476% of dealt racks
  {
    id: 'shore-1', name: 'Both shores, two suits', family: 'shore', value: 15, sealed: false,
    groups: [
      { size: 3, suit: 'A', rank: 1 },
      { size: 3, suit: 'A', rank: 9 },
      { size: 3, suit: 'B', rank: 1 },
      { size: 3, suit: 'B', rank: 9 },
      { size: 2, tile: 'flower' },
    ],
  },
  // finishes from 1.323% of dealt racks
  {
    id: 'shore-2', name: 'Ones in every suit', family: 'shore', value: 15, sealed: false,
    groups: [
      { size: 3, suit: 'A', rank: 1 },
      { size: 3, suit: 'B', rank: 1 },
      { size: 3, suit: 'C', rank: 1 },
      { size: 3, tile: 'flower' },
      { size: 2, suit: 'A', rank: 9 },
    ],
  },
  // finishes from 0.209% of dealt racks
  {
    id: 'shore-3', name: 'Shore light', family: 'shore', value: 35, sealed: false,
    groups: [
      { size: 4, suit: 'A', rank: 1 },
      { size: 4, suit: 'A', rank: 9 },
      { size: 3, dragon: 'match', suit: 'A' },
      { size: 3, tile: 'wind-e' },
    ],
  },
  // finishes from 1.808% of dealt racks
  {
    id: 'scales-1', name: 'Ten in one suit', family: 'scales', value: 10, sealed: false,
    groups: [
      { size: 3, suit: 'A', rank: 1 },
      { size: 3, suit: 'A', rank: 9 },
      { size: 3, suit: 'A', rank: 4 },
      { size: 3, suit: 'A', rank: 6 },
      { size: 2, tile: 'flower' },
    ],
  },
  // finishes from 0.317% of dealt racks
  {
    id: 'scales-2', name: 'Ten across two suits', family: 'scales', value: 30, sealed: false,
    groups: [
      { size: 4, suit: 'A', rank: 3 },
      { size: 4, suit: 'B', rank: 7 },
      { size: 3, suit: 'A', rank: 2 },
      { size: 3, suit: 'B', rank: 8 },
    ],
  },
  // finishes from 0.002% of dealt racks
  {
    id: 'scales-3', name: 'Balanced pairs', family: 'scales', value: 90, sealed: true,
    groups: [
      { size: 2, suit: 'A', rank: 1 },
      { size: 2, suit: 'A', rank: 9 },
      { size: 2, suit: 'A', rank: 2 },
      { size: 2, suit: 'A', rank: 8 },
      { size: 2, suit: 'A', rank: 4 },
      { size: 2, suit: 'A', rank: 6 },
      { size: 2, suit: 'A', rank: 5 },
    ],
  },
  // finishes from 0.469% of dealt racks
  {
    id: 'lighthouse-1', name: 'Three dragons and a wind', family: 'lighthouse', value: 30, sealed: false,
    groups: [
      { size: 3, tile: 'dragon-red' },
      { size: 3, tile: 'dragon-green' },
      { size: 3, tile: 'dragon-white' },
      { size: 4, tile: 'wind-n' },
      { size: 1, tile: 'flower' },
    ],
  },
  // finishes from 0.081% of dealt racks
  {
    id: 'lighthouse-2', name: 'Four winds, east and west heavy', family: 'lighthouse', value: 50, sealed: false,
    groups: [
      { size: 4, tile: 'wind-e' },
      { size: 4, tile: 'wind-w' },
      { size: 3, tile: 'wind-n' },
      { size: 3, tile: 'wind-s' },
    ],
  },
  // finishes from 0.024% of dealt racks
  {
    id: 'lighthouse-3', name: 'Winds paired, dragons in pungs', family: 'lighthouse', value: 60, sealed: false,
    groups: [
      { size: 2, tile: 'wind-n' },
      { size: 2, tile: 'wind-e' },
      { size: 2, tile: 'wind-w' },
      { size: 2, tile: 'wind-s' },
      { size: 3, dragon: 'match', suit: 'A' },
      { size: 3, dragon: 'match', suit: 'B' },
    ],
  },
  // finishes from 2.043% of dealt racks
  {
    id: 'meadow-1', name: 'Meadow and one number', family: 'meadow', value: 10, sealed: false,
    groups: [
      { size: 4, tile: 'flower' },
      { size: 4, suit: 'A', rank: { var: 'n', offset: 0 } },
      { size: 3, suit: 'B', rank: { var: 'n', offset: 0 } },
      { size: 3, suit: 'C', rank: { var: 'n', offset: 0 } },
    ],
  },
  // finishes from 1.152% of dealt racks
  {
    id: 'meadow-2', name: 'Flowers over evens', family: 'meadow', value: 15, sealed: false,
    groups: [
      { size: 5, tile: 'flower' },
      { size: 3, suit: 'A', rank: 2 },
      { size: 3, suit: 'A', rank: 4 },
      { size: 3, suit: 'A', rank: 6 },
    ],
  },
  // finishes from 0.486% of dealt racks
  {
    id: 'meadow-3', name: 'Flowers in the wind', family: 'meadow', value: 25, sealed: false,
    groups: [
      { size: 4, tile: 'flower' },
      { size: 3, tile: 'wind-n' },
      { size: 3, tile: 'wind-s' },
      { size: 4, tile: 'wind-e' },
    ],
  },
  // finishes from 0.180% of dealt racks
  {
    id: 'meadow-4', name: 'Flowers between dragons', family: 'meadow', value: 40, sealed: false,
    groups: [
      { size: 4, tile: 'flower' },
      { size: 4, dragon: 'match', suit: 'A' },
      { size: 4, dragon: 'match', suit: 'B' },
      { size: 2, dragon: 'match', suit: 'C' },
    ],
  },
  // finishes from 0.005% of dealt racks
  {
    id: 'pebbles-1', name: 'Seven pairs climbing', family: 'pebbles', value: 80, sealed: true,
    groups: [
      { size: 2, suit: 'A', rank: { var: 'n', offset: 0 } },
      { size: 2, suit: 'A', rank: { var: 'n', offset: 1 } },
      { size: 2, suit: 'A', rank: { var: 'n', offset: 2 } },
      { size: 2, suit: 'A', rank: { var: 'n', offset: 3 } },
      { size: 2, suit: 'A', rank: { var: 'n', offset: 4 } },
      { size: 2, suit: 'A', rank: { var: 'n', offset: 5 } },
      { size: 2, suit: 'A', rank: { var: 'n', offset: 6 } },
    ],
  },
  // finishes from 0.001% of dealt racks
  {
    id: 'pebbles-2', name: 'Seven honour pairs', family: 'pebbles', value: 100, sealed: true,
    groups: [
      { size: 2, tile: 'wind-n' },
      { size: 2, tile: 'wind-e' },
      { size: 2, tile: 'wind-w' },
      { size: 2, tile: 'wind-s' },
      { size: 2, tile: 'dragon-red' },
      { size: 2, tile: 'dragon-green' },
      { size: 2, tile: 'dragon-white' },
    ],
  },
  // finishes from 0.001% of dealt racks
  {
    id: 'pebbles-3', name: 'Odd pairs and far shores', family: 'pebbles', value: 100, sealed: true,
    groups: [
      { size: 2, suit: 'A', rank: 1 },
      { size: 2, suit: 'A', rank: 3 },
      { size: 2, suit: 'A', rank: 5 },
      { size: 2, suit: 'A', rank: 7 },
      { size: 2, suit: 'A', rank: 9 },
      { size: 2, suit: 'B', rank: 1 },
      { size: 2, suit: 'B', rank: 9 },
    ],
  },
];
