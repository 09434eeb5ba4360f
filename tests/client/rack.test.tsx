import { render, screen } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { useState } from 'react';
import { expect, test, vi } from 'vitest';
import type { Tile } from '../../shared/tiles';
import { JOKER_REFUSAL, Rack } from '../../src/components/ui/Rack';
import { useRackOrder } from '../../src/features/table/rack-order';

const TILES: Tile[] = [
  { id: 'a', kind: 'bam3' },
  { id: 'b', kind: 'joker' },
  { id: 'c', kind: 'dot2' },
  { id: 'd', kind: 'wind-n' },
  { id: 'e', kind: 'crack7' },
];

function Harness({ onCommit = () => {}, max = 3 }: { onCommit?: (ids: string[]) => void; max?: number }) {
  const [picked, setPicked] = useState<string[]>([]);
  const [said, setSaid] = useState('');
  const order = useRackOrder(TILES);
  return (
    <>
      <Rack
        label="Your rack"
        tiles={order.tiles}
        picked={picked}
        canPick
        onPick={(id) => setPicked((p) => (p.includes(id) ? p.filter((x) => x !== id) : p.length < max ? [...p, id] : p))}
        onClear={() => setPicked([])}
        onCommit={() => onCommit(picked)}
        onMove={order.move}
        onSay={setSaid}
      />
      <p role="status">{said}</p>
    </>
  );
}

const names = () => screen.getAllByRole('button').map((b) => b.getAttribute('aria-label'));

test('tiles start sorted by suit, and only one tile is in the tab order', () => {
  render(<Harness />);
  expect(names()).toEqual(['3 bam', '7 crack', '2 dot', 'north wind', "joker, can't be passed"]);
  expect(screen.getAllByRole('button').filter((b) => b.tabIndex === 0)).toHaveLength(1);
});

test('arrow keys move focus left to right and back, Home and End jump', async () => {
  const user = userEvent.setup();
  render(<Harness />);
  await user.tab();
  expect(document.activeElement?.getAttribute('aria-label')).toBe('3 bam');
  await user.keyboard('{ArrowRight}{ArrowRight}');
  expect(document.activeElement?.getAttribute('aria-label')).toBe('2 dot');
  await user.keyboard('{ArrowLeft}');
  expect(document.activeElement?.getAttribute('aria-label')).toBe('7 crack');
  await user.keyboard('{End}');
  expect(document.activeElement?.getAttribute('aria-label')).toContain('joker');
  await user.keyboard('{Home}');
  expect(document.activeElement?.getAttribute('aria-label')).toBe('3 bam');
});

test('space picks and drops a tile, escape clears every pick', async () => {
  const user = userEvent.setup();
  render(<Harness />);
  await user.tab();
  await user.keyboard(' ');
  expect(screen.getByRole('button', { name: '3 bam, picked' }).getAttribute('aria-pressed')).toBe('true');
  await user.keyboard('{ArrowRight} ');
  expect(screen.getByRole('button', { name: '7 crack, picked' })).toBeTruthy();
  await user.keyboard(' ');
  expect(screen.getByRole('button', { name: '7 crack' }).getAttribute('aria-pressed')).toBe('false');
  await user.keyboard('{ArrowRight} {Escape}');
  expect(screen.queryAllByRole('button', { pressed: true })).toHaveLength(0);
});

test('enter commits the picked tiles', async () => {
  const user = userEvent.setup();
  const onCommit = vi.fn();
  render(<Harness onCommit={onCommit} />);
  await user.tab();
  await user.keyboard(' {ArrowRight} {ArrowRight} {Enter}');
  expect(onCommit).toHaveBeenCalledWith(['a', 'e', 'c']);
});

test('a joker cannot be picked, by click or by key, and the rack says why', async () => {
  const user = userEvent.setup();
  render(<Harness />);
  const joker = screen.getByRole('button', { name: /joker/ });
  expect(joker.getAttribute('aria-disabled')).toBe('true');
  await user.click(joker);
  expect(screen.getByRole('status').textContent).toBe(JOKER_REFUSAL);
  expect(joker.getAttribute('aria-pressed')).toBe('false');
  await user.keyboard(' ');
  expect(screen.queryAllByRole('button', { pressed: true })).toHaveLength(0);
});

test('clicking picks up to the pass size and no more', async () => {
  const user = userEvent.setup();
  render(<Harness />);
  for (const name of ['3 bam', '7 crack', '2 dot', 'north wind']) await user.click(screen.getByRole('button', { name }));
  expect(screen.getAllByRole('button', { pressed: true })).toHaveLength(3);
});

test('shift with an arrow moves a tile along the rack and says where', async () => {
  const user = userEvent.setup();
  render(<Harness />);
  await user.tab();
  await user.keyboard('{Shift>}{ArrowRight}{/Shift}');
  expect(names().slice(0, 2)).toEqual(['7 crack', '3 bam']);
  expect(screen.getByRole('status').textContent).toBe('Moved 3 bam to place 2 of 5.');
});

test('received and committed tiles carry a word, not only a colour', () => {
  render(<Rack label="Your rack" tiles={TILES} received={['c']} sending={['a']} />);
  expect(screen.getByRole('button', { name: '2 dot, just received' }).textContent).toContain('New');
  expect(screen.getByRole('button', { name: '3 bam, in your committed pass' }).textContent).toContain('Sending');
});
