import { readFileSync } from 'node:fs';
import { render, screen } from '@testing-library/react';
import { expect, test } from 'vitest';
import { SUITS, TILE_KINDS, tileName } from '../../shared/tiles';
import { DRAGON_COLOURS, SUIT_COLOURS, TILE_FACE } from '../../src/components/palette';
import { Tile } from '../../src/components/Tile';

type Rgb = [number, number, number];
const hex = (h: string): Rgb => [1, 3, 5].map((i) => parseInt(h.slice(i, i + 2), 16)) as Rgb;
// sRGB transfer function, IEC 61966-2-1 (as WCAG 2.2 defines relative luminance).
const linear = (c: number) => (c / 255 <= 0.04045 ? c / 255 / 12.92 : ((c / 255 + 0.055) / 1.055) ** 2.4);
const luminance = (h: string) => {
  const [r, g, b] = hex(h).map(linear);
  return 0.2126 * r + 0.7152 * g + 0.0722 * b;
};
// WCAG 2.2 contrast ratio: (L1 + 0.05) / (L2 + 0.05), lighter over darker.
const contrast = (a: string, b: string) => {
  const [hi, lo] = [luminance(a), luminance(b)].sort((x, y) => y - x);
  return (hi + 0.05) / (lo + 0.05);
};

// Machado, Oliveira and Fernandes (2009), "A Physiologically-based Model for Simulation of Color
// Vision Deficiency", IEEE TVCG 15(6): the severity-1.0 matrices, applied to linear RGB (from memory).
const MACHADO_2009: Record<string, number[][]> = {
  protanopia: [[0.152286, 1.052583, -0.204868], [0.114503, 0.786281, 0.099216], [-0.003882, -0.048116, 1.051998]],
  deuteranopia: [[0.367322, 0.860646, -0.227968], [0.280085, 0.672501, 0.047413], [-0.01182, 0.04294, 0.968881]],
  tritanopia: [[1.255528, -0.076749, -0.178779], [-0.078411, 0.930809, 0.147602], [0.004733, 0.691367, 0.3039]],
};
const simulate = (h: string, m: number[][]): Rgb => {
  const v = hex(h).map(linear);
  return m.map((row) => Math.min(1, Math.max(0, row[0] * v[0] + row[1] * v[1] + row[2] * v[2]))) as Rgb;
};
// Linear sRGB → XYZ (D65) → CIELAB, per CIE 15 (from memory).
const lab = ([r, g, b]: Rgb): Rgb => {
  const x = (0.4124 * r + 0.3576 * g + 0.1805 * b) / 0.95047;
  const y = 0.2126 * r + 0.7152 * g + 0.0722 * b;
  const z = (0.0193 * r + 0.1192 * g + 0.9505 * b) / 1.08883;
  const f = (t: number) => (t > 216 / 24389 ? Math.cbrt(t) : ((24389 / 27) * t + 16) / 116);
  return [116 * f(y) - 16, 500 * (f(x) - f(y)), 200 * (f(y) - f(z))];
};
// CIE76 colour difference: Euclidean distance in CIELAB; about 2.3 is a just-noticeable difference (from memory).
const deltaE76 = (a: Rgb, b: Rgb) => Math.hypot(a[0] - b[0], a[1] - b[1], a[2] - b[2]);
/** Far above a just-noticeable difference: two suits must read as different colours at a glance. */
const MIN_DELTA_E = 20;

const pairs = [
  ['bam', 'crack'],
  ['bam', 'dot'],
  ['crack', 'dot'],
] as const;

test.each(Object.keys(MACHADO_2009))('the three suit colours stay far apart under simulated %s', (kind) => {
  for (const [a, b] of pairs) {
    const d = deltaE76(lab(simulate(SUIT_COLOURS[a], MACHADO_2009[kind])), lab(simulate(SUIT_COLOURS[b], MACHADO_2009[kind])));
    expect(d, `${a} vs ${b}`).toBeGreaterThan(MIN_DELTA_E);
  }
});

test('the three suit colours are far apart with typical colour vision too', () => {
  const identity = [[1, 0, 0], [0, 1, 0], [0, 0, 1]];
  for (const [a, b] of pairs) expect(deltaE76(lab(simulate(SUIT_COLOURS[a], identity)), lab(simulate(SUIT_COLOURS[b], identity)))).toBeGreaterThan(MIN_DELTA_E);
});

test('every suit and dragon colour has at least 3:1 contrast against the tile face', () => {
  // WCAG 2.2 success criterion 1.4.11 (non-text contrast): 3:1 for graphical objects.
  for (const colour of [...Object.values(SUIT_COLOURS), ...Object.values(DRAGON_COLOURS)]) expect(contrast(colour, TILE_FACE)).toBeGreaterThanOrEqual(3);
});

test('the contrast formula matches the published extremes', () => {
  // WCAG 2.2 defines black on white as 21:1 and a colour on itself as 1:1.
  expect(contrast('#000000', '#ffffff')).toBeCloseTo(21, 5);
  expect(contrast('#777777', '#777777')).toBe(1);
});

test('the CSS tokens carry the same suit colours as the palette module', () => {
  const css = readFileSync('src/styles.css', 'utf8');
  for (const suit of SUITS) expect(css).toContain(`--color-${suit}: ${SUIT_COLOURS[suit]};`);
  expect(css).toContain(`--color-tile: ${TILE_FACE};`);
});

test('every one of the 36 kinds has a face named for people', () => {
  render(
    <div>
      {TILE_KINDS.map((kind) => (
        <Tile key={kind} kind={kind} />
      ))}
    </div>,
  );
  expect(screen.getAllByRole('img')).toHaveLength(36);
  for (const name of ['3 bam', '9 crack', '1 dot', 'north wind', 'east wind', 'red dragon', 'white dragon', 'flower', 'joker']) {
    expect(screen.getByRole('img', { name })).toBeTruthy();
  }
  expect(new Set(TILE_KINDS.map(tileName)).size).toBe(36);
});

test('suits differ by the shape of their mark, not only by colour', () => {
  const { container } = render(
    <div>
      <Tile kind="dot4" />
      <Tile kind="bam4" />
      <Tile kind="crack4" />
    </div>,
  );
  const [dot, bam, crack] = Array.from(container.querySelectorAll('svg'));
  expect(dot.querySelectorAll('circle').length).toBe(4);
  expect(bam.querySelectorAll('rect').length).toBe(1 + 4);
  expect(crack.querySelector('line')).toBeTruthy();
});
