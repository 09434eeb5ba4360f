/** The full pattern schema and the checker that explains, in words, what is wrong. */
import { issueProblems } from '../field-errors';
import { feasibilityIssues } from './compile';
import { groupLabel, listWorkIssue, patternShape, semanticIssues, type Pattern } from './pattern';

/** Structure first; then the sizes, jokers, rank ranges and whether real tiles could ever fill it. */
export const patternSchema = patternShape.superRefine((value, ctx) => {
  // Range errors in single fields are already reported; the whole-pattern rules need sound fields.
  if (!patternShape.safeParse(value).success) return;
  const pattern = value as Pattern;
  const basic = semanticIssues(pattern);
  const issues = basic.length > 0 ? basic : feasibilityIssues(pattern);
  for (const issue of issues) {
    ctx.addIssue({ code: 'custom', message: issue.message, path: issue.group === undefined ? ['groups'] : ['groups', issue.group] });
  }
});

/**
 * Check anything that claims to be a pattern. Returns readable errors (empty when valid), each
 * naming the pattern id and, where one group is at fault, which group ("group 2 of 5", counting from 1).
 */
export function validatePattern(candidate: unknown): string[] {
  const parsed = patternSchema.safeParse(candidate);
  if (parsed.success) return [];
  const raw = candidate as { id?: unknown; groups?: unknown } | null;
  const id = typeof raw?.id === 'string' && raw.id ? raw.id : '(no id)';
  const count = Array.isArray(raw?.groups) ? raw.groups.length : 0;
  const part = ([head, index]: readonly PropertyKey[]) =>
    head === 'groups' && typeof index === 'number' ? `, ${groupLabel(index, count)}` : head !== undefined && head !== 'groups' ? `, ${String(head)}` : '';
  return issueProblems(parsed.error.issues, part).map(({ where, message }) => `Pattern "${id}"${where}: ${message}`);
}

/** The patterns of a list whose structure is sound, for reckoning the list's work before checking each one. */
export function soundPatterns(list: readonly unknown[]): Pattern[] {
  return list.filter((p) => patternShape.safeParse(p).success) as Pattern[];
}

/**
 * Validate a whole list: what its patterns together ask for first (a list over its budget is
 * refused before any pattern is tried), then every pattern, and ids unique.
 */
export function validatePatternList(list: unknown[]): string[] {
  const tooMuch = listWorkIssue(soundPatterns(list));
  if (tooMuch) return [tooMuch];
  const errors = list.flatMap((p) => validatePattern(p));
  const seen = new Set<string>();
  for (const p of list as { id?: unknown }[]) {
    if (typeof p?.id !== 'string') continue;
    if (seen.has(p.id)) errors.push(`Pattern "${p.id}": another pattern in this list has the same id.`);
    seen.add(p.id);
  }
  return errors;
}
