import { Router } from 'express';
import { Op } from 'sequelize';
import type { ExchangeReplayDto, ExchangeSummaryDto } from '../../shared/protocol';
import { SEATS, seatOfUser, type Seat } from '../../shared/seats';
import { requireUser } from '../auth/guards';
import { ExchangeRow, HuddleNoteRow, isParticipant } from '../db/models';
import { HttpError } from '../errors';
import { storedLog } from '../services/exchange-log';
import { figuresFor, listsFor } from '../services/exchange-stats';
import { dealKey, dealsStillToPlay } from '../teaching/comparisons';

/** Peers read at most: far more than any host's tables on one seed. */
const PEERS_MAX = 5000;

/**
 * For each finished exchange, how many exchanges of its host were dealt the same deal (itself
 * included, finished or still passing), as the comparison of that exchange groups them: one means
 * there is nothing to compare it with yet. One query for the peers, on the seeds in the list.
 */
async function sameDealCounts(rows: readonly ExchangeRow[]): Promise<Map<string, number>> {
  const counts = new Map<string, number>();
  const done = rows.filter((r) => r.status === 'done');
  if (!done.length) return counts;
  const peers = await ExchangeRow.findAll({
    where: { hostId: { [Op.in]: [...new Set(done.map((r) => r.hostId))] }, options: { seed: { [Op.in]: [...new Set(done.map((r) => r.options.seed))] } } },
    attributes: ['id', 'tableId', 'hostId', 'options'],
    order: [['startedAt', 'DESC']],
    limit: PEERS_MAX,
  });
  const lists = await listsFor([...done, ...peers]);
  const keyOf = (r: ExchangeRow) => `${r.hostId}|${dealKey(r.options, lists.get(r.id)!.id)}`;
  const tally = new Map<string, number>();
  for (const peer of peers) tally.set(keyOf(peer), (tally.get(keyOf(peer)) ?? 0) + 1);
  for (const row of done) counts.set(row.id, Math.max(1, tally.get(keyOf(row)) ?? 0));
  return counts;
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
    const seated = rows.filter((r) => r.status === 'done' && seatOfUser(r.seats, userId));
    const figures = await figuresFor(seated, (r) => [seatOfUser(r.seats, userId)!], false);
    const sameDeal = await sameDealCounts(rows);
    const exchanges: ExchangeSummaryDto[] = rows.map((r) => {
      const seat = seatOfUser(r.seats, userId);
      const mine = seat ? figures.get(r.id)?.seats[seat] : undefined;
      return {
        id: r.id,
        tableId: r.tableId,
        tableName: r.tableName,
        seat,
        status: r.status,
        startedAt: r.startedAt.toISOString(),
        finishedAt: r.finishedAt?.toISOString() ?? null,
        awayBefore: mine?.awayBefore ?? null,
        awayAfter: mine?.awayAfter ?? null,
        oddsBefore: mine?.oddsBefore ?? null,
        oddsAfter: mine?.oddsAfter ?? null,
        nearestPattern: mine?.nearest ?? null,
        ...(sameDeal.has(r.id) ? { sameDeal: sameDeal.get(r.id)! } : {}),
      };
    });
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
    const list = (await listsFor([row])).get(row.id)!;
    // The same deal waiting at another of the viewer's seats stays closed: its racks are in here.
    if ((await dealsStillToPlay(user.id, [row.hostId])).has(dealKey(row.options, list.id))) {
      throw new HttpError(409, 'DEAL_STILL_TO_PLAY', 'You are still to play this deal at another table. Its replay opens once that table is done.');
    }
    const log = await storedLog(row.id);
    const notes = await HuddleNoteRow.findAll({ where: { exchangeId: row.id }, order: [['id', 'ASC']] });
    const replay: ExchangeReplayDto = {
      id: row.id,
      tableId: row.tableId,
      tableName: row.tableName,
      options: row.options,
      log,
      patternList: list,
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
