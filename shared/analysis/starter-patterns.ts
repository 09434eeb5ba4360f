/**
 * Rackside's own starter list: original practice patterns, grouped in families we named.
 * Pure data in the pattern format; suit letters A, B, C are distinct suits, and rank
 * variables (n, m) are distinct numbers with offsets, so one pattern covers every run or match.
 */
import type { Pattern } from './pattern';

/** Each family in a sentence, for the pattern list screen. */
export const STARTER_FAMILIES: Readonly<Record<string, string>> = {
  even: 'Even numbers only: 2, 4, 6 and 8.',
  odd: 'Odd numbers only: 1, 3, 5, 7 and 9.',
  ladder: 'A run of numbers climbing in one suit.',
  braid: 'A run of numbers that changes suit at each step.',
  mirror: 'The same number repeated in different suits.',
  compass: 'Built mostly from winds and dragons.',
  garden: 'Four or more flowers.',
  crowd: 'A quint or sextet, so jokers are a must.',
  quiet: 'Singles and pairs, kept concealed: no jokers anywhere.',
  edges: 'Only the ends of the suits, 1 and 9, with dragons.',
  squares: 'Only the square numbers 1, 4 and 9.',
  primes: 'Only the prime numbers 2, 3, 5 and 7.',
  tens: 'Numbers in couples that add up to ten.',
};

export const starterPatterns: Pattern[] = [
  {
    id: 'even-01', name: 'Even climb in one suit', family: 'even', value: 25, sealed: false,
    groups: [
      { size: 4, suit: 'A', rank: 2 },
      { size: 3, suit: 'A', rank: 4 },
      { size: 3, suit: 'A', rank: 6 },
      { size: 4, suit: 'A', rank: 8 },
    ],
  },
  {
    id: 'even-02', name: 'Evens split two ways', family: 'even', value: 25, sealed: false,
    groups: [
      { size: 4, suit: 'A', rank: 2 },
      { size: 4, suit: 'A', rank: 4 },
      { size: 3, suit: 'B', rank: 6 },
      { size: 3, suit: 'B', rank: 8 },
    ],
  },
  {
    id: 'even-03', name: 'Evens woven through three suits', family: 'even', value: 30, sealed: false,
    groups: [
      { size: 2, tile: 'flower' },
      { size: 3, suit: 'A', rank: 2 },
      { size: 3, suit: 'B', rank: 4 },
      { size: 3, suit: 'C', rank: 6 },
      { size: 3, suit: 'A', rank: 8 },
    ],
  },
  {
    id: 'even-04', name: 'Evens with their dragon', family: 'even', value: 25, sealed: false,
    groups: [
      { size: 3, suit: 'A', rank: 2 },
      { size: 3, suit: 'A', rank: 4 },
      { size: 3, suit: 'A', rank: 6 },
      { size: 3, dragon: 'match', suit: 'A' },
      { size: 2, suit: 'A', rank: 8 },
    ],
  },
  {
    id: 'odd-01', name: 'Every odd in one suit', family: 'odd', value: 30, sealed: false,
    groups: [
      { size: 2, suit: 'A', rank: 1 },
      { size: 3, suit: 'A', rank: 3 },
      { size: 3, suit: 'A', rank: 5 },
      { size: 3, suit: 'A', rank: 7 },
      { size: 3, suit: 'A', rank: 9 },
    ],
  },
  {
    id: 'odd-02', name: 'Odd kongs in two suits', family: 'odd', value: 25, sealed: false,
    groups: [
      { size: 4, suit: 'A', rank: 1 },
      { size: 4, suit: 'A', rank: 3 },
      { size: 3, suit: 'B', rank: 5 },
      { size: 3, suit: 'B', rank: 7 },
    ],
  },
  {
    id: 'odd-03', name: 'Odds and a north', family: 'odd', value: 25, sealed: false,
    groups: [
      { size: 4, suit: 'A', rank: 1 },
      { size: 3, suit: 'A', rank: 5 },
      { size: 4, suit: 'A', rank: 9 },
      { size: 3, tile: 'wind-n' },
    ],
  },
  {
    id: 'odd-04', name: 'Odd kongs around flowers', family: 'odd', value: 30, sealed: false,
    groups: [
      { size: 4, tile: 'flower' },
      { size: 4, suit: 'A', rank: 3 },
      { size: 4, suit: 'B', rank: 7 },
      { size: 2, suit: 'C', rank: 5 },
    ],
  },
  {
    id: 'ladder-01', name: 'Four rungs', family: 'ladder', value: 25, sealed: false,
    groups: [
      { size: 3, suit: 'A', rank: { var: 'n', offset: 0 } },
      { size: 3, suit: 'A', rank: { var: 'n', offset: 1 } },
      { size: 4, suit: 'A', rank: { var: 'n', offset: 2 } },
      { size: 4, suit: 'A', rank: { var: 'n', offset: 3 } },
    ],
  },
  {
    id: 'ladder-02', name: 'Five rungs', family: 'ladder', value: 30, sealed: false,
    groups: [
      { size: 2, suit: 'A', rank: { var: 'n', offset: 0 } },
      { size: 3, suit: 'A', rank: { var: 'n', offset: 1 } },
      { size: 3, suit: 'A', rank: { var: 'n', offset: 2 } },
      { size: 3, suit: 'A', rank: { var: 'n', offset: 3 } },
      { size: 3, suit: 'A', rank: { var: 'n', offset: 4 } },
    ],
  },
  {
    id: 'ladder-03', name: 'Three rungs over flowers', family: 'ladder', value: 25, sealed: false,
    groups: [
      { size: 4, tile: 'flower' },
      { size: 3, suit: 'A', rank: { var: 'n', offset: 0 } },
      { size: 3, suit: 'A', rank: { var: 'n', offset: 1 } },
      { size: 4, suit: 'A', rank: { var: 'n', offset: 2 } },
    ],
  },
  {
    id: 'ladder-04', name: 'Ladder with its dragon', family: 'ladder', value: 25, sealed: false,
    groups: [
      { size: 4, suit: 'A', rank: { var: 'n', offset: 0 } },
      { size: 4, suit: 'A', rank: { var: 'n', offset: 1 } },
      { size: 4, suit: 'A', rank: { var: 'n', offset: 2 } },
      { size: 2, dragon: 'match', suit: 'A' },
    ],
  },
  {
    id: 'ladder-05', name: 'Seven-step staircase', family: 'ladder', value: 40, sealed: true,
    groups: [
      { size: 1, suit: 'A', rank: { var: 'n', offset: 0 } },
      { size: 1, suit: 'A', rank: { var: 'n', offset: 1 } },
      { size: 1, suit: 'A', rank: { var: 'n', offset: 2 } },
      { size: 1, suit: 'A', rank: { var: 'n', offset: 3 } },
      { size: 1, suit: 'A', rank: { var: 'n', offset: 4 } },
      { size: 1, suit: 'A', rank: { var: 'n', offset: 5 } },
      { size: 1, suit: 'A', rank: { var: 'n', offset: 6 } },
      { size: 4, tile: 'flower' },
      { size: 3, dragon: 'match', suit: 'A' },
    ],
  },
  {
    id: 'braid-01', name: 'Three-suit stair', family: 'braid', value: 25, sealed: false,
    groups: [
      { size: 2, tile: 'flower' },
      { size: 4, suit: 'A', rank: { var: 'n', offset: 0 } },
      { size: 4, suit: 'B', rank: { var: 'n', offset: 1 } },
      { size: 4, suit: 'C', rank: { var: 'n', offset: 2 } },
    ],
  },
  {
    id: 'braid-02', name: 'Braided pungs', family: 'braid', value: 30, sealed: false,
    groups: [
      { size: 2, tile: 'flower' },
      { size: 3, suit: 'A', rank: { var: 'n', offset: 0 } },
      { size: 3, suit: 'B', rank: { var: 'n', offset: 1 } },
      { size: 3, suit: 'C', rank: { var: 'n', offset: 2 } },
      { size: 3, suit: 'A', rank: { var: 'n', offset: 3 } },
    ],
  },
  {
    id: 'braid-03', name: 'Two-suit zigzag', family: 'braid', value: 25, sealed: false,
    groups: [
      { size: 4, suit: 'A', rank: { var: 'n', offset: 0 } },
      { size: 3, suit: 'B', rank: { var: 'n', offset: 1 } },
      { size: 3, suit: 'A', rank: { var: 'n', offset: 2 } },
      { size: 4, suit: 'B', rank: { var: 'n', offset: 3 } },
    ],
  },
  {
    id: 'braid-04', name: 'Braid between winds', family: 'braid', value: 30, sealed: false,
    groups: [
      { size: 3, suit: 'A', rank: { var: 'n', offset: 0 } },
      { size: 3, suit: 'B', rank: { var: 'n', offset: 1 } },
      { size: 3, suit: 'C', rank: { var: 'n', offset: 2 } },
      { size: 2, tile: 'wind-e' },
      { size: 3, tile: 'wind-w' },
    ],
  },
  {
    id: 'mirror-01', name: 'One number, three suits', family: 'mirror', value: 25, sealed: false,
    groups: [
      { size: 2, tile: 'flower' },
      { size: 4, suit: 'A', rank: { var: 'n', offset: 0 } },
      { size: 4, suit: 'B', rank: { var: 'n', offset: 0 } },
      { size: 4, suit: 'C', rank: { var: 'n', offset: 0 } },
    ],
  },
  {
    id: 'mirror-02', name: 'Two numbers, twice', family: 'mirror', value: 25, sealed: false,
    groups: [
      { size: 4, suit: 'A', rank: { var: 'n', offset: 0 } },
      { size: 4, suit: 'B', rank: { var: 'n', offset: 0 } },
      { size: 3, suit: 'A', rank: { var: 'm', offset: 0 } },
      { size: 3, suit: 'B', rank: { var: 'm', offset: 0 } },
    ],
  },
  {
    id: 'mirror-03', name: 'Number and two dragons', family: 'mirror', value: 30, sealed: false,
    groups: [
      { size: 3, suit: 'A', rank: { var: 'n', offset: 0 } },
      { size: 3, suit: 'B', rank: { var: 'n', offset: 0 } },
      { size: 3, suit: 'C', rank: { var: 'n', offset: 0 } },
      { size: 2, dragon: 'match', suit: 'A' },
      { size: 3, dragon: 'match', suit: 'B' },
    ],
  },
  {
    id: 'mirror-04', name: 'Neighbours that match', family: 'mirror', value: 25, sealed: false,
    groups: [
      { size: 3, suit: 'A', rank: { var: 'n', offset: 0 } },
      { size: 3, suit: 'B', rank: { var: 'n', offset: 0 } },
      { size: 4, suit: 'A', rank: { var: 'n', offset: 1 } },
      { size: 4, suit: 'B', rank: { var: 'n', offset: 1 } },
    ],
  },
  {
    id: 'compass-01', name: 'All four winds', family: 'compass', value: 25, sealed: false,
    groups: [
      { size: 4, tile: 'wind-n' },
      { size: 3, tile: 'wind-e' },
      { size: 3, tile: 'wind-w' },
      { size: 4, tile: 'wind-s' },
    ],
  },
  {
    id: 'compass-02', name: 'Winds round a dragon pair', family: 'compass', value: 30, sealed: false,
    groups: [
      { size: 3, tile: 'wind-n' },
      { size: 3, tile: 'wind-e' },
      { size: 3, tile: 'wind-w' },
      { size: 3, tile: 'wind-s' },
      { size: 2, dragon: 'match', suit: 'A' },
    ],
  },
  {
    id: 'compass-03', name: 'Dragon kongs and a north', family: 'compass', value: 30, sealed: false,
    groups: [
      { size: 4, tile: 'dragon-red' },
      { size: 4, tile: 'dragon-green' },
      { size: 3, tile: 'dragon-white' },
      { size: 3, tile: 'wind-n' },
    ],
  },
  {
    id: 'compass-04', name: 'Windrose in bloom', family: 'compass', value: 30, sealed: false,
    groups: [
      { size: 2, tile: 'flower' },
      { size: 3, tile: 'wind-n' },
      { size: 3, tile: 'wind-e' },
      { size: 3, tile: 'wind-w' },
      { size: 3, tile: 'wind-s' },
    ],
  },
  {
    id: 'compass-05', name: 'Winds beside a number', family: 'compass', value: 25, sealed: false,
    groups: [
      { size: 4, tile: 'wind-e' },
      { size: 4, tile: 'wind-w' },
      { size: 3, suit: 'A', rank: { var: 'n', offset: 0 } },
      { size: 3, suit: 'B', rank: { var: 'n', offset: 0 } },
    ],
  },
  {
    id: 'garden-01', name: 'Flower bed', family: 'garden', value: 30, sealed: false,
    groups: [
      { size: 5, tile: 'flower' },
      { size: 3, suit: 'A', rank: { var: 'n', offset: 0 } },
      { size: 3, suit: 'B', rank: { var: 'n', offset: 0 } },
      { size: 3, suit: 'C', rank: { var: 'n', offset: 0 } },
    ],
  },
  {
    id: 'garden-02', name: 'Flowers over evens', family: 'garden', value: 25, sealed: false,
    groups: [
      { size: 4, tile: 'flower' },
      { size: 3, suit: 'A', rank: 2 },
      { size: 3, suit: 'A', rank: 4 },
      { size: 4, suit: 'A', rank: 6 },
    ],
  },
  {
    id: 'garden-03', name: 'Flower sextet', family: 'garden', value: 35, sealed: false,
    groups: [
      { size: 6, tile: 'flower' },
      { size: 4, suit: 'A', rank: { var: 'n', offset: 0 } },
      { size: 4, suit: 'A', rank: { var: 'n', offset: 1 } },
    ],
  },
  {
    id: 'garden-04', name: 'Flowers and dragons', family: 'garden', value: 30, sealed: false,
    groups: [
      { size: 5, tile: 'flower' },
      { size: 3, tile: 'dragon-red' },
      { size: 3, tile: 'dragon-green' },
      { size: 3, tile: 'dragon-white' },
    ],
  },
  {
    id: 'crowd-01', name: 'Quint, kong, quint', family: 'crowd', value: 40, sealed: false,
    groups: [
      { size: 5, suit: 'A', rank: { var: 'n', offset: 0 } },
      { size: 4, suit: 'A', rank: { var: 'n', offset: 1 } },
      { size: 5, suit: 'A', rank: { var: 'n', offset: 2 } },
    ],
  },
  {
    id: 'crowd-02', name: 'Twin quints', family: 'crowd', value: 40, sealed: false,
    groups: [
      { size: 4, tile: 'flower' },
      { size: 5, suit: 'A', rank: { var: 'n', offset: 0 } },
      { size: 5, suit: 'B', rank: { var: 'n', offset: 0 } },
    ],
  },
  {
    id: 'crowd-03', name: 'Sextet between winds', family: 'crowd', value: 45, sealed: false,
    groups: [
      { size: 6, suit: 'A', rank: { var: 'n', offset: 0 } },
      { size: 4, tile: 'wind-n' },
      { size: 4, tile: 'wind-s' },
    ],
  },
  {
    id: 'crowd-04', name: 'Dragon quint', family: 'crowd', value: 40, sealed: false,
    groups: [
      { size: 5, dragon: 'match', suit: 'A' },
      { size: 5, suit: 'A', rank: { var: 'n', offset: 0 } },
      { size: 4, tile: 'flower' },
    ],
  },
  {
    id: 'quiet-01', name: 'Seven pairs climbing', family: 'quiet', value: 50, sealed: true,
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
  {
    id: 'quiet-02', name: 'Paired neighbours in three suits', family: 'quiet', value: 50, sealed: true,
    groups: [
      { size: 2, suit: 'A', rank: { var: 'n', offset: 0 } },
      { size: 2, suit: 'B', rank: { var: 'n', offset: 0 } },
      { size: 2, suit: 'C', rank: { var: 'n', offset: 0 } },
      { size: 2, suit: 'A', rank: { var: 'n', offset: 1 } },
      { size: 2, suit: 'B', rank: { var: 'n', offset: 1 } },
      { size: 2, suit: 'C', rank: { var: 'n', offset: 1 } },
      { size: 2, tile: 'flower' },
    ],
  },
  {
    id: 'quiet-03', name: 'Odd singles, odd pairs', family: 'quiet', value: 45, sealed: true,
    groups: [
      { size: 1, suit: 'A', rank: 1 },
      { size: 1, suit: 'A', rank: 3 },
      { size: 1, suit: 'A', rank: 5 },
      { size: 1, suit: 'A', rank: 7 },
      { size: 1, suit: 'A', rank: 9 },
      { size: 2, suit: 'B', rank: 1 },
      { size: 2, suit: 'B', rank: 3 },
      { size: 2, suit: 'B', rank: 5 },
      { size: 2, suit: 'B', rank: 7 },
      { size: 1, tile: 'flower' },
    ],
  },
  {
    id: 'quiet-04', name: 'One of each honour', family: 'quiet', value: 50, sealed: true,
    groups: [
      { size: 1, tile: 'wind-n' },
      { size: 1, tile: 'wind-e' },
      { size: 1, tile: 'wind-w' },
      { size: 1, tile: 'wind-s' },
      { size: 1, tile: 'dragon-red' },
      { size: 1, tile: 'dragon-green' },
      { size: 1, tile: 'dragon-white' },
      { size: 2, suit: 'A', rank: { var: 'n', offset: 0 } },
      { size: 2, suit: 'B', rank: { var: 'n', offset: 0 } },
      { size: 2, suit: 'C', rank: { var: 'n', offset: 0 } },
      { size: 1, tile: 'flower' },
    ],
  },
  {
    id: 'edges-01', name: 'Bookends', family: 'edges', value: 25, sealed: false,
    groups: [
      { size: 4, suit: 'A', rank: 1 },
      { size: 4, suit: 'A', rank: 9 },
      { size: 3, suit: 'B', rank: 1 },
      { size: 3, suit: 'B', rank: 9 },
    ],
  },
  {
    id: 'edges-02', name: 'Bookends and dragons', family: 'edges', value: 30, sealed: false,
    groups: [
      { size: 2, tile: 'flower' },
      { size: 3, suit: 'A', rank: 1 },
      { size: 3, suit: 'A', rank: 9 },
      { size: 3, dragon: 'match', suit: 'A' },
      { size: 3, dragon: 'match', suit: 'B' },
    ],
  },
  {
    id: 'squares-01', name: 'Square numbers', family: 'squares', value: 25, sealed: false,
    groups: [
      { size: 3, tile: 'flower' },
      { size: 3, suit: 'A', rank: 1 },
      { size: 4, suit: 'A', rank: 4 },
      { size: 4, suit: 'A', rank: 9 },
    ],
  },
  {
    id: 'squares-02', name: 'Squares in three suits', family: 'squares', value: 30, sealed: false,
    groups: [
      { size: 2, tile: 'flower' },
      { size: 4, suit: 'A', rank: 1 },
      { size: 4, suit: 'B', rank: 4 },
      { size: 4, suit: 'C', rank: 9 },
    ],
  },
  {
    id: 'squares-03', name: 'Paired squares', family: 'squares', value: 45, sealed: true,
    groups: [
      { size: 2, suit: 'A', rank: 1 },
      { size: 2, suit: 'A', rank: 4 },
      { size: 2, suit: 'A', rank: 9 },
      { size: 2, suit: 'B', rank: 1 },
      { size: 2, suit: 'B', rank: 4 },
      { size: 2, suit: 'B', rank: 9 },
      { size: 2, tile: 'flower' },
    ],
  },
  {
    id: 'primes-01', name: 'Prime pungs', family: 'primes', value: 30, sealed: false,
    groups: [
      { size: 2, tile: 'flower' },
      { size: 3, suit: 'A', rank: 2 },
      { size: 3, suit: 'A', rank: 3 },
      { size: 3, suit: 'A', rank: 5 },
      { size: 3, suit: 'A', rank: 7 },
    ],
  },
  {
    id: 'primes-02', name: 'Primes in two suits', family: 'primes', value: 25, sealed: false,
    groups: [
      { size: 4, suit: 'A', rank: 2 },
      { size: 3, suit: 'A', rank: 3 },
      { size: 3, suit: 'B', rank: 5 },
      { size: 4, suit: 'B', rank: 7 },
    ],
  },
  {
    id: 'tens-01', name: 'Make ten twice', family: 'tens', value: 25, sealed: false,
    groups: [
      { size: 3, suit: 'A', rank: 3 },
      { size: 3, suit: 'A', rank: 7 },
      { size: 4, suit: 'B', rank: 4 },
      { size: 4, suit: 'B', rank: 6 },
    ],
  },
  {
    id: 'tens-02', name: 'Tens beside a dragon', family: 'tens', value: 30, sealed: false,
    groups: [
      { size: 3, suit: 'A', rank: 2 },
      { size: 3, suit: 'A', rank: 8 },
      { size: 3, suit: 'B', rank: 2 },
      { size: 3, suit: 'B', rank: 8 },
      { size: 2, dragon: 'match', suit: 'C' },
    ],
  },
  {
    id: 'tens-03', name: 'Ten by pairs', family: 'tens', value: 45, sealed: true,
    groups: [
      { size: 2, suit: 'A', rank: 1 },
      { size: 2, suit: 'A', rank: 9 },
      { size: 2, suit: 'B', rank: 2 },
      { size: 2, suit: 'B', rank: 8 },
      { size: 2, suit: 'C', rank: 3 },
      { size: 2, suit: 'C', rank: 7 },
      { size: 2, tile: 'flower' },
    ],
  },
];
