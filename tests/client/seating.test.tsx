import { expect, test } from 'vitest';
import { SEATS, seatTo } from '../../shared/seats';
import { receivedAnnouncement } from '../../src/features/table/api/announce';
import { sideOf } from '../../src/lib/seating';
import { fresh, passAll, tableState } from './fake-table';

test('the table is drawn with the viewer at the bottom and each neighbour on the side the rules name', () => {
  // The player to a seat's right is the next seat in turn order: east's right is south (PRODUCT.md, common practice).
  expect(sideOf('east', 'south')).toBe('right');
  expect(sideOf('east', 'west')).toBe('top');
  expect(sideOf('east', 'north')).toBe('left');
  for (const me of SEATS) {
    expect(sideOf(me, me)).toBe('bottom');
    expect(sideOf(me, seatTo(me, 'right'))).toBe('right');
    expect(sideOf(me, seatTo(me, 'across'))).toBe('top');
    expect(sideOf(me, seatTo(me, 'left'))).toBe('left');
  }
});

test('a watcher sees the table from east', () => {
  expect(sideOf(null, 'east')).toBe('bottom');
});

test('the announcement names the tiles and the side they came from, once per pass', () => {
  const before = tableState(fresh(), 'south', {}, 1);
  const after = tableState(passAll(fresh()), 'south', {}, 2);
  const said = receivedAnnouncement(before, after)!;
  // Passing right, south receives from east, the seat on its left.
  expect(said).toMatch(/^You received 3 tiles from your left \(east\): [^,]+, [^,]+, [^,]+\.$/);
  expect(receivedAnnouncement(after, { ...after, version: 3 })).toBeNull();
});
