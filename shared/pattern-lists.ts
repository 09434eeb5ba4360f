/** Pattern lists a teacher owns: the wire schema, its checks and the DTOs. The starter list is served, never stored. */
import { z } from 'zod';
import { patternSchema, soundPatterns, validatePattern } from './analysis/schema';
import { listWorkIssue, type Pattern } from './analysis/pattern';

/** The id under which the read-only starter list is served. */
export const STARTER_LIST_ID = 'starter';
export const STARTER_LIST_NAME = 'Starter list';

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

/**
 * Field errors for a list's patterns, keyed `patterns.3.groups.1.size` and the like, each
 * message naming the pattern id and the group ("Pattern "even-01", group 2 of 4: …"); or one
 * error on `patterns` when the patterns together ask too much work (PATTERN_WORK_LIMITS).
 */
export function patternFieldErrors(patterns: readonly unknown[]): Record<string, string> {
  // A list that asks too much in all is refused as a whole, before any pattern is tried.
  const tooMuch = listWorkIssue(soundPatterns(patterns));
  if (tooMuch) return { patterns: tooMuch };
  const fields: Record<string, string> = {};
  const seen = new Map<string, number>();
  patterns.forEach((candidate, index) => {
    const parsed = patternSchema.safeParse(candidate);
    if (!parsed.success) {
      // validatePattern words the same issues, in the same order, with the pattern and group named.
      const words = validatePattern(candidate);
      parsed.error.issues.forEach((issue, k) => {
        const key = ['patterns', index, ...issue.path].join('.');
        fields[key] ??= words[k] ?? issue.message;
      });
    }
    const id = (candidate as { id?: unknown } | null)?.id;
    if (typeof id === 'string') {
      if (seen.has(id)) fields[`patterns.${index}.id`] ??= `Pattern "${id}": pattern ${seen.get(id)! + 1} already has this id. Give each pattern its own id.`;
      else seen.set(id, index);
    }
  });
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
