/**
 * Rackside's own drill files, JSON, version 1:
 *
 * { "format": "rackside-drill", "version": 1, "name", "description",
 *   "deal": { "seed", "jokers", "racks": { "east": [kind…], … } },
 *   "parts": { "secondCharleston", "courtesy" },
 *   "patternList": { "id", "name" } }
 *
 * The pattern list is named, not carried: on import it is kept when it is the starter list or
 * one of the importer's own lists, and otherwise replaced by the starter list with a note.
 */
import { z } from 'zod';
import { drillDealErrors, drillInputSchema, presetRacksOf, type DrillData } from '../../../shared/drills';
import { issueProblems } from '../../../shared/field-errors';
import { STARTER_LIST_ID } from '../../../shared/pattern-lists';
import { fieldPath, FileRejected, parseJsonFile } from '../files/json-text';

const DRILL_FORMAT = 'rackside-drill';
const DRILL_VERSION = 1;

export function drillJson(drill: DrillData, listName: string): string {
  const file = {
    format: DRILL_FORMAT,
    version: DRILL_VERSION,
    name: drill.name,
    description: drill.description,
    deal: { seed: drill.seed, jokers: drill.jokers, racks: presetRacksOf(drill.racks) },
    parts: { secondCharleston: drill.secondCharleston, courtesy: drill.courtesy },
    patternList: { id: drill.patternListId, name: listName },
  };
  return `${JSON.stringify(file, null, 2)}\n`;
}

const inner = drillInputSchema.shape;
/** A message for a part that is not an object at all; its other problems (an unknown field) are worded by the issue. */
const whenNotObject = (message: string) => (issue: { code: string }) => (issue.code === 'invalid_type' ? message : undefined);
const fileSchema = z
  .object({
    format: z.literal(DRILL_FORMAT, { error: `This is not a Rackside drill file: "format" must be "${DRILL_FORMAT}".` }),
    version: z.literal(DRILL_VERSION, { error: `"version" must be ${DRILL_VERSION}; this Rackside reads version ${DRILL_VERSION}.` }),
    name: inner.name,
    description: inner.description,
    deal: z.object({ seed: inner.seed, jokers: inner.jokers, racks: inner.racks }, { error: whenNotObject('"deal" is an object with "seed", "jokers" and "racks".') }).strict(),
    parts: z
      .object({ secondCharleston: inner.secondCharleston, courtesy: inner.courtesy }, { error: whenNotObject('"parts" is an object with "secondCharleston" and "courtesy".') })
      .strict()
      .default({ secondCharleston: true, courtesy: true }),
    patternList: z
      .object({ id: z.string().min(1).max(64), name: z.string().max(80).optional() }, { error: whenNotObject('"patternList" is an object with "id" and "name".') })
      .strict()
      .default({ id: STARTER_LIST_ID }),
  })
  .strict();

/** Where the deal's field errors sit in the file. */
const FILE_PATH: Record<string, string> = { racks: 'deal.racks' };

/** A drill read from a file, checked by the schema and by the engine, or a rejection naming the field at fault. */
export function readDrillJson(text: string): { drill: DrillData; listName: string | undefined } {
  const data = parseJsonFile(text);
  const parsed = fileSchema.safeParse(data);
  if (!parsed.success) {
    throw new FileRejected(issueProblems(parsed.error.issues, fieldPath).slice(0, 50));
  }
  const f = parsed.data;
  const drill: DrillData = {
    name: f.name,
    description: f.description,
    seed: f.deal.seed,
    jokers: f.deal.jokers,
    racks: f.deal.racks,
    secondCharleston: f.parts.secondCharleston,
    courtesy: f.parts.courtesy,
    patternListId: f.patternList.id,
  };
  const deal = drillDealErrors(drill);
  if (Object.keys(deal).length) {
    throw new FileRejected(Object.entries(deal).map(([key, message]) => ({ where: FILE_PATH[key] ?? `deal.${key}`, message })));
  }
  return { drill, listName: f.patternList.name };
}
