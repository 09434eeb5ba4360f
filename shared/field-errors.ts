/**
 * A failed zod parse as what a person reads: each issue at its place, in Rackside's words
 * (shared/issue-words.ts). The server's field errors, the drill and pattern-list file readers
 * and the pattern checks all turn issues into places and messages here.
 */
import type { z } from 'zod';
import { issueMessage } from './issue-words';

type Issue = z.core.$ZodIssue;

export interface IssueProblem {
  where: string;
  message: string;
}

/** The dotted path of an issue ("racks.east.0"), or "_" for the whole value. */
export const dottedPath = (path: readonly PropertyKey[]) => path.map(String).join('.') || '_';

/** Every issue in order, at the place `where` names for its path. */
export function issueProblems(issues: readonly Issue[], where: (path: readonly PropertyKey[]) => string = dottedPath): IssueProblem[] {
  return issues.map((issue) => ({ where: where(issue.path), message: issueMessage(issue) }));
}

/** Field errors keyed by dotted path ("_" for the whole value), the first issue per field. */
export function fieldErrors(error: { issues: readonly Issue[] }): Record<string, string> {
  const fields: Record<string, string> = {};
  for (const { where, message } of issueProblems(error.issues)) fields[where] ??= message;
  return fields;
}
