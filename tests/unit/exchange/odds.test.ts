import jStat from 'jstat';
import { expect, test } from 'vitest';
import { chanceOfAtLeastOne, createExchange } from '../../../shared/exchange';
import { JOKER_COUNT, SET_SIZE } from '../../../shared/tiles';

const RACK = 13;

test('the chance of at least one joker in a 13-tile rack matches the hypergeometric figure', () => {
  const ours = chanceOfAtLeastOne(JOKER_COUNT, RACK, SET_SIZE);
  expect(ours).toBeCloseTo(1 - jStat.hypgeom.pdf(0, SET_SIZE, JOKER_COUNT, RACK), 12); // jstat hypgeom.pdf(k, N, m, n)
});

test('no copies means no chance, and drawing the whole set means certainty', () => {
  expect(chanceOfAtLeastOne(0, RACK, SET_SIZE)).toBe(0);
  expect(chanceOfAtLeastOne(JOKER_COUNT, SET_SIZE, SET_SIZE)).toBe(1);
});

test('20,000 seeded deals give south a joker at the expected rate', () => {
  const p = 1 - jStat.hypgeom.pdf(0, SET_SIZE, JOKER_COUNT, RACK); // jstat hypgeom.pdf
  const deals = 20_000;
  let withJoker = 0;
  for (let i = 0; i < deals; i++) {
    if (createExchange({ seed: `joker-rate-${i}` }).racks.south.some((tile) => tile.kind === 'joker')) withJoker++;
  }
  const z = jStat.normal.inv(0.9995, 0, 1); // jstat normal.inv: two-sided 99.9% point
  const margin = z * Math.sqrt((p * (1 - p)) / deals);
  expect(Math.abs(withJoker / deals - p)).toBeLessThan(margin);
});
