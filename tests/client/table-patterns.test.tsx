import { act as reactAct, screen, waitFor, within } from '@testing-library/react';
import { beforeEach, expect, test, vi } from 'vitest';
import { useTableStore } from '../../src/features/table/api/table-store';
import { fakeApi, renderAt, signedInAs } from './render';
import { fresh, tableState } from './fake-table';

const socket = vi.hoisted(() => ({
  send: vi.fn(async () => ({ ok: true }) as const),
  joinTable: vi.fn(async () => ({ ok: true }) as const),
  leaveTable: vi.fn(),
}));
vi.mock('../../src/features/table/api/socket', () => socket);

beforeEach(() => useTableStore.getState().reset());

/** A list of one pattern nobody else uses, so the panel can only have it from the table. */
const harborList = {
  id: 'l1',
  name: 'Harbor Lane steps list',
  patterns: [
    {
      id: 'harbor-steps', name: 'Harbor steps', family: 'ladder', value: 25, sealed: false,
      groups: [{ size: 4, tile: 'bam1' }, { size: 4, tile: 'bam2' }, { size: 3, tile: 'bam3' }, { size: 3, tile: 'bam4' }],
    },
  ],
};

test('the analysis beside the rack judges by the table’s own pattern list', async () => {
  const calls = fakeApi({ ...signedInAs('player'), 'GET /api/tables/t1/patterns': { status: 200, body: { list: harborList } } });
  renderAt('/tables/t1');
  await waitFor(() => expect(socket.joinTable).toHaveBeenCalled());
  reactAct(() => useTableStore.getState().stateArrived(tableState(fresh(), 'west')));
  const panel = (await screen.findByRole('heading', { name: 'Nearest patterns' })).parentElement!;
  // The nearest pattern named beside the rack is the table's one pattern, not one of the starter list.
  // Named once in the nearest patterns, and again in the advice once the worker has weighed the passes:
  // how many show at the first look depends on how fast the worker answers.
  expect((await within(panel).findAllByText('Harbor steps', { selector: 'span' })).length).toBeGreaterThan(0);
  expect(calls.some((c) => c.key === 'GET /api/tables/t1/patterns')).toBe(true);
});
