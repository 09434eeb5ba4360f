/** Every zod issue that reaches a person is in Rackside's own words: what is wrong and what to do. */
import { expect } from 'vitest';
import { z } from 'zod';
import { fieldErrors } from '../../shared/field-errors';
import { issueMessage } from '../../shared/issue-words';
import { smallList, teachingTest as test, upload, windsPattern } from './teaching-helpers';

/** zod's own English wording (its default messages), which must never reach a person. */
const ZOD_WORDING = /Invalid input|Invalid option|Too (big|small)|Unrecognized key|expected .* received|Invalid string|must match pattern|Invalid email/;

const schema = z
  .object({
    value: z.number().int(),
    ratio: z.number(),
    title: z.string().min(1).max(5),
    code: z.string().min(3),
    sealed: z.boolean(),
    items: z.array(z.string()).min(1).max(2),
    pair: z.array(z.number()).min(2),
    kind: z.enum(['bam', 'crack', 'dot']),
    dragon: z.literal('match'),
    size: z.number().min(1).max(6),
    inner: z.object({ seed: z.string() }).strict(),
    slug: z.string().regex(/^[a-z]+$/),
    mine: z.string().max(3, 'Keep it to three letters.'),
  })
  .strict();

function messages(input: unknown) {
  const parsed = schema.safeParse(input);
  if (parsed.success) throw new Error('expected a failure');
  return fieldErrors(parsed.error);
}

test('each kind of zod issue becomes a field error in Rackside words that says what to do', () => {
  const fields = messages({
    value: '40',
    ratio: true,
    title: 'far too long',
    code: 'ab',
    sealed: 'yes',
    items: [],
    pair: [1],
    kind: 'bamboo',
    dragon: 'red',
    size: 9,
    inner: { seed: 's', colour: 'red' },
    slug: 'Not A Slug',
    mine: 'four',
    extra: 1,
  });
  expect(fields).toEqual({
    value: 'value must be a number, such as 40.',
    ratio: 'ratio must be a number, such as 40.',
    title: 'title is too long: shorten it to 5 characters or fewer.',
    code: 'code is too short: write at least 3 characters.',
    sealed: 'sealed must be true or false.',
    items: 'items is empty: add at least one item.',
    pair: 'pair has too few items: give at least 2 items.',
    kind: 'kind must be one of "bam", "crack" or "dot": check its spelling.',
    dragon: 'dragon must be "match".',
    size: 'size is too large: use 6 or less.',
    inner: '"colour" is not a field Rackside knows here: remove it, or check its spelling.',
    slug: 'slug is not in the right form: check which characters it uses.',
    // A schema's own message is already Rackside's: it is kept.
    mine: 'Keep it to three letters.',
    _: '"extra" is not a field Rackside knows here: remove it, or check its spelling.',
  });
});

test('a missing field, a whole number given as a fraction, a number too small and several unknown keys', () => {
  const fields = messages({ value: 1.5, ratio: 1, code: 'abc', sealed: true, items: ['a', 'b', 'c'], pair: [1, 2], kind: 'dot', dragon: 'match', size: 0, inner: { seed: 's' }, slug: 'ok', mine: 'a', one: 1, two: 2 });
  expect(fields.title).toBe('title is missing: add it as text in double quotes, such as "Harbor Lane".');
  expect(fields.value).toBe('value must be a whole number, such as 40.');
  expect(fields.items).toBe('items has too many items: keep it to 2 or fewer.');
  expect(fields.size).toBe('size is too small: use 1 or more.');
  expect(fields._).toBe('"one" and "two" are not fields Rackside knows here: remove them, or check their spelling.');
  for (const message of Object.values(fields)) expect(message).not.toMatch(ZOD_WORDING);
});

test('the mapping words a single issue the same way, whatever field it sits on', () => {
  const parsed = z.object({ patterns: z.array(z.object({ offset: z.number().int() })) }).safeParse({ patterns: [{ offset: 2.5 }] });
  expect(parsed.success).toBe(false);
  expect(issueMessage(parsed.error!.issues[0])).toBe('offset must be a whole number, such as 40.');
  const root = z.object({ a: z.string() }).safeParse('text');
  expect(issueMessage(root.error!.issues[0])).toBe('This must be named fields written { … }.');
});

test('the list editor, the copy route and the drill form answer in Rackside words, never zod wording', async ({ teaching: t }) => {
  const bad = { ...smallList, description: 5, colour: 'red' };
  const list = await t.ines.post('/api/pattern-lists').send(bad);
  expect(list.status).toBe(400);
  expect(list.body.error.fields).toEqual({
    description: 'description must be text in double quotes, such as "Harbor Lane".',
    _: '"colour" is not a field Rackside knows here: remove it, or check its spelling.',
  });
  const pattern = await t.ines.post('/api/pattern-lists').send({ ...smallList, patterns: [{ ...windsPattern, family: 'f'.repeat(31), name: 7 }] });
  expect(pattern.status).toBe(400);
  expect(pattern.body.error.fields['patterns.0.family']).toBe('Pattern "harbor-01", family: family is too long: shorten it to 30 characters or fewer.');
  expect(pattern.body.error.fields['patterns.0.name']).toBe('Pattern "harbor-01", name: name must be text in double quotes, such as "Harbor Lane".');
  const copy = await t.ines.post('/api/pattern-lists/starter/copy').send({ name: 12 });
  expect(copy.body.error.fields.name).not.toMatch(ZOD_WORDING);
  const drill = await t.ines.post('/api/drills').send({ name: 'Week 1', seed: 'harbor', patternListId: 5, racks: { east: ['bam2'], centre: [] } });
  expect(drill.status).toBe(400);
  for (const message of [...Object.values(pattern.body.error.fields), ...Object.values(copy.body.error.fields), ...Object.values(drill.body.error.fields)] as string[]) {
    expect(message).not.toMatch(ZOD_WORDING);
  }
});

test('a drill file with a wrong type or an unknown field is refused in Rackside words', async ({ teaching: t }) => {
  const file = {
    format: 'rackside-drill',
    version: 1,
    name: 'Week 1',
    deal: { seed: 'harbor-lane', jokers: true, racks: {}, colour: 'red' },
    parts: { secondCharleston: true, courtesy: true },
    patternList: { id: 5 },
  };
  const res = await upload(t.ines, '/api/drills/import', JSON.stringify(file), 'week.json');
  expect(res.status).toBe(400);
  expect(res.body.error.fields['patternList.id']).toBe('id must be text in double quotes, such as "Harbor Lane".');
  expect(res.body.error.fields.deal).toBe('"colour" is not a field Rackside knows here: remove it, or check its spelling.');
  for (const message of Object.values(res.body.error.fields) as string[]) expect(message).not.toMatch(ZOD_WORDING);
});
