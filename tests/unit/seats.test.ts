import { expect, test } from 'vitest';
import { DEALER, SEATS, dealtRackSize, isSeat, seatFrom, seatTo } from '../../shared/seats';

test('seats in turn order are east, south, west, north', () => {
  expect(SEATS).toEqual(['east', 'south', 'west', 'north']); // common practice of American-style play, from memory
});

test("each seat's right is the next seat in turn order", () => {
  // common practice of American-style play, from memory
  expect(seatTo('east', 'right')).toBe('south');
  expect(seatTo('south', 'right')).toBe('west');
  expect(seatTo('west', 'right')).toBe('north');
  expect(seatTo('north', 'right')).toBe('east');
});

test('across is two seats on', () => {
  expect(seatTo('east', 'across')).toBe('west'); // common practice, from memory
  expect(seatTo('south', 'across')).toBe('north');
  expect(seatTo('west', 'across')).toBe('east');
  expect(seatTo('north', 'across')).toBe('south');
});

test('left is three seats on', () => {
  expect(seatTo('east', 'left')).toBe('north'); // common practice, from memory
  expect(seatTo('south', 'left')).toBe('east');
  expect(seatTo('west', 'left')).toBe('south');
  expect(seatTo('north', 'left')).toBe('west');
});

test('seatFrom undoes seatTo', () => {
  for (const seat of SEATS) {
    for (const direction of ['right', 'across', 'left'] as const) expect(seatFrom(seatTo(seat, direction), direction)).toBe(seat);
  }
});

test('east deals and holds 14, the others 13', () => {
  expect(DEALER).toBe('east'); // common practice, from memory
  expect(dealtRackSize('east')).toBe(14);
  for (const seat of ['south', 'west', 'north'] as const) expect(dealtRackSize(seat)).toBe(13);
});

test('isSeat accepts the four seats only', () => {
  for (const seat of SEATS) expect(isSeat(seat)).toBe(true);
  for (const bad of ['East', 'host', '', null, 1]) expect(isSeat(bad)).toBe(false);
});
