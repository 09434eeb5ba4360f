import { randomUUID } from 'node:crypto';
import { Router } from 'express';
import { withCurrentFields, type Pattern } from '../../../shared/analysis/pattern';
import { patternFieldErrors, patternListInputSchema, STARTER_LIST_ID } from '../../../shared/pattern-lists';
import { requireTeacher } from '../../auth/guards';
import { DrillRow, PatternListRow } from '../../db/models';
import { issueMessage } from '../../../shared/issue-words';
import { badInput, HttpError } from '../../errors';
import { download, fileStem } from '../files/download';
import { FileRejected } from '../files/json-text';
import { fileError, fileKindOf, uploadedText, uploadOne } from '../files/upload';
import type { PatternListFile } from './file';
import { patternListCsv, readPatternListCsv } from './file-csv';
import { patternListJson, readPatternListJson } from './file-json';
import { dtoOf, findOwnList, starterDto, starterSummary, summaryOf } from './service';

const notFound = () => new HttpError(404, 'NOT_FOUND', 'There is no pattern list with that id among yours.');
const readOnly = () => new HttpError(403, 'READ_ONLY', 'The starter list can’t be changed. Copy it to make a list of your own.');

/**
 * Checks a list from the editor: the list's own fields, then every pattern by the analysis schema.
 * A page loaded before `value` and `sealed` may still send `points` and `concealed`; they are renamed.
 */
function parseList(body: unknown): PatternListFile {
  const parsed = patternListInputSchema.safeParse(body ?? {});
  if (!parsed.success) throw badInput(parsed.error);
  parsed.data.patterns = parsed.data.patterns.map(withCurrentFields);
  const fields = patternFieldErrors(parsed.data.patterns);
  if (Object.keys(fields).length) {
    const first = Object.values(fields)[0];
    throw new HttpError(400, 'BAD_INPUT', `Some patterns need another look. ${first}`, fields);
  }
  return { ...parsed.data, patterns: parsed.data.patterns as Pattern[] };
}

export function patternListsRouter() {
  const router = Router();
  router.use(requireTeacher);

  router.get('/', async (req, res) => {
    const rows = await PatternListRow.findAll({ where: { ownerId: req.user!.id }, order: [['updatedAt', 'DESC']], limit: 500 });
    res.json({ lists: [starterSummary(), ...rows.map(summaryOf)] });
  });

  router.post('/', async (req, res) => {
    const list = parseList(req.body);
    const row = await PatternListRow.create({ id: randomUUID(), ownerId: req.user!.id, ...list });
    res.status(201).json({ list: dtoOf(row) });
  });

  router.post('/import', uploadOne(['json', 'csv']), async (req, res) => {
    const file = req.file!;
    let list: PatternListFile;
    try {
      const text = uploadedText(file);
      list = fileKindOf(file.originalname) === 'csv' ? readPatternListCsv(text) : readPatternListJson(text);
    } catch (err) {
      if (err instanceof FileRejected) throw fileError(err);
      throw err;
    }
    const row = await PatternListRow.create({ id: randomUUID(), ownerId: req.user!.id, ...list });
    res.status(201).json({ list: dtoOf(row) });
  });

  router.get('/:id', async (req, res) => {
    if (req.params.id === STARTER_LIST_ID) return void res.json({ list: starterDto() });
    const row = await findOwnList(req.user!.id, String(req.params.id));
    if (!row) throw notFound();
    res.json({ list: dtoOf(row) });
  });

  router.post('/:id/copy', async (req, res) => {
    const id = String(req.params.id);
    const source = id === STARTER_LIST_ID ? starterDto() : await findOwnList(req.user!.id, id).then((row) => (row ? dtoOf(row) : null));
    if (!source) throw notFound();
    const name = patternListInputSchema.shape.name.optional().safeParse(req.body?.name);
    if (!name.success) throw new HttpError(400, 'BAD_INPUT', 'Some fields need another look.', { name: issueMessage(name.error.issues[0]) });
    const row = await PatternListRow.create({
      id: randomUUID(),
      ownerId: req.user!.id,
      name: name.data ?? `Copy of ${source.name}`.slice(0, 80),
      description: source.description,
      patterns: source.patterns,
    });
    res.status(201).json({ list: dtoOf(row) });
  });

  router.put('/:id', async (req, res) => {
    if (req.params.id === STARTER_LIST_ID) throw readOnly();
    const row = await findOwnList(req.user!.id, String(req.params.id));
    if (!row) throw notFound();
    const list = parseList(req.body);
    await row.update(list);
    res.json({ list: dtoOf(row) });
  });

  router.delete('/:id', async (req, res) => {
    if (req.params.id === STARTER_LIST_ID) throw readOnly();
    const row = await findOwnList(req.user!.id, String(req.params.id));
    if (!row) throw notFound();
    const users = await DrillRow.findAll({ where: { ownerId: req.user!.id, patternListId: row.id }, attributes: ['name'], limit: 5 });
    if (users.length) {
      throw new HttpError(409, 'LIST_IN_USE', `Drills use this list (${users.map((d) => `“${d.name}”`).join(', ')}). Pick another list for them first.`);
    }
    await row.destroy();
    res.status(204).end();
  });

  router.get('/:id/export', async (req, res) => {
    const format = req.query.format === undefined ? 'json' : String(req.query.format);
    if (format !== 'json' && format !== 'csv') {
      throw new HttpError(400, 'BAD_INPUT', 'A pattern list downloads as json or csv.', { format: 'Pick json or csv.' });
    }
    const id = String(req.params.id);
    const list = id === STARTER_LIST_ID ? starterDto() : await findOwnList(req.user!.id, id).then((row) => (row ? dtoOf(row) : null));
    if (!list) throw notFound();
    const stem = `${fileStem(list.name)}.rackside-patterns`;
    if (format === 'csv') download(res, `${stem}.csv`, 'text/csv', patternListCsv(list));
    else download(res, `${stem}.json`, 'application/json', patternListJson(list));
  });

  return router;
}
