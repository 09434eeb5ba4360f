/** A broken list file is refused with every pattern's problems, each at its line and pattern. */
import { expect } from 'vitest';
import { PatternListRow } from '../../server/db/models';
import { teachingTest as test, upload, windsPattern } from './teaching-helpers';

/** Rows of one 14-tile pattern; `value` and the last group's size are the knobs. */
function anchorRows(id: string, { value = '30', lastSize = '3' } = {}) {
  return [`${id},Anchor ${id},anchor,${value},no,2,flower,,,`, `${id},,,,,3,wind-n,,,`, `${id},,,,,3,wind-e,,,`, `${id},,,,,3,,A,n,`, `${id},,,,,${lastSize},,A,,match`];
}
const head = ['rackside-pattern-list,2', 'name,Anchor list', 'id,name,family,value,sealed,size,tile,suit,rank,dragon'];

test('a CSV broken in several patterns names every pattern at fault, each with its line', async ({ teaching: t }) => {
  // Line 4: anchor-1, one tile short. Line 9: anchor-2, one tile short. Line 14: anchor-3, a value in words.
  const text = [...head, ...anchorRows('anchor-1', { lastSize: '2' }), ...anchorRows('anchor-2', { lastSize: '2' }), ...anchorRows('anchor-3', { value: 'forty' }), ...anchorRows('anchor-4')].join('\n');
  const res = await upload(t.ines, '/api/pattern-lists/import', text, 'anchors.csv');
  expect(res.status).toBe(400);
  const fields = res.body.error.fields as Record<string, string>;
  expect(fields['line 4, pattern anchor-1']).toMatch(/^The groups add up to 13 tiles; a hand has 14\./);
  expect(fields['line 9, pattern anchor-2']).toMatch(/^The groups add up to 13 tiles; a hand has 14\./);
  expect(fields['line 14, pattern anchor-3, column value']).toBe('value must be a whole number, such as 40.');
  expect(Object.keys(fields).filter((k) => k !== 'file')).toHaveLength(3);
  expect(res.body.error.message).toMatch(/^The file was not imported: 3 problems/);
  expect(await PatternListRow.count()).toBe(0);
});

test('a CSV with a problem in every one of thirty patterns lists all thirty', async ({ teaching: t }) => {
  const rows = Array.from({ length: 30 }, (_, i) => anchorRows(`anchor-${i + 1}`, { lastSize: '2' })).flat();
  const res = await upload(t.ines, '/api/pattern-lists/import', [...head, ...rows].join('\n'), 'anchors.csv');
  expect(res.status).toBe(400);
  const keys = Object.keys(res.body.error.fields).filter((k) => k !== 'file');
  expect(keys).toHaveLength(30);
  expect(keys[29]).toBe('line 149, pattern anchor-30');
});

test('a JSON list broken in several patterns names each by its place, id and line', async ({ teaching: t }) => {
  const short = { ...structuredClone(windsPattern), id: 'anchor-1', groups: windsPattern.groups.slice(1) };
  const wordy = { ...structuredClone(windsPattern), id: 'anchor-2', value: 'forty' };
  const old = { ...structuredClone(windsPattern), id: 'anchor-3', points: 20 } as Record<string, unknown>;
  delete old.value;
  const text = JSON.stringify({ format: 'rackside-pattern-list', version: 2, name: 'Anchor list', patterns: [short, wordy, windsPattern, old] }, null, 2);
  const lineOf = (needle: string) => text.split('\n').findIndex((l) => l.includes(needle)) + 1;
  const res = await upload(t.ines, '/api/pattern-lists/import', text, 'anchors.json');
  expect(res.status).toBe(400);
  const fields = res.body.error.fields as Record<string, string>;
  // Each pattern's problem is at the line where that pattern (or its field) is written.
  const groupsLine = text.split('\n').findIndex((l, i) => i > lineOf('"anchor-1"') && l.includes('"groups"')) + 1;
  expect(fields[`line ${groupsLine}, pattern 1 (anchor-1), groups`]).toMatch(/^The groups add up to 12 tiles; a hand has 14\./);
  expect(fields[`line ${lineOf('"forty"')}, pattern 2 (anchor-2), value`]).toMatch(/^A value is a whole number from 0 to 1000\./);
  expect(fields[`line ${lineOf('"points"')}, pattern 4 (anchor-3), points`]).toMatch(/^Version 2 names this field "value"/);
  expect(Object.keys(fields).filter((k) => k !== 'file')).toHaveLength(3);
  expect(await PatternListRow.count()).toBe(0);
});

test('a copy of the starter list, and an imported list, do not say they can’t be changed', async ({ teaching: t }) => {
  const starter = await t.ines.get('/api/pattern-lists/starter');
  expect(starter.body.list.readOnly).toBe(true);
  const copy = await t.ines.post('/api/pattern-lists/starter/copy').send({});
  expect(copy.status).toBe(201);
  expect(copy.body.list.readOnly).toBe(false);
  expect(copy.body.list.description).not.toMatch(/can[’']t be changed/);
  const exported = await t.ines.get('/api/pattern-lists/starter/export?format=json');
  expect(exported.text).not.toMatch(/can[’']t be changed/);
  const imported = await upload(t.ines, '/api/pattern-lists/import', exported.text, 'starter.json');
  expect(imported.status).toBe(201);
  expect(imported.body.list.description).not.toMatch(/can[’']t be changed/);
  // A list exported by an older Rackside still carries the sentence; it is not kept.
  const older = exported.text.replace('"description": "Rackside’s own practice list.', '"description": "Rackside’s own practice list. It can’t be changed; copy it to make a list of your own.');
  const again = await upload(t.ines, '/api/pattern-lists/import', older, 'starter-old.json');
  expect(again.status).toBe(201);
  expect(again.body.list.description).toBe('Rackside’s own practice list.');
});

test('a control character in an imported file, raw or written as an escape, is refused with its place; nothing is saved', async ({ teaching: t }) => {
  const good = [...head, ...anchorRows('anchor-1')];
  const csv = await upload(t.ines, '/api/pattern-lists/import', [good[0], 'name,Anchor\u001b list', ...good.slice(2)].join('\n'), 'anchors.csv');
  expect(csv.status).toBe(400);
  expect(csv.body.error.fields.file).toMatch(/^line 2, column 12: remove the control character/);
  const json = JSON.stringify({ format: 'rackside-pattern-list', version: 2, name: 'imp\u0000nul', patterns: [] });
  const escaped = await upload(t.ines, '/api/pattern-lists/import', json, 'list.json');
  expect(escaped.status).toBe(400);
  expect(escaped.body.error.fields.name).toMatch(/control character/);
  expect(await PatternListRow.count()).toBe(0);
});

test('a malformed or cut-short upload is answered 400, never a server error', async ({ teaching: t }) => {
  const body = '--XB\r\nContent-Disposition form-data; name="file"; filename="a.json"\r\n\r\n{}\r\n--XB--\r\n';
  const malformed = await t.ines.post('/api/pattern-lists/import').set('Content-Type', 'multipart/form-data; boundary=XB').send(body);
  expect(malformed.status).toBe(400);
  expect(malformed.body.error.code).toBe('BAD_UPLOAD');
  const cut = await t.ines.post('/api/pattern-lists/import').set('Content-Type', 'multipart/form-data; boundary=XB').send('--XB\r\nContent-Disposition: form-data; name="file"; filename="a.json"\r\n\r\n{"fo');
  expect(cut.status).toBe(400);
  const noBoundary = await t.ines.post('/api/drills/import').set('Content-Type', 'multipart/form-data').send('x');
  expect(noBoundary.status).toBe(400);
});
