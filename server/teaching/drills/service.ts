/** Checking and presenting drills; shared by the drill routes and the table route that deals from one. */
import { drillDealErrors, drillInputSchema, presetRacksOf, type DrillData, type DrillDto } from '../../../shared/drills';
import { DrillRow } from '../../db/models';
import { badInput, HttpError } from '../../errors';
import { listName, mayUseList } from '../pattern-lists/service';

export const drillNotFound = () => new HttpError(404, 'NOT_FOUND', 'There is no drill with that id among yours.');

export function findOwnDrill(ownerId: number, id: string) {
  return DrillRow.findOne({ where: { id, ownerId } });
}

export const listNotYours = 'Pick the starter list or one of your own lists.';

/** The drill's fields, its deal as the engine sees it, and its pattern list, all checked; field errors otherwise. */
export async function checkDrill(ownerId: number, body: unknown): Promise<DrillData> {
  const parsed = drillInputSchema.safeParse(body ?? {});
  if (!parsed.success) throw badInput(parsed.error);
  const fields = drillDealErrors(parsed.data);
  if (!(await mayUseList(ownerId, parsed.data.patternListId))) fields.patternListId = listNotYours;
  if (Object.keys(fields).length) {
    throw new HttpError(400, 'BAD_INPUT', `Some fields need another look. ${Object.values(fields)[0]}`, fields);
  }
  return { ...parsed.data, racks: presetRacksOf(parsed.data.racks) };
}

export function drillData(row: DrillRow): DrillData {
  return {
    name: row.name,
    description: row.description,
    seed: row.seed,
    jokers: row.jokers,
    secondCharleston: row.secondCharleston,
    courtesy: row.courtesy,
    racks: row.racks,
    patternListId: row.patternListId,
  };
}

export async function drillDto(row: DrillRow): Promise<DrillDto> {
  return { id: row.id, ...drillData(row), patternListName: await listName(row.patternListId), updatedAt: row.updatedAt.toISOString() };
}

/** What a table dealt from a drill takes from it: the deal, the parts that run and the pattern list. */
export function drillTableOptions(drill: DrillRow) {
  return {
    seed: drill.seed,
    jokers: drill.jokers,
    secondCharleston: drill.secondCharleston,
    courtesy: drill.courtesy,
    patternListId: drill.patternListId,
    drillId: drill.id,
    drillName: drill.name,
    ...(Object.keys(drill.racks).length ? { racks: drill.racks } : {}),
  };
}
