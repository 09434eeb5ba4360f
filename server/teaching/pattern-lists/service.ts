/** Where a list's patterns come from: the starter list (served from shared/, read-only) or a teacher's stored list. */
import { starterPatterns, type Pattern } from '../../../shared/analysis';
import { assignmentBound, PATTERN_WORK_LIMITS, withCurrentFields, workIssues } from '../../../shared/analysis/pattern';
import { STARTER_LIST_ID, STARTER_LIST_NAME, type PatternListDto, type PatternListSummaryDto } from '../../../shared/pattern-lists';
import { PatternListRow } from '../../db/models';
import { withoutStarterNote } from './file';

/** The list's own description, carried into copies and exports; that the starter list itself is read-only is shown from `readOnly`. */
const STARTER_DESCRIPTION = 'Rackside’s own practice list.';

export function starterSummary(): PatternListSummaryDto {
  return { id: STARTER_LIST_ID, name: STARTER_LIST_NAME, description: STARTER_DESCRIPTION, patternCount: starterPatterns.length, readOnly: true, updatedAt: null };
}

export function starterDto(): PatternListDto {
  return { ...starterSummary(), patterns: structuredClone(starterPatterns) };
}

export function summaryOf(row: PatternListRow): PatternListSummaryDto {
  return { id: row.id, name: row.name, description: withoutStarterNote(row.description), patternCount: row.patterns.length, readOnly: false, updatedAt: row.updatedAt.toISOString() };
}

/**
 * A stored list's patterns in today's field names. Migration 0008 rewrote the rows stored
 * before `value` and `sealed`; a row written by an older process since is still read.
 */
function storedPatterns(row: PatternListRow): Pattern[] {
  return row.patterns.map((p) => withCurrentFields(p) as Pattern);
}

export function dtoOf(row: PatternListRow): PatternListDto {
  return { ...summaryOf(row), patterns: storedPatterns(row) };
}

/** The owner's own list with that id, or null (another teacher's list is as absent as a missing one). */
export function findOwnList(ownerId: number, id: string) {
  return PatternListRow.findOne({ where: { id, ownerId } });
}

/** Whether a teacher may point a drill or table at this list: the starter list or one of their own. */
export async function mayUseList(ownerId: number, id: string): Promise<boolean> {
  return id === STARTER_LIST_ID || (await findOwnList(ownerId, id)) !== null;
}

/** The list's display name for a drill or table, or the starter's when the list is gone. */
export async function listName(id: string): Promise<string> {
  if (id === STARTER_LIST_ID) return STARTER_LIST_NAME;
  return (await PatternListRow.findByPk(id, { attributes: ['name'] }))?.name ?? STARTER_LIST_NAME;
}

/**
 * A stored list's patterns within today's work limits: a list saved before the limits may hold
 * patterns too costly to judge on the server's one thread; those are left out, and the list is
 * cut where its patterns together reach the list's budget.
 */
function withinWorkLimits(patterns: readonly Pattern[]): Pattern[] {
  const kept: Pattern[] = [];
  let spent = 0;
  for (const pattern of patterns) {
    if (workIssues(pattern).length > 0) continue;
    spent += assignmentBound(pattern);
    if (spent > PATTERN_WORK_LIMITS.listAssignments) break;
    kept.push(pattern);
  }
  return kept;
}

/**
 * The patterns a table judges by. The host's choice was checked when the table opened; a list
 * deleted since (or with nothing left within the work limits) falls back to the starter list,
 * so a table never stops working.
 */
export async function patternsForTable(id: string | undefined): Promise<{ id: string; name: string; patterns: Pattern[] }> {
  if (id && id !== STARTER_LIST_ID) {
    const row = await PatternListRow.findByPk(id);
    const patterns = row ? withinWorkLimits(storedPatterns(row)) : [];
    if (row && patterns.length > 0) return { id: row.id, name: row.name, patterns };
  }
  return { id: STARTER_LIST_ID, name: STARTER_LIST_NAME, patterns: starterPatterns };
}
