import { randomUUID } from 'node:crypto';
import { Router } from 'express';
import { STARTER_LIST_ID, STARTER_LIST_NAME } from '../../shared/pattern-lists';
import { requireTeacher } from '../auth/guards';
import { DrillRow } from '../db/models';
import { drillJson, readDrillJson } from '../teaching/drill-file';
import { checkDrill, drillData, drillDto, drillNotFound, findOwnDrill } from '../teaching/drills';
import { FileRejected } from '../teaching/json-text';
import { listName, mayUseList } from '../teaching/pattern-source';
import { fileError, uploadedText, uploadOne } from '../teaching/upload';
import { fileStem } from './pattern-lists';

export function drillsRouter() {
  const router = Router();
  router.use(requireTeacher);

  router.get('/', async (req, res) => {
    const rows = await DrillRow.findAll({ where: { ownerId: req.user!.id }, order: [['updatedAt', 'DESC']], limit: 500 });
    res.json({ drills: await Promise.all(rows.map(drillDto)) });
  });

  router.post('/', async (req, res) => {
    const drill = await checkDrill(req.user!.id, req.body);
    const row = await DrillRow.create({ id: randomUUID(), ownerId: req.user!.id, ...drill });
    res.status(201).json({ drill: await drillDto(row) });
  });

  router.post('/import', uploadOne(['json']), async (req, res) => {
    let read: ReturnType<typeof readDrillJson>;
    try {
      read = readDrillJson(uploadedText(req.file!));
    } catch (err) {
      if (err instanceof FileRejected) throw fileError(err);
      throw err;
    }
    const { drill } = read;
    const notes: string[] = [];
    // A list named by id belongs to whoever exported the drill; here only the importer's own lists count.
    if (!(await mayUseList(req.user!.id, drill.patternListId))) {
      notes.push(`The pattern list “${read.listName ?? drill.patternListId}” is not one of yours, so this drill uses the ${STARTER_LIST_NAME.toLowerCase()}. Import that list and pick it in the drill if you have it.`);
      drill.patternListId = STARTER_LIST_ID;
    }
    const row = await DrillRow.create({ id: randomUUID(), ownerId: req.user!.id, ...drill });
    res.status(201).json({ drill: await drillDto(row), notes });
  });

  router.get('/:id', async (req, res) => {
    const row = await findOwnDrill(req.user!.id, String(req.params.id));
    if (!row) throw drillNotFound();
    res.json({ drill: await drillDto(row) });
  });

  router.put('/:id', async (req, res) => {
    const row = await findOwnDrill(req.user!.id, String(req.params.id));
    if (!row) throw drillNotFound();
    const drill = await checkDrill(req.user!.id, req.body);
    await row.update(drill);
    res.json({ drill: await drillDto(row) });
  });

  router.delete('/:id', async (req, res) => {
    const row = await findOwnDrill(req.user!.id, String(req.params.id));
    if (!row) throw drillNotFound();
    await row.destroy();
    res.status(204).end();
  });

  router.get('/:id/export', async (req, res) => {
    const row = await findOwnDrill(req.user!.id, String(req.params.id));
    if (!row) throw drillNotFound();
    res.setHeader('Content-Type', 'application/json; charset=utf-8');
    res.setHeader('Content-Disposition', `attachment; filename="${fileStem(row.name)}.rackside-drill.json"`);
    res.setHeader('Cache-Control', 'no-store');
    res.send(drillJson(drillData(row), await listName(row.patternListId)));
  });

  return router;
}
