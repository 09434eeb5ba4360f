import { MATCHING_DRAGON, type DragonKind, type Suit } from '../../shared/tiles';

/**
 * Suit colours, started from Okabe and Ito's colour-universal-design set and darkened until
 * each reaches 3:1 against the tile face; tests/client/palette.test.tsx checks both claims.
 */
export const SUIT_COLOURS: Readonly<Record<Suit, string>> = {
  bam: '#00806a',
  crack: '#c25400',
  dot: '#3b2f8f',
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
