import { Router } from 'express';
import { Op } from 'sequelize';
import type { ExchangeReplayDto, ExchangeSummaryDto } from '../../shared/protocol';
import type { LogEntry } from '../../shared/exchange/types';
import { SEATS, type Seat } from '../../shared/seats';
import { requireUser } from '../auth/guards';
import { ExchangeEventRow, ExchangeRow, HuddleNoteRow, isParticipant } from '../db/models';
import { HttpError } from '../errors';

function seatOf(row: ExchangeRow, userId: number): Seat | null {
  return SEATS.find((s) => { const o = row.seats[s]; return o?.kind === 'user' && o.userId === userId; }) ?? null;
}

export function exchangesRouter() {
  const router = Router();
  router.use(requireUser);

  router.get('/', async (req, res) => {
    const userId = req.user!.id;
    const rows = await ExchangeRow.findAll({
      where: { [Op.or]: [{ hostId: userId }, { participants: { [Op.like]: `%,${userId},%` } }] },
      order: [['startedAt', 'DESC']],
      limit: 500,
    });
    const exchanges: ExchangeSummaryDto[] = rows.map((r) => ({
        id: r.id,
        tableId: r.tableId,
        tableName: r.tableName,
        seat: seatOf(r, userId),
        status: r.status,
        startedAt: r.startedAt.toISOString(),
      finishedAt: r.finishedAt?.toISOString() ?? null,
    }));
    res.json({ exchanges });
  });

  router.get('/:id/replay', async (req, res) => {
    const row = await ExchangeRow.findByPk(String(req.params.id));
    if (!row) throw new HttpError(404, 'NOT_FOUND', 'There is no exchange with that id.');
    const user = req.user!;
    if (user.role !== 'admin' && row.hostId !== user.id && !isParticipant(row, user.id)) {
      throw new HttpError(403, 'FORBIDDEN', 'Only the players, the host and admins can replay this exchange.');
    }
    if (row.status !== 'done') throw new HttpError(409, 'NOT_FINISHED', 'This exchange is still under way; its replay opens when it ends.');
    const events = await ExchangeEventRow.findAll({ where: { exchangeId: row.id }, order: [['seq', 'ASC']] });
    const notes = await HuddleNoteRow.findAll({ where: { exchangeId: row.id }, order: [['id', 'ASC']] });
    const log: LogEntry[] = events.flatMap((e): LogEntry[] => {
      if (e.type === 'act') return [{ seat: e.seat as Seat, action: e.payload as LogEntry extends { action: infer A } ? A : never }];
      if (e.type === 'resolve') return [{ resolve: true }];
      return [];
    });
    const replay: ExchangeReplayDto = {
      id: row.id,
      tableId: row.tableId,
      tableName: row.tableName,
      options: row.options,
      log,
      seats: Object.fromEntries(
        SEATS.map((s) => {
          const o = row.seats[s];
          return [s, o ? { displayName: o.displayName, kind: o.kind, ...(o.kind === 'bot' ? { strategy: o.strategy } : {}) } : { displayName: s, kind: 'user' }];
        }),
      ) as ExchangeReplayDto['seats'],
      notes: notes.map((n) => ({
        id: n.id,
        passIndex: n.passIndex,
        phase: n.phase as ExchangeReplayDto['notes'][number]['phase'],
        seat: (n.seat as Seat | null) ?? null,
        authorName: n.authorName,
        text: n.text,
        createdAt: n.createdAt.toISOString(),
      })),
      startedAt: row.startedAt.toISOString(),
      finishedAt: row.finishedAt?.toISOString() ?? null,
    };
    res.json({ replay });
  });

  return router;
}
