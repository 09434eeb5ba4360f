/** The tile set of American-style play, as Rackside models it. */

export const SUITS = ['bam', 'crack', 'dot'] as const;
export type Suit = (typeof SUITS)[number];

export const RANKS = [1, 2, 3, 4, 5, 6, 7, 8, 9] as const;
export type Rank = (typeof RANKS)[number];

export type SuitKind = `${Suit}${Rank}`;
export type WindKind = 'wind-n' | 'wind-e' | 'wind-s' | 'wind-w';
export type DragonKind = 'dragon-red' | 'dragon-green' | 'dragon-white';
export type TileKind = SuitKind | WindKind | DragonKind | 'flower' | 'joker';

export interface Tile {
  id: string;
  kind: TileKind;
}

export const WIND_KINDS: readonly WindKind[] = ['wind-n', 'wind-e', 'wind-s', 'wind-w'];
export const DRAGON_KINDS: readonly DragonKind[] = ['dragon-red', 'dragon-green', 'dragon-white'];
export const SUIT_KINDS: readonly SuitKind[] = SUITS.flatMap((suit) => RANKS.map((rank) => `${suit}${rank}` as SuitKind));

/** All 36 kinds, in Rackside's display order: suits, winds, dragons, flower, joker. */
export const TILE_KINDS: readonly TileKind[] = [...SUIT_KINDS, ...WIND_KINDS, ...DRAGON_KINDS, 'flower', 'joker'];

/** Copies of each kind in a full set. */
export const COPIES_PER_KIND = 4;
export const FLOWER_COUNT = 8;
export const JOKER_COUNT = 8;

export function copiesInSet(kind: TileKind, jokers = true): number {
  if (kind === 'joker') return jokers ? JOKER_COUNT : 0;
  if (kind === 'flower') return FLOWER_COUNT;
  return COPIES_PER_KIND;
}

/** The full set (152 tiles), or the set without jokers (144), as kinds in a fixed order. */
export function fullSet(jokers = true): TileKind[] {
  return TILE_KINDS.flatMap((kind) => Array.from({ length: copiesInSet(kind, jokers) }, () => kind));
}

export const SET_SIZE = fullSet(true).length;
export const SET_SIZE_WITHOUT_JOKERS = fullSet(false).length;

const TILE_KIND_SET: ReadonlySet<string> = new Set(TILE_KINDS);
export function isTileKind(value: unknown): value is TileKind {
  return typeof value === 'string' && TILE_KIND_SET.has(value);
}

export function isSuitKind(kind: TileKind): kind is SuitKind {
  return /^(bam|crack|dot)[1-9]$/.test(kind);
}

export function suitOf(kind: TileKind): Suit | null {
  if (!isSuitKind(kind)) return null;
  return kind.slice(0, -1) as Suit;
}

export function rankOf(kind: TileKind): Rank | null {
  if (!isSuitKind(kind)) return null;
  return Number(kind.slice(-1)) as Rank;
}

export function suitKind(suit: Suit, rank: number): SuitKind {
  return `${suit}${rank}` as SuitKind;
}

/** Each suit has a matching dragon: green with bams, red with cracks, white with dots. */
export const MATCHING_DRAGON: Readonly<Record<Suit, DragonKind>> = {
  bam: 'dragon-green',
  crack: 'dragon-red',
  dot: 'dragon-white',
};

const WIND_NAMES: Record<WindKind, string> = { 'wind-n': 'north', 'wind-e': 'east', 'wind-s': 'south', 'wind-w': 'west' };
const DRAGON_NAMES: Record<DragonKind, string> = { 'dragon-red': 'red', 'dragon-green': 'green', 'dragon-white': 'white' };

/** A plain name for people and screen readers: "3 bam", "north wind", "red dragon", "flower", "joker". */
export function tileName(kind: TileKind): string {
  const suit = suitOf(kind);
  if (suit) return `${rankOf(kind)} ${suit}`;
  if (kind in WIND_NAMES) return `${WIND_NAMES[kind as WindKind]} wind`;
  if (kind in DRAGON_NAMES) return `${DRAGON_NAMES[kind as DragonKind]} dragon`;
  return kind;
}

/** A sort key in display order: suits by suit then rank, then winds, dragons, flowers, jokers. */
export function kindOrder(kind: TileKind): number {
  return TILE_KINDS.indexOf(kind);
}
