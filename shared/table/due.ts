/** What a table does by itself: settle a pass every seat has committed, and what its bots choose. */
import { chooseBotAction, type BotStrategyId } from '../analysis/bots';
import type { Pattern } from '../analysis';
import { canResolve, isPassPhase, viewFor } from '../exchange';
import type { Action } from '../exchange/types';
import { SEATS, type Seat } from '../seats';
import type { LogEvent, Table, TableExchange } from './types';

/**
 * The event a fully committed step calls for, if any: on a table that holds every pass, a huddle
 * the first time the pass is complete, else the resolve. Nothing while a huddle is open.
 */
export function dueEvent(exchange: TableExchange, huddleEveryPass: boolean): LogEvent | null {
  const { state, huddle } = exchange;
  if (!canResolve(state) || huddle.open) return null;
  if (huddleEveryPass && isPassPhase(state.phase) && huddle.heldAt !== state.history.length) return { type: 'huddle-call', auto: true };
  return { type: 'resolve' };
}

/**
 * What a bot at `seat` does now, if anything. In the vote, bots wait until every person at the
 * table has voted (so nobody is skipped past the vote by a bot's instant stop), and on a table set
 * so (`botsPlaySecond`), they always vote for the second Charleston.
 */
export function botAction(table: Table, seat: Seat, patterns: readonly Pattern[], botsPlaySecond: boolean): Action | null {
  const live = table.exchange;
  const bot = table.seats[seat];
  if (!live || bot?.kind !== 'bot') return null;
  if (live.state.phase === 'vote') {
    const people = SEATS.filter((s) => table.seats[s]?.kind === 'user');
    if (people.some((s) => live.state.votes[s] === undefined)) return null;
    if (botsPlaySecond) return live.state.votes[seat] === undefined ? { type: 'vote', stop: false } : null;
  }
  return chooseBotAction(bot.strategy as BotStrategyId, viewFor(live.state, seat), patterns, `${live.id}:${seat}`);
}
