import { MATCHING_DRAGON, type DragonKind, type Suit } from '../../../shared/tiles';

/**
 * Rackside's own suit colours: raspberry bams, cobalt cracks, umber dots. Chosen to stay far apart
 * under simulated protanopia, deuteranopia and tritanopia and to read as text (4.5:1) on the tile
 * face; tests/client/palette.test.tsx checks every claim.
 */
export const SUIT_COLOURS: Readonly<Record<Suit, string>> = {
  bam: '#c2336a',
  crack: '#1565c0',
  dot: '#6b4a00',
};

export const TILE_FACE = '#fffdf7';
export const TILE_EDGE = '#5d6470';
export const TILE_INK = '#1b2430';

/** A dragon wears the colour of the suit it matches. */
export const DRAGON_COLOURS: Readonly<Record<DragonKind, string>> = {
  'dragon-green': SUIT_COLOURS.bam,
  'dragon-red': SUIT_COLOURS.crack,
  'dragon-white': SUIT_COLOURS.dot,
};

export const MATCHED_SUIT: Readonly<Record<DragonKind, Suit>> = Object.fromEntries(
  (Object.entries(MATCHING_DRAGON) as [Suit, DragonKind][]).map(([suit, dragon]) => [dragon, suit]),
) as Record<DragonKind, Suit>;
