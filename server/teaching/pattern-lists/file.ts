/**
 * Rackside's own pattern-list files, JSON and CSV, version 2 (version 1 is still read).
 *
 * JSON: { "format": "rackside-pattern-list", "version": 2, "name", "description", "patterns": [Pattern…] }
 * with each pattern in the analysis format.
 *
 * CSV: a first line `rackside-pattern-list,2`; then `name,<list name>` and optionally
 * `description,<text>`; then the header row `id,name,family,value,sealed,size,tile,suit,rank,dragon`
 * (any order); then one row per group. A pattern's own cells (name, family, value, sealed)
 * sit on its first row and stay empty (or the same) on the rows after; a pattern's rows are
 * consecutive. A group is a `tile` (a kind such as flower), or a `suit` (A, B, C or bam, crack, dot)
 * with a `rank` (1–9, or a variable letter with an offset: n, n+1, n-2), or `dragon` = match with a suit.
 * `sealed` is yes or no.
 *
 * Version 1 named a pattern's value `points` and its sealed mark `concealed` (in JSON and as CSV
 * columns); a version 1 file is read with those names and becomes a list in today's names.
 *
 * This module holds what both share: the format's name and versions, and the checks of a list
 * read from either. Writing and reading each: file-json.ts and file-csv.ts.
 */
import type { Pattern } from '../../../shared/analysis/pattern';
import { issueProblems } from '../../../shared/field-errors';
import { PATTERN_LIST_LIMITS, patternListInputSchema, patternProblems, type PatternProblem } from '../../../shared/pattern-lists';
import { FileRejected, type FileProblem } from '../files/json-text';

export const PATTERN_LIST_FORMAT = 'rackside-pattern-list';
export const PATTERN_LIST_VERSION = 2;
/** Versions this Rackside reads: 1 (fields `points` and `concealed`) and 2. */
const READABLE_VERSIONS = [1, 2] as const;
export type Version = (typeof READABLE_VERSIONS)[number];
export interface PatternListFile {
  name: string;
  description: string;
  patterns: Pattern[];
}

/** Problems listed for one file: every pattern's, up to this many (then a line saying how many more). */
export const MAX_PROBLEMS = 300;

/** The problems of a file, all of them up to MAX_PROBLEMS. */
function rejected(problems: FileProblem[]): FileRejected {
  if (problems.length <= MAX_PROBLEMS) return new FileRejected(problems);
  const rest = problems.length - (MAX_PROBLEMS - 1);
  return new FileRejected([
    ...problems.slice(0, MAX_PROBLEMS - 1),
    { where: '(the rest of the file)', message: `${rest} more problems are not listed. Fix these and import the file again to see them.` },
  ]);
}

/**
 * Text left over from older Rackside: the starter list's description once said it could not be
 * changed, and copies and exports carried the sentence along. A list of one's own can be changed.
 */
const STARTER_NOTE = /\s*It can[’']t be changed; copy it to make a list of your own\.\s*/;
export const withoutStarterNote = (description: string) => description.replace(STARTER_NOTE, ' ').trim();

/** How a reader names the place of a problem: a list field (name, patterns), or one pattern's. */
export interface Places {
  field: (key: string) => string;
  pattern: (problem: PatternProblem & { index: number }) => string;
}

/** "group 2 of 5" → "Group 2 of 5: …"; a field's own problem is named by its place alone. */
const patternMessage = (p: PatternProblem) => (p.part?.startsWith('group') ? `G${p.part.slice(1)}: ${p.text}` : p.text);

/**
 * Checks a list read from any file: the list's fields and every pattern, all at once, so one
 * refusal names every problem. `earlier` are problems the reader found itself; the patterns in
 * `skip` had those and are not checked again (their cells were not readable).
 */
export function checkList(candidate: { name: unknown; description: unknown; patterns: unknown }, places: Places, earlier: FileProblem[] = [], skip = new Set<number>()): PatternListFile {
  const problems = [...earlier];
  const parsed = patternListInputSchema.safeParse({ name: candidate.name, description: candidate.description ?? '', patterns: candidate.patterns });
  if (!parsed.success) {
    problems.push(...issueProblems(parsed.error.issues, (path) => places.field(path.join('.'))));
  }
  const patterns = candidate.patterns;
  if (Array.isArray(patterns) && patterns.length <= PATTERN_LIST_LIMITS.patternsMax) {
    for (const p of patternProblems(patterns)) {
      if (p.index === null) problems.push({ where: places.field(p.key), message: p.text });
      else if (!skip.has(p.index)) problems.push({ where: places.pattern(p as PatternProblem & { index: number }), message: patternMessage(p) });
    }
  }
  if (problems.length || !parsed.success) throw rejected(problems);
  return { name: parsed.data.name, description: withoutStarterNote(parsed.data.description), patterns: parsed.data.patterns as Pattern[] };
}

export function checkFormat(format: unknown, version: unknown, where: { format: string; version: string }): Version {
  if (format !== PATTERN_LIST_FORMAT) {
    throw new FileRejected([{ where: where.format, message: `This is not a Rackside pattern-list file: "format" must be "${PATTERN_LIST_FORMAT}".` }]);
  }
  if (!(READABLE_VERSIONS as readonly unknown[]).includes(version)) {
    const newer = typeof version === 'number' && version > PATTERN_LIST_VERSION;
    const readable = READABLE_VERSIONS.join(' or ');
    throw new FileRejected([
      { where: where.version, message: newer ? `This file is version ${version}; this Rackside reads version ${readable}.` : `"version" must be ${readable}.` },
    ]);
  }
  return version as Version;
}
