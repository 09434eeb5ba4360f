import { expect, test } from 'vitest';
import { advisePass, starterPatterns, type PassAdvice } from '../../../shared/analysis';
import { createExchange } from '../../../shared/exchange';
import { SEATS } from '../../../shared/seats';
import { TILE_KINDS, tileName } from '../../../shared/tiles';

/** Tile names out of a reason ("the 5 bam", "two north winds", "pair of 7 dots"), so only what it says of them is left. */
const TILE_WORDS = new RegExp(
  `\\b(${TILE_KINDS.map(tileName)
    .sort((a, b) => b.length - a.length)
    .map((n) => n.replace(/ /g, '\\s'))
    .join('|')})s?\\b`,
  'g',
);
function withoutTileNames(text: string): string {
  return text.replace(TILE_WORDS, 'TILE').replace(/\b(a|an|one|two|three|four|the)\s+TILE/g, 'TILE');
}

/**
 * What a pass's reasons say once tile names are out, and, to be strict, figures and rank
 * words too ("about 12%", "two points", "the second choice"): passes that differ only in
 * which loose tiles go, or in a figure, read the same.
 */
const signature = (a: PassAdvice) =>
  a.reasons
    .map(withoutTileNames)
    .map((r) => r.replace(/\d+/g, '#').replace(/\b(first|second|third|fourth|fifth|sixth|one|two|three|four|five|six)\b/g, 'N'))
    .join(' | ');

test('tile names come out of a reason, and what is said of them stays', () => {
  expect(withoutTileNames('Passes the 5 bam and the north wind: no live family uses them.')).toBe('Passes TILE and TILE: no live family uses them.');
  expect(withoutTileNames('Keeps your pair of 7 dots and pung of red dragons.')).toBe('Keeps your pair of TILE and pung of TILE.');
  expect(withoutTileNames('Gives away two flowers, but no live family uses flowers.')).toBe('Gives away TILE, but no live family uses TILE.');
});

test('over 30 dealt racks, the top three passes carry the same reasons on at most 1 rack in 10', () => {
  const same: string[] = [];
  for (let i = 0; i < 30; i++) {
    const state = createExchange({ seed: `advice-reasons-${i}` });
    const hand = state.racks[SEATS[i % 4]].map((t) => t.kind);
    const phase = (['first-right', 'first-across', 'first-left', 'second-left', 'second-across', 'second-right'] as const)[i % 6];
    const top = advisePass(hand, starterPatterns, { phase, blindAllowed: phase === 'first-left' || phase === 'second-right' }).slice(0, 3);
    expect(top).toHaveLength(3);
    if (new Set(top.map(signature)).size < 3) same.push(`${hand.join(' ')}: ${top.map(signature).join('  ||  ')}`);
  }
  expect(same.length, same.join('\n')).toBeLessThanOrEqual(3);
});
