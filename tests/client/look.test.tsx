import { readFileSync } from 'node:fs';
import { render, screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { beforeAll, expect, test, vi } from 'vitest';
import { starterPatterns } from '../../shared/analysis';
import type { DrillDto } from '../../shared/drills';
import { SEATS } from '../../shared/seats';
import { LobbySeats } from '../../src/features/table/components/LobbySeats';
import { Rack } from '../../src/components/ui/Rack';
import { fakeApi, renderAt, signedInAs } from './render';
import { finishedReplay, tableState } from './fake-table';

vi.mock('../../src/features/table/api/socket', () => ({ send: vi.fn(async () => ({ ok: true })), joinTable: vi.fn(async () => ({ ok: true })), leaveTable: vi.fn() }));

beforeAll(async () => {
  await import('../../src/features/replay/routes/ReplayPage');
}, 30_000);

const css = readFileSync('src/styles.css', 'utf8');
const token = (name: string) => css.match(new RegExp(`--color-${name}:\\s*(#[0-9a-f]{6})`, 'i'))?.[1].toLowerCase();

/** Heading levels in document order never skip one on the way down (WCAG 2.2 technique G141 and H42). */
function expectHeadingsInOrder() {
  const levels = Array.from(document.querySelectorAll('h1, h2, h3, h4, h5, h6')).map((h) => Number(h.tagName[1]));
  expect(levels[0]).toBe(1);
  for (let i = 1; i < levels.length; i++) expect(levels[i], `heading ${i + 1} of ${levels.join(',')}`).toBeLessThanOrEqual(levels[i - 1] + 1);
}

test('a picked tile differs from the focus ring in shape, not only colour: raised with a check mark, no ring', () => {
  render(<Rack label="Your rack" tiles={[{ id: 'a', kind: 'bam3' }, { id: 'b', kind: 'dot2' }]} picked={['a']} canPick />);
  const picked = screen.getByRole('button', { name: '3 bam, picked' });
  const plain = screen.getByRole('button', { name: '2 dot' });
  // The focus ring is an outline drawn outside the tile with a gap; a picked tile draws no ring or outline of its own.
  expect(picked.className).not.toMatch(/\b(ring|outline)-/);
  expect(picked.className).toMatch(/-translate-y-/);
  expect(plain.className).not.toMatch(/-translate-y-/);
  // A check mark sits on the tile itself, not only in the word below it.
  expect(within(picked).getByTestId('picked-check').textContent).toBe('✓');
  expect(within(plain).queryByTestId('picked-check')).toBeNull();
  // And the two never share a colour.
  expect(token('picked')).toBeTruthy();
  expect(token('picked')).not.toBe(token('focus'));
  expect(css).toMatch(/:focus-visible\s*{[^}]*outline-offset:\s*[3-9]px/);
});

test('each "Seat a bot" button names its seat', () => {
  const empty = { occupant: null, committed: false, rackSize: 0 };
  const state = tableState(null, 'east', { seats: { east: { occupant: { kind: 'user', userId: 1, displayName: 'Ruth Adeyemi', connected: true }, committed: false, rackSize: 0 }, south: empty, west: empty, north: empty } });
  render(<LobbySeats table={state} busy={false} onSit={() => {}} onStand={() => {}} onBot={() => {}} onStart={() => {}} />);
  const names = screen.getAllByRole('button', { name: /^Seat a bot/ }).map((b) => b.getAttribute('aria-label') ?? b.textContent);
  expect(names.sort()).toEqual(['Seat a bot at north', 'Seat a bot at south', 'Seat a bot at west']);
  for (const seat of SEATS.slice(1)) expect(screen.getByRole('button', { name: `Seat a bot at ${seat}` })).toBeTruthy();
});

test('the replay page never skips a heading level', async () => {
  const dto = finishedReplay();
  fakeApi({ ...signedInAs('player'), 'GET /api/exchanges/x1/replay': { status: 200, body: { replay: { ...dto, final: undefined } } } });
  renderAt('/replays/x1?step=1');
  await screen.findByRole('heading', { name: 'Replay: Harbor Lane Tuesday' });
  expectHeadingsInOrder();
});

test('the drill editor never skips a heading level', async () => {
  const drill: DrillDto = {
    id: 'd1',
    name: 'Harbor Lane week 1',
    description: '',
    seed: 'harbor-lane-week-01',
    jokers: true,
    secondCharleston: false,
    courtesy: true,
    racks: { east: ['bam2', 'bam2'] },
    patternListId: 'starter',
    patternListName: 'Starter list',
    updatedAt: '2026-12-01T00:00:00Z',
  };
  const starter = { id: 'starter', name: 'Starter list', description: '', patternCount: starterPatterns.length, readOnly: true, updatedAt: null };
  fakeApi({ ...signedInAs('teacher'), 'GET /api/pattern-lists': { status: 200, body: { lists: [starter] } }, 'GET /api/drills/d1': { status: 200, body: { drill } } });
  renderAt('/drills/d1');
  await screen.findByLabelText('Drill name');
  expectHeadingsInOrder();
});

test('on a small screen the header folds its links behind a menu button', async () => {
  fakeApi(signedInAs('player'));
  renderAt('/');
  await screen.findByRole('heading', { name: 'Welcome, Ruth Adeyemi' });
  const menu = screen.getByRole('button', { name: 'Menu' });
  expect(menu.getAttribute('aria-expanded')).toBe('false');
  const panel = document.getElementById(menu.getAttribute('aria-controls')!)!;
  // Folded on small screens (hidden below the sm breakpoint), always shown from sm up.
  expect(panel.className).toMatch(/(^|\s)hidden(\s|$)/);
  expect(panel.className).toMatch(/\bsm:flex\b/);
  expect(within(panel).getByRole('navigation', { name: 'Main' })).toBeTruthy();
  expect(within(panel).getByRole('group', { name: 'Text size' })).toBeTruthy();
  await userEvent.click(menu);
  expect(menu.getAttribute('aria-expanded')).toBe('true');
  expect(panel.className).not.toMatch(/(^|\s)hidden(\s|$)/);
  // Following a link folds the menu again.
  await userEvent.click(within(panel).getByRole('link', { name: 'My progress' }));
  await waitFor(() => expect(menu.getAttribute('aria-expanded')).toBe('false'));
});
