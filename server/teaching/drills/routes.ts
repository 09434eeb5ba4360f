import { randomUUID } from 'node:crypto';
import { Router } from 'express';
import { STARTER_LIST_ID, STARTER_LIST_NAME } from '../../../shared/pattern-lists';
import { requireTeacher } from '../../auth/guards';
import { DrillRow } from '../../db/models';
import { drillJson, readDrillJson } from './file';
import { checkDrill, drillData, drillDto, drillNotFound, findOwnDrill } from './service';
import { FileRejected } from '../files/json-text';
import { listName, mayUseList } from '../pattern-lists/service';
import { download, fileStem } from '../files/download';
import { fileError, uploadedText, uploadOne } from '../files/upload';

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
    download(res, `${fileStem(row.name)}.rackside-drill.json`, 'application/json', drillJson(drillData(row), await listName(row.patternListId)));
  });

  return router;
}
