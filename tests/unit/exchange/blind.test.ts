import jStat from 'jstat';
import { expect, test } from 'vitest';
import { createExchange, resolve, viewFor, type ExchangeState } from '../../../shared/exchange';
import { SEATS, seatFrom, type Seat } from '../../../shared/seats';
import { fullSet } from '../../../shared/tiles';
import { advanceTo, allKinds, commitAll, must, passAll } from './helpers';

const seed = 'harbor-lane-week-01';
const firstLeft = advanceTo(createExchange({ seed }), 'first-left');
const ids = (state: ExchangeState, seat: Seat) => state.racks[seat].map((tile) => tile.id);

function blindPass(blind: Partial<Record<Seat, number>>, from: ExchangeState = firstLeft) {
  const before = commitAll(from, blind);
  const after = must(resolve(before));
  return { before, after, record: after.history[after.history.length - 1] };
}

test('a seat passing one blind keeps two arriving tiles and forwards the third', () => {
  const { before, record } = blindPass({ north: 1 });
  const arriving = before.pending[seatFrom('north', 'left')]!.tiles; // east's tiles reach north on a pass left
  expect(record.received.north).toHaveLength(2);
  expect(record.forwarded.north).toHaveLength(1);
  expect([...record.received.north, ...record.forwarded.north].sort()).toEqual([...arriving].sort());
});

test('the forwarded tile travels on with the forwarder’s own tiles', () => {
  const { before, record } = blindPass({ north: 1 });
  expect([...record.received.west].sort()).toEqual([...before.pending.north!.tiles, ...record.forwarded.north].sort());
});

test('a tile forwarded blind never enters the forwarder’s rack', () => {
  const { after, record } = blindPass({ north: 2, south: 1 });
  for (const seat of ['north', 'south'] as const) {
    expect(record.forwarded[seat].length).toBeGreaterThan(0);
    for (const id of record.forwarded[seat]) expect(ids(after, seat)).not.toContain(id);
  }
});

test('a tile forwarded blind is never shown to the forwarder', () => {
  const { after, record } = blindPass({ north: 2 });
  const seen = JSON.stringify(viewFor(after, 'north'));
  expect(record.forwarded.north).toHaveLength(2);
  for (const id of record.forwarded.north) expect(seen).not.toContain(`"${id}"`);
});

test('all four passing all three blind moves no tiles', () => {
  const { before, after, record } = blindPass({ east: 3, south: 3, west: 3, north: 3 });
  expect(after.racks).toEqual(before.racks);
  for (const seat of SEATS) expect(record.received[seat]).toEqual([]);
  expect(after.phase).toBe('vote');
});

test('when three seats pass all three blind, the fourth gets its own tiles back', () => {
  const { before, after } = blindPass({ south: 3, west: 3, north: 3 });
  expect(after.racks.east.map((t) => t.id).sort()).toEqual(before.racks.east.map((t) => t.id).sort());
});

test('two full blind passes in a row hand the tiles on to the third seat', () => {
  // pass left: east → north → west → south. North and west forward all three.
  const { before, record } = blindPass({ north: 3, west: 3 });
  expect([...record.received.south].sort()).toEqual([...before.pending.east!.tiles].sort());
  expect(record.received.north).toEqual([]);
  expect(record.received.west).toEqual([]);
});

test('when everyone passes some blind, each keeps as many as it gave and the blind part shrinks', () => {
  const { before, record } = blindPass({ east: 1, south: 1, west: 1, north: 1 });
  for (const seat of SEATS) {
    expect(record.received[seat]).toHaveLength(before.pending[seat]!.tiles.length);
    expect(record.forwarded[seat]).toEqual([]);
  }
});

test('every mix of blind counts keeps the set whole and each seat keeps as many as it gave', () => {
  let forwardedChecked = 0;
  for (let code = 0; code < 256; code++) {
    const blind = { east: code & 3, south: (code >> 2) & 3, west: (code >> 4) & 3, north: (code >> 6) & 3 };
    const { before, after, record } = blindPass(blind);
    expect(allKinds(after)).toEqual(fullSet().sort());
    for (const seat of SEATS) {
      expect(after.racks[seat]).toHaveLength(before.racks[seat].length);
      expect(record.received[seat]).toHaveLength(3 - blind[seat]);
      expect(record.forwarded[seat].filter((id) => record.sent[seat].includes(id))).toEqual([]);
      forwardedChecked += record.forwarded[seat].length;
      for (const id of record.forwarded[seat]) expect(ids(after, seat)).not.toContain(id);
      // The packet is as big as the largest own count, so each seat forwards what it passes blind
      // beyond the fewest blind at the table: its whole blind count whenever someone passes none.
      const fewest = Math.min(...SEATS.map((s) => blind[s]));
      expect(record.forwarded[seat], JSON.stringify(blind)).toHaveLength(blind[seat] - fewest);
    }
  }
  expect(forwardedChecked).toBeGreaterThan(0);
});

test('a blind forwarder takes its forwarded tiles from those arriving to it', () => {
  const { before, record } = blindPass({ south: 2, north: 1 });
  // pass left: east → north → west → south → east. West passes without blind.
  expect(record.forwarded.north.every((id) => before.pending.east!.tiles.includes(id))).toBe(true);
  const arrivingSouth = [...before.pending.west!.tiles];
  expect(record.forwarded.south.every((id) => arrivingSouth.includes(id))).toBe(true);
});

test('blind picks follow the seed', () => {
  expect(blindPass({ north: 1 }).record).toEqual(blindPass({ north: 1 }).record);
});

test('blind picks differ between deals', () => {
  const positions = new Set<number>();
  for (let i = 0; i < 30; i++) {
    const start = advanceTo(createExchange({ seed: `blind-${i}` }), 'first-left');
    const { before, record } = blindPass({ north: 1 }, start);
    positions.add(before.pending.east!.tiles.indexOf(record.forwarded.north[0]));
  }
  expect(positions).toEqual(new Set([0, 1, 2]));
});

test('each arriving tile is as likely to be forwarded blind', () => {
  const counts = [0, 0, 0];
  const runs = 900;
  for (let i = 0; i < runs; i++) {
    const start = advanceTo(createExchange({ seed: `fair-${i}` }), 'first-left');
    const { before, record } = blindPass({ north: 1 }, start);
    counts[before.pending.east!.tiles.indexOf(record.forwarded.north[0])]++;
  }
  const expected = runs / 3;
  const chi = counts.reduce((sum, n) => sum + (n - expected) ** 2 / expected, 0);
  expect(chi).toBeLessThan(jStat.chisquare.inv(0.999, 2)); // jstat chisquare.inv: 99.9% point, 2 degrees of freedom
});

test('the second right allows blind passes the same way', () => {
  const secondRight = advanceTo(createExchange({ seed }), 'second-right');
  const { before, record } = blindPass({ east: 2 }, secondRight);
  // pass right: north → east → south.
  expect(record.forwarded.east.every((id) => before.pending.north!.tiles.includes(id))).toBe(true);
  expect(record.forwarded.east).toHaveLength(2);
  expect(record.received.east).toHaveLength(1);
});

test('the record keeps every seat’s blind count', () => {
  expect(blindPass({ west: 2 }).record.blind).toEqual({ east: 0, south: 0, west: 2, north: 0 });
  expect(passAll(createExchange({ seed })).history[0].blind).toEqual({ east: 0, south: 0, west: 0, north: 0 });
});
