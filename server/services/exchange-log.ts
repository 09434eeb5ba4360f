/** An exchange's engine log as stored: the events that replay(options, log) takes, huddle steps left out. */
import { Op } from 'sequelize';
import type { Action, LogEntry } from '../../shared/exchange/types';
import type { Seat } from '../../shared/seats';
import { ExchangeEventRow } from '../db/models';

type StoredEvent = Pick<ExchangeEventRow, 'type' | 'seat' | 'payload'>;

function logOf(events: readonly StoredEvent[]): LogEntry[] {
  return events.flatMap((e): LogEntry[] => {
    if (e.type === 'act') return [{ seat: e.seat as Seat, action: e.payload as Action }];
    if (e.type === 'resolve') return [{ resolve: true }];
    return [];
  });
}

export async function storedLog(exchangeId: string): Promise<LogEntry[]> {
  return logOf(await ExchangeEventRow.findAll({ where: { exchangeId }, order: [['seq', 'ASC']] }));
}

/** Logs of many exchanges in one query, keyed by exchange id. */
export async function storedLogs(exchangeIds: readonly string[]): Promise<Map<string, LogEntry[]>> {
  const out = new Map<string, LogEntry[]>(exchangeIds.map((id) => [id, []]));
  if (!exchangeIds.length) return out;
  const events = await ExchangeEventRow.findAll({ where: { exchangeId: { [Op.in]: [...exchangeIds] } }, order: [['exchangeId', 'ASC'], ['seq', 'ASC']] });
  const byExchange = new Map<string, ExchangeEventRow[]>();
  for (const e of events) {
    const list = byExchange.get(e.exchangeId);
    if (list) list.push(e);
    else byExchange.set(e.exchangeId, [e]);
  }
  for (const [id, list] of byExchange) out.set(id, logOf(list));
  return out;
}
