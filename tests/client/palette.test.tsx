import { readFileSync } from 'node:fs';
import { render, screen } from '@testing-library/react';
import { expect, test } from 'vitest';
import { MATCHING_DRAGON, SUITS, TILE_KINDS, tileName } from '../../shared/tiles';
import { DRAGON_COLOURS, SUIT_COLOURS, TILE_FACE, TILE_INK } from '../../src/components/ui/palette';
import { Tile } from '../../src/components/ui/Tile';

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

// Simulation method: Machado, Oliveira and Fernandes (2009), "A Physiologically-based Model for
// Simulation of Color Vision Deficiency", IEEE TVCG 15(6): their severity-1.0 matrices, applied to
// linear RGB. The matrices are written from memory of the paper's table.
const MACHADO_2009: Record<string, number[][]> = {
  protanopia: [[0.152286, 1.052583, -0.204868], [0.114503, 0.786281, 0.099216], [-0.003882, -0.048116, 1.051998]],
  deuteranopia: [[0.367322, 0.860646, -0.227968], [0.280085, 0.672501, 0.047413], [-0.01182, 0.04294, 0.968881]],
  tritanopia: [[1.255528, -0.076749, -0.178779], [-0.078411, 0.930809, 0.147602], [0.004733, 0.691367, 0.3039]],
};
const TYPICAL = [[1, 0, 0], [0, 1, 0], [0, 0, 1]];
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

// CIEDE2000 colour difference (CIE 142-2001), as written out by Sharma, Wu and Dalal (2005), "The
// CIEDE2000 color-difference formula: implementation notes", Color Res. Appl. 30(1) (from memory).
const DEG = Math.PI / 180;
function deltaE2000([L1, a1, b1]: Rgb, [L2, a2, b2]: Rgb): number {
  const Cbar = (Math.hypot(a1, b1) + Math.hypot(a2, b2)) / 2;
  const G = 0.5 * (1 - Math.sqrt(Cbar ** 7 / (Cbar ** 7 + 25 ** 7)));
  const [a1p, a2p] = [(1 + G) * a1, (1 + G) * a2];
  const [C1p, C2p] = [Math.hypot(a1p, b1), Math.hypot(a2p, b2)];
  const hue = (b: number, a: number) => (a === 0 && b === 0 ? 0 : (Math.atan2(b, a) / DEG + 360) % 360);
  const [h1p, h2p] = [hue(b1, a1p), hue(b2, a2p)];
  let dh = 0;
  if (C1p * C2p !== 0) dh = h2p - h1p > 180 ? h2p - h1p - 360 : h2p - h1p < -180 ? h2p - h1p + 360 : h2p - h1p;
  const dL = L2 - L1;
  const dC = C2p - C1p;
  const dH = 2 * Math.sqrt(C1p * C2p) * Math.sin((dh * DEG) / 2);
  const Lbar = (L1 + L2) / 2;
  const Cbarp = (C1p + C2p) / 2;
  let hbar = h1p + h2p;
  if (C1p * C2p !== 0) hbar = Math.abs(h1p - h2p) > 180 ? (hbar < 360 ? (hbar + 360) / 2 : (hbar - 360) / 2) : hbar / 2;
  const T = 1 - 0.17 * Math.cos((hbar - 30) * DEG) + 0.24 * Math.cos(2 * hbar * DEG) + 0.32 * Math.cos((3 * hbar + 6) * DEG) - 0.2 * Math.cos((4 * hbar - 63) * DEG);
  const dTheta = 30 * Math.exp(-(((hbar - 275) / 25) ** 2));
  const RC = 2 * Math.sqrt(Cbarp ** 7 / (Cbarp ** 7 + 25 ** 7));
  const SL = 1 + (0.015 * (Lbar - 50) ** 2) / Math.sqrt(20 + (Lbar - 50) ** 2);
  const SC = 1 + 0.045 * Cbarp;
  const SH = 1 + 0.015 * Cbarp * T;
  const RT = -Math.sin(2 * dTheta * DEG) * RC;
  return Math.sqrt((dL / SL) ** 2 + (dC / SC) ** 2 + (dH / SH) ** 2 + RT * (dC / SC) * (dH / SH));
}
const seen = (colour: string, m: number[][]) => lab(simulate(colour, m));

/** ΔE00 of 10 and more reads as a different colour at a glance (common practice, no published source); suits keep half again that. */
const MIN_SUIT_DELTA_E2000 = 15;
/** Against the tile face a suit must stand right out, beyond the contrast ratio below. */
const MIN_FACE_DELTA_E2000 = 30;

const pairs = [
  ['bam', 'crack'],
  ['bam', 'dot'],
  ['crack', 'dot'],
] as const;

test('the CIEDE2000 formula gives the published values for the first test pairs', () => {
  // Sharma, Wu and Dalal (2005), table 1, pairs 1–3 (from memory).
  expect(deltaE2000([50, 2.6772, -79.7751], [50, 0, -82.7485])).toBeCloseTo(2.0425, 4);
  expect(deltaE2000([50, 3.1571, -77.2803], [50, 0, -82.7485])).toBeCloseTo(2.8615, 4);
  expect(deltaE2000([50, 2.8361, -74.02], [50, 0, -82.7485])).toBeCloseTo(3.4412, 4);
  expect(deltaE2000([60, 10, 10], [60, 10, 10])).toBe(0);
});

test.each([['typical colour vision', TYPICAL], ...Object.entries(MACHADO_2009)] as [string, number[][]][])(
  'with %s (Machado et al. 2009 at severity 1.0), the three suits stay far apart and far from the tile face (CIEDE2000)',
  (_, m) => {
    for (const [a, b] of pairs) {
      expect(deltaE2000(seen(SUIT_COLOURS[a], m), seen(SUIT_COLOURS[b], m)), `${a} vs ${b}`).toBeGreaterThanOrEqual(MIN_SUIT_DELTA_E2000);
    }
    for (const suit of SUITS) expect(deltaE2000(seen(SUIT_COLOURS[suit], m), seen(TILE_FACE, m)), `${suit} vs the face`).toBeGreaterThanOrEqual(MIN_FACE_DELTA_E2000);
  },
);

test('the suit colours are our own: no green bams, no red or orange cracks, no blue dots', () => {
  // CIELAB hue angle (h = atan2(b*, a*)); the bands are common practice, no published source:
  // reds and oranges sit near 20–75°, greens near 110–200°, blues near 220–300°.
  const hueOf = (colour: string) => {
    const [, a, b] = seen(colour, TYPICAL);
    return (Math.atan2(b, a) / DEG + 360) % 360;
  };
  const within = (h: number, [lo, hi]: [number, number]) => h >= lo && h <= hi;
  expect(within(hueOf(SUIT_COLOURS.bam), [110, 200]), `bam hue ${hueOf(SUIT_COLOURS.bam)}`).toBe(false);
  expect(within(hueOf(SUIT_COLOURS.crack), [15, 75]), `crack hue ${hueOf(SUIT_COLOURS.crack)}`).toBe(false);
  expect(within(hueOf(SUIT_COLOURS.dot), [220, 300]), `dot hue ${hueOf(SUIT_COLOURS.dot)}`).toBe(false);
});

test('every suit and dragon colour reads as text on the tile face: 4.5:1 or more', () => {
  // The corner index numeral is text drawn in the suit colour, so WCAG 2.2 SC 1.4.3 (contrast minimum,
  // 4.5:1 for text) applies, which also covers SC 1.4.11 (3:1 for graphical objects) for the marks.
  for (const colour of [...Object.values(SUIT_COLOURS), ...Object.values(DRAGON_COLOURS), TILE_INK]) expect(contrast(colour, TILE_FACE), colour).toBeGreaterThanOrEqual(4.5);
});

test('each dragon wears the colour of the suit it matches', () => {
  for (const suit of SUITS) expect(DRAGON_COLOURS[MATCHING_DRAGON[suit]]).toBe(SUIT_COLOURS[suit]);
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
  expect(crack.querySelector('[data-mark="crack"]')).toBeTruthy();
});

test.each([1, 5, 9])('a crack numeral (%i) stands clear: its mark sits beside it, never across it', (n) => {
  const { container } = render(<Tile kind={`crack${n}` as 'crack1'} />);
  const svg = container.querySelector('svg')!;
  // Nothing is drawn over the numeral: no stroke through it.
  expect(svg.querySelector('line')).toBeNull();
  const numeral = Array.from(svg.querySelectorAll('text')).find((t) => Number(t.getAttribute('font-size')) >= 24)!;
  expect(numeral.textContent).toBe(String(n));
  const centre = Number(numeral.getAttribute('x'));
  const size = Number(numeral.getAttribute('font-size'));
  // A bold digit is at most about 0.7 em wide (common practice, no published source), so it ends by centre + 0.35 em.
  const numeralRight = centre + 0.35 * size;
  const mark = svg.querySelector('[data-mark="crack"]')!;
  const xs = (mark.getAttribute('points') ?? '').trim().split(/\s+/).map((p) => Number(p.split(',')[0]));
  expect(xs.length).toBeGreaterThan(2);
  expect(Math.min(...xs)).toBeGreaterThan(numeralRight);
  expect(Math.max(...xs)).toBeLessThanOrEqual(56);
});
