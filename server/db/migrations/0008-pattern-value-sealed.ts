import { QueryTypes, type QueryInterface } from 'sequelize';
import { withCurrentFields } from '../../../shared/analysis/pattern';

export const name = '0008-pattern-value-sealed';

/** A stored list's patterns, whether the database hands JSON back parsed (PostgreSQL) or as text (SQLite). */
function patternsOf(stored: unknown): unknown[] {
  const value = typeof stored === 'string' ? (JSON.parse(stored) as unknown) : stored;
  return Array.isArray(value) ? value : [];
}

async function rewrite(qi: QueryInterface, change: (pattern: unknown) => unknown) {
  const rows = await qi.sequelize.query<{ id: string; patterns: unknown }>(`SELECT "id", "patterns" FROM "PatternLists"`, { type: QueryTypes.SELECT });
  for (const row of rows) {
    const before = patternsOf(row.patterns);
    const after = before.map(change);
    if (JSON.stringify(after) === JSON.stringify(before)) continue;
    await qi.sequelize.query(`UPDATE "PatternLists" SET "patterns" = :patterns WHERE "id" = :id`, { replacements: { id: row.id, patterns: JSON.stringify(after) } });
  }
}

/** Version 1's names, for going back down. */
function withFirstFields(pattern: unknown): unknown {
  if (typeof pattern !== 'object' || pattern === null || Array.isArray(pattern)) return pattern;
  const { value, sealed, ...rest } = pattern as Record<string, unknown>;
  if (value === undefined && sealed === undefined) return pattern;
  const { id, name, family, groups, ...others } = rest;
  return { id, name, family, points: value, concealed: sealed, groups, ...others };
}

/**
 * Stored pattern lists take today's field names: a pattern's `points` becomes its `value`, and
 * its `concealed` mark becomes `sealed` (built from the player's own draws, with no calls). The
 * numbers and marks themselves are the teacher's and stay as they were.
 */
export async function up({ context: qi }: { context: QueryInterface }) {
  await rewrite(qi, withCurrentFields);
}

export async function down({ context: qi }: { context: QueryInterface }) {
  await rewrite(qi, withFirstFields);
}
