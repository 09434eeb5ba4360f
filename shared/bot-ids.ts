/**
 * The ids of the bot strategies a host can seat: all the wire needs to know of the bots, so that the
 * protocol (and the client) name them without loading them. shared/analysis/bots.ts defines one
 * strategy for each id.
 */
export const BOT_STRATEGY_IDS = ['random', 'multiples', 'advised'] as const;

export type BotStrategyId = (typeof BOT_STRATEGY_IDS)[number];
