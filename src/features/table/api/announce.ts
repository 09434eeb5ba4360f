import { PASS_DIRECTION } from '../../../../shared/exchange';
import type { TableStateDto } from '../../../../shared/protocol';
import { seatFrom } from '../../../../shared/seats';
import { tileName } from '../../../../shared/tiles';
import { sideOf, SIDE_WORDS } from '../../../lib/seating';

/** "You received 3 tiles from across: 2 dot, north wind, flower." when a pass has just landed. */
export function receivedAnnouncement(before: TableStateDto | null, after: TableStateDto): string | null {
  const me = after.mySeat;
  const history = after.view?.history ?? [];
  if (!me || !after.view || history.length === 0) return null;
  if (before && (before.view?.history.length ?? 0) >= history.length) return null;
  const last = history[history.length - 1];
  const direction = PASS_DIRECTION[last.phase];
  const ids = last.received[me] ?? [];
  if (!direction || ids.length === 0) return null;
  const from = seatFrom(me, direction);
  const side = sideOf(me, from);
  const where = side === 'top' ? 'across' : SIDE_WORDS[side];
  const names = ids.map((id) => tileName(after.view!.kinds[id]));
  return `You received ${ids.length} ${ids.length === 1 ? 'tile' : 'tiles'} from ${where} (${from}): ${names.join(', ')}.`;
}
