/** Pattern lists a teacher owns: the wire schema, its checks and the DTOs. The starter list is served, never stored. */
import { z } from 'zod';
import { patternSchema, soundPatterns } from './analysis/schema';
import { groupLabel, listWorkIssue, type Pattern } from './analysis/pattern';
import { issueMessage } from './issue-words';

/** The id under which the read-only starter list is served. */
export const STARTER_LIST_ID = 'starter';
export const STARTER_LIST_NAME = 'Starter list';
/** Said of the starter list where it is shown, from `readOnly`: never part of a description a copy carries. */
export const READ_ONLY_NOTE = 'It can’t be changed; copy it to make a list of your own.';

export const PATTERN_LIST_LIMITS = { nameMax: 80, descriptionMax: 1000, patternsMax: 200 } as const;

export const patternListInputSchema = z
  .object({
    name: z
      .string({ error: 'Give the list a name.' })
      .trim()
      .min(1, 'Give the list a name.')
      .max(PATTERN_LIST_LIMITS.nameMax, `A list name has at most ${PATTERN_LIST_LIMITS.nameMax} characters.`),
    description: z
      .string()
      .trim()
      .max(PATTERN_LIST_LIMITS.descriptionMax, `A description has at most ${PATTERN_LIST_LIMITS.descriptionMax} characters.`)
      .default(''),
    // Each pattern is checked on its own below, so every error can name its pattern and group.
    patterns: z
      .array(z.unknown(), { error: 'A list holds its patterns as a list.' })
      .min(1, 'A list needs at least one pattern.')
      .max(PATTERN_LIST_LIMITS.patternsMax, `A list holds at most ${PATTERN_LIST_LIMITS.patternsMax} patterns.`),
  })
  .strict();
export type PatternListInput = z.input<typeof patternListInputSchema>;

/** One problem with one pattern of a list, or with the patterns together (index null). */
export interface PatternProblem {
  /** The field key, `patterns.3.groups.1.size` and the like, or `patterns`. */
  key: string;
  index: number | null;
  /** The pattern's id as written, when it is text. */
  id?: string;
  /** Where in the pattern: "group 2 of 4", "value", or nothing for the pattern as a whole. */
  part?: string;
  /** What is wrong and what to do, in Rackside's words. */
  text: string;
}

/**
 * Every problem with a list's patterns, the first per field, in list order; or one problem on
 * `patterns` when the patterns together ask too much work (PATTERN_WORK_LIMITS).
 */
export function patternProblems(patterns: readonly unknown[]): PatternProblem[] {
  // A list that asks too much in all is refused as a whole, before any pattern is tried.
  const tooMuch = listWorkIssue(soundPatterns(patterns));
  if (tooMuch) return [{ key: 'patterns', index: null, text: tooMuch }];
  const problems: PatternProblem[] = [];
  const keys = new Set<string>();
  const seen = new Map<string, number>();
  const add = (problem: PatternProblem) => {
    if (keys.has(problem.key)) return;
    keys.add(problem.key);
    problems.push(problem);
  };
  patterns.forEach((candidate, index) => {
    const raw = candidate as { id?: unknown; groups?: unknown } | null;
    const id = typeof raw?.id === 'string' && raw.id ? raw.id : undefined;
    const count = Array.isArray(raw?.groups) ? raw.groups.length : 0;
    const parsed = patternSchema.safeParse(candidate);
    if (!parsed.success) {
      for (const issue of parsed.error.issues) {
        const [head, group] = issue.path;
        const part = head === 'groups' && typeof group === 'number' ? groupLabel(group, count) : head !== undefined && head !== 'groups' ? String(head) : undefined;
        const whole = issue.path.length === 0 && issue.code === 'invalid_type';
        const text = whole ? 'A pattern is named fields written { … }: id, name, family, value, sealed and groups.' : issueMessage(issue);
        add({ key: ['patterns', index, ...issue.path].join('.'), index, id, part, text });
      }
    }
    if (id !== undefined) {
      if (seen.has(id)) add({ key: `patterns.${index}.id`, index, id, text: `pattern ${seen.get(id)! + 1} already has this id. Give each pattern its own id.` });
      else seen.set(id, index);
    }
  });
  return problems;
}

/**
 * Field errors for a list's patterns, keyed `patterns.3.groups.1.size` and the like, each
 * message naming the pattern id and the group ("Pattern "even-01", group 2 of 4: …"); or one
 * error on `patterns` when the patterns together ask too much work (PATTERN_WORK_LIMITS).
 */
export function patternFieldErrors(patterns: readonly unknown[]): Record<string, string> {
  const fields: Record<string, string> = {};
  for (const p of patternProblems(patterns)) {
    fields[p.key] = p.index === null ? p.text : `Pattern "${p.id ?? '(no id)'}"${p.part ? `, ${p.part}` : ''}: ${p.text}`;
  }
  return fields;
}

export interface PatternListSummaryDto {
  id: string;
  name: string;
  description: string;
  patternCount: number;
  readOnly: boolean;
  updatedAt: string | null;
}

export interface PatternListDto extends PatternListSummaryDto {
  patterns: Pattern[];
}
