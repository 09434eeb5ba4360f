import { randomBytes, randomUUID } from 'node:crypto';
import { Router, type Request } from 'express';
import { Op } from 'sequelize';
import { z } from 'zod';
import { createTableSchema } from '../../shared/protocol';
import { BOT_STRATEGIES } from '../../shared/analysis/bots';
import { SEATS, seatOfUser } from '../../shared/seats';
import { defaultTableOptions } from '../../shared/table';
import { requireUser } from '../auth/guards';
import { TableRow } from '../db/models';
import { badInput, HttpError } from '../errors';
import type { TableRegistry } from '../realtime/registry';
import { absentPresence, tableDto } from '../realtime/table-views';
import { drillNotFound, drillTableOptions, findOwnDrill, listNotYours } from '../teaching/drills';
import { mayUseList, patternsForTable } from '../teaching/pattern-lists';
import type { StoredTableOptions } from '../db/models';

/** The bot a practice table seats: the one that passes as the advice would. */
const PRACTICE_BOT = 'advised';

const seatedAt = (row: TableRow, userId: number) => seatOfUser(row.seats, userId) !== null;

/** The table named in the path, if this user may see it: its host, its players, admins, or anyone with a public table or the invite. */
async function visibleTable(req: Request): Promise<TableRow> {
  const row = await TableRow.findByPk(String(req.params.id));
  if (!row) throw new HttpError(404, 'NOT_FOUND', 'There is no table with that id.');
  const userId = req.user!.id;
  const insider = row.hostId === userId || req.user!.role === 'admin' || seatedAt(row, userId);
  if (row.private && !insider && req.query.invite !== row.inviteCode) {
    throw new HttpError(403, 'INVITE_REQUIRED', 'This table is private. Open it from the invite link the host shared.');
  }
  return row;
}

export function tablesRouter(registry: TableRegistry) {
  const router = Router();
  router.use(requireUser);

  /** The live owner's view when this process has loaded the table, else the row's as stored (nobody counted present). */
  async function dtoOf(row: TableRow, userId: number) {
    const master = await registry.peek(row.id);
    return master ? master.tableDto(userId) : tableDto(row, absentPresence(), userId);
  }

  router.post('/', async (req, res) => {
    const parsed = createTableSchema.safeParse(req.body ?? {});
    if (!parsed.success) throw badInput(parsed.error);
    const { name, options, drillId } = parsed.data;
    const role = req.user!.role;
    if (options?.teaching && role !== 'teacher' && role !== 'admin') {
      // Teaching mode shows the host every rack: a teacher's tool, never a player's.
      throw new HttpError(403, 'FORBIDDEN', 'Only teachers open tables in teaching mode, where the host sees every rack.', {
        'options.teaching': 'Teaching mode is for teachers: the host sees every rack. Turn it off to open this table.',
      });
    }
    const stored: StoredTableOptions = defaultTableOptions(options);
    if (drillId) {
      // A drill deals the table: its seed, preset racks, parts and pattern list override the request's.
      if (req.user!.role !== 'teacher' && req.user!.role !== 'admin') throw new HttpError(403, 'FORBIDDEN', 'Only teachers open tables from drills.');
      const drill = await findOwnDrill(req.user!.id, drillId);
      if (!drill) throw drillNotFound();
      Object.assign(stored, drillTableOptions(drill));
    } else if (!(await mayUseList(req.user!.id, stored.patternListId!))) {
      throw new HttpError(400, 'BAD_INPUT', 'Some fields need another look.', { 'options.patternListId': listNotYours });
    }
    const row = await TableRow.create({
      id: randomUUID(),
      name,
      hostId: req.user!.id,
      hostName: req.user!.displayName,
      private: parsed.data.private ?? false,
      inviteCode: parsed.data.private ? randomBytes(12).toString('base64url') : null,
      options: stored,
      status: 'lobby',
      seats: Object.fromEntries(SEATS.map((s) => [s, null])) as TableRow['seats'],
      currentExchangeId: null,
    });
    res.status(201).json({ table: await dtoOf(row, req.user!.id) });
  });

  /**
   * One click to practise alone: a private table with the player in east and a Coach bot in each
   * other seat, ready for the player to deal. It takes no fields.
   */
  router.post('/practice', async (req, res) => {
    const parsed = z.strictObject({}, { error: 'A practice table takes no fields: send an empty object.' }).safeParse(req.body ?? {});
    if (!parsed.success) throw badInput(parsed.error);
    const bot = BOT_STRATEGIES.find((s) => s.id === PRACTICE_BOT)!;
    const user = req.user!;
    const row = await TableRow.create({
      id: randomUUID(),
      name: 'Practice with three bots',
      hostId: user.id,
      hostName: user.displayName,
      private: true,
      inviteCode: randomBytes(12).toString('base64url'),
      options: defaultTableOptions(),
      status: 'lobby',
      seats: {
        east: { kind: 'user', userId: user.id, displayName: user.displayName },
        south: { kind: 'bot', strategy: bot.id, displayName: `${bot.name} (bot, south)` },
        west: { kind: 'bot', strategy: bot.id, displayName: `${bot.name} (bot, west)` },
        north: { kind: 'bot', strategy: bot.id, displayName: `${bot.name} (bot, north)` },
      },
      currentExchangeId: null,
    });
    res.status(201).json({ table: await dtoOf(row, user.id) });
  });

  router.get('/', async (req, res) => {
    const userId = req.user!.id;
    // Closed tables leave every list; finished tables leave the open list (they live in history).
    const rows = await TableRow.findAll({
      where: { status: { [Op.ne]: 'closed' }, [Op.or]: [{ private: false }, { hostId: userId }] },
      order: [['updatedAt', 'DESC']],
      limit: 200,
    });
    // Private tables where the user sits but does not host are found through the seats.
    const seatedPrivate = await TableRow.findAll({ where: { private: true, status: { [Op.ne]: 'closed' }, hostId: { [Op.ne]: userId } }, order: [['updatedAt', 'DESC']], limit: 500 });
    const mine: TableRow[] = [];
    const open: TableRow[] = [];
    const isMine = (row: TableRow) => row.hostId === userId || seatedAt(row, userId);
    for (const row of rows) {
      if (isMine(row)) mine.push(row);
      else if (row.status !== 'done') open.push(row);
    }
    for (const row of seatedPrivate) if (isMine(row)) mine.push(row);
    res.json({
      mine: await Promise.all(mine.map((r) => dtoOf(r, userId))),
      open: await Promise.all(open.map((r) => dtoOf(r, userId))),
    });
  });

  router.get('/:id', async (req, res) => {
    const row = await visibleTable(req);
    res.json({ table: await dtoOf(row, req.user!.id) });
  });

  /** The pattern list the table's analysis uses, for whoever may see the table. */
  router.get('/:id/patterns', async (req, res) => {
    const row = await visibleTable(req);
    res.json({ list: await patternsForTable(row.options.patternListId) });
  });

  return router;
}
