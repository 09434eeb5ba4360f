/**
 * Same deal, compared. Four ways in: a lesson's tables, a drill's tables, the deal of one
 * exchange, or a seed. Hosts and admins see every table; a player sees a deal once they have
 * finished a table on it and have none still to play.
 */
import { Router } from 'express';
import { Op } from 'sequelize';
import { requireUser } from '../../auth/guards';
import { DrillRow, ExchangeRow, isParticipant, LessonTable, TableRow } from '../../db/models';
import { HttpError } from '../../errors';
import { listsFor } from '../../services/exchange-stats';
import { lessonFor } from '../lessons/service';
import { compareExchanges, dealKey } from './service';

const MAX_ROWS = 200;
const SEED_MAX = 120;

function exchangesOfTables(tableIds: string[]) {
  return tableIds.length ? ExchangeRow.findAll({ where: { tableId: { [Op.in]: tableIds } }, order: [['startedAt', 'ASC']], limit: MAX_ROWS }) : Promise.resolve([]);
}

export function comparisonsRouter() {
  const router = Router();
  router.use(requireUser);

  router.get('/lessons/:id', async (req, res) => {
    const { lesson } = await lessonFor(req, req.params.id);
    const links = await LessonTable.findAll({ where: { lessonId: lesson.id }, order: [['index', 'ASC']] });
    const rows = await exchangesOfTables(links.map((l) => l.tableId));
    res.json({ comparison: await compareExchanges(rows, req.user!, lesson.title) });
  });

  router.get('/drills/:id', async (req, res) => {
    const drill = await DrillRow.findByPk(String(req.params.id));
    if (!drill) throw new HttpError(404, 'NOT_FOUND', 'There is no drill with that id.');
    const user = req.user!;
    if (drill.ownerId !== user.id && user.role !== 'admin') {
      throw new HttpError(403, 'FORBIDDEN', 'Only the teacher who owns this drill can compare all its tables. Players open the comparison from their lesson or their exchange.');
    }
    const tables = await TableRow.findAll({ where: { options: { drillId: drill.id } }, attributes: ['id'], limit: MAX_ROWS });
    const rows = await exchangesOfTables(tables.map((t) => t.id));
    res.json({ comparison: await compareExchanges(rows, user, drill.name) });
  });

  router.get('/exchanges/:id', async (req, res) => {
    const row = await ExchangeRow.findByPk(String(req.params.id));
    if (!row) throw new HttpError(404, 'NOT_FOUND', 'There is no exchange with that id.');
    const user = req.user!;
    if (user.role !== 'admin' && row.hostId !== user.id && !isParticipant(row, user.id)) {
      throw new HttpError(403, 'FORBIDDEN', 'Only the players, the host and admins can compare this exchange.');
    }
    if (row.status !== 'done') throw new HttpError(409, 'NOT_FINISHED', 'This exchange is still under way; the comparison opens when it ends.');
    // The host's tables on the same seed, narrowed to this exchange's own deal.
    const same = await ExchangeRow.findAll({ where: { hostId: row.hostId, options: { seed: row.options.seed } }, order: [['startedAt', 'ASC']], limit: MAX_ROWS });
    const lists = await listsFor([row, ...same]);
    const key = dealKey(row.options, lists.get(row.id)!.id);
    const rows = same.filter((r) => dealKey(r.options, lists.get(r.id)!.id) === key);
    res.json({ comparison: await compareExchanges(rows, user, `Tables that played the deal of ${row.tableName}`) });
  });

  router.get('/', async (req, res) => {
    const seed = typeof req.query.seed === 'string' ? req.query.seed.trim() : '';
    if (!seed || seed.length > SEED_MAX) {
      throw new HttpError(400, 'BAD_INPUT', 'Some fields need another look.', { seed: `Name a seed of 1 to ${SEED_MAX} characters, such as harbor-lane-week-01.` });
    }
    const user = req.user!;
    const all = await ExchangeRow.findAll({ where: { options: { seedName: seed } }, order: [['startedAt', 'ASC']], limit: MAX_ROWS });
    // The viewer's own tables on this seed name, and those of any host at whose table they played it.
    const hosts = new Set([user.id, ...all.filter((r) => isParticipant(r, user.id)).map((r) => r.hostId)]);
    const rows = user.role === 'admin' ? all : all.filter((r) => hosts.has(r.hostId));
    // One answer whether nobody dealt the seed or only others did: a guessed seed is never confirmed.
    if (!rows.length) throw new HttpError(404, 'NOT_FOUND', 'None of your tables, nor any table you played at, has dealt that seed.');
    res.json({ comparison: await compareExchanges(rows, user, `Tables on seed ${seed}`) });
  });

  return router;
}
