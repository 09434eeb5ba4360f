/**
 * zod issues in Rackside's own words. A schema's own message is already Rackside's and is kept;
 * zod's built-in English ("Invalid input: expected number, received string") never reaches a
 * person: it is replaced by a sentence that names the field, says what is wrong and what to do.
 * The server's field errors, the file readers and the pattern checks all word issues here.
 */
import { z } from 'zod';

type Issue = z.core.$ZodIssue;

/** zod's own English wording for an issue, to tell it from a message a schema gave. */
const zodEnglish = z.locales.en().localeError;

/** Whether the issue still carries zod's built-in message rather than one a schema gave. */
export function isZodWording(issue: Issue): boolean {
  if (issue.code === 'invalid_type') return issue.message.startsWith(`Invalid input: expected ${issue.expected}`);
  const own = zodEnglish(issue as Parameters<typeof zodEnglish>[0]);
  const english = typeof own === 'string' ? own : own?.message;
  return issue.message === english || issue.message === 'Invalid input';
}

/** The field an issue is about, as its last name in the path ("This" for the whole value). */
function subjectOf(path: readonly PropertyKey[]): string {
  for (let i = path.length - 1; i >= 0; i--) {
    if (typeof path[i] === 'string' && !/^\d+$/.test(path[i] as string)) return path[i] as string;
  }
  return 'This';
}

/** "a", "a" or "b", "a", "b" or "c". */
function orList(items: string[]): string {
  return items.length <= 1 ? (items[0] ?? '') : `${items.slice(0, -1).join(', ')} or ${items[items.length - 1]}`;
}
function andList(items: string[]): string {
  return items.length <= 1 ? (items[0] ?? '') : `${items.slice(0, -1).join(', ')} and ${items[items.length - 1]}`;
}

const shown = (value: unknown) => (typeof value === 'string' ? `"${value}"` : String(value));
const count = (n: number | bigint, one: string, many = `${one}s`) => `${n} ${Number(n) === 1 ? one : many}`;

/** What a value of each type looks like, with an example. */
const KINDS: Record<string, string> = {
  number: 'a number, such as 40',
  int: 'a whole number, such as 40',
  string: 'text in double quotes, such as "Harbor Lane"',
  boolean: 'true or false',
  array: 'a list written [ … ]',
  object: 'named fields written { … }',
  date: 'a date, such as 2026-12-01',
};

/** An issue's message in Rackside's words: the schema's own if it gave one, otherwise worded here. */
export function issueMessage(issue: Issue): string {
  if (!isZodWording(issue)) return issue.message;
  const subject = subjectOf(issue.path);
  switch (issue.code) {
    case 'invalid_type': {
      const kind = KINDS[issue.expected] ?? `a value of another kind (${issue.expected})`;
      // zod says what it received only in its own wording; "undefined" means the field is absent.
      return / received undefined$/.test(issue.message) ? `${subject} is missing: add it as ${kind}.` : `${subject} must be ${kind}.`;
    }
    case 'too_small': {
      const n = issue.minimum;
      if (issue.origin === 'string') return Number(n) <= 1 ? `${subject} is empty: write something in it.` : `${subject} is too short: write at least ${count(n, 'character')}.`;
      if (issue.origin === 'array' || issue.origin === 'set') return Number(n) <= 1 ? `${subject} is empty: add at least one item.` : `${subject} has too few items: give at least ${count(n, 'item')}.`;
      return issue.inclusive === false ? `${subject} is too small: use a number above ${n}.` : `${subject} is too small: use ${n} or more.`;
    }
    case 'too_big': {
      const n = issue.maximum;
      if (issue.origin === 'string') return `${subject} is too long: shorten it to ${count(n, 'character')} or fewer.`;
      if (issue.origin === 'array' || issue.origin === 'set') return `${subject} has too many items: keep it to ${n} or fewer.`;
      return issue.inclusive === false ? `${subject} is too large: use a number below ${n}.` : `${subject} is too large: use ${n} or less.`;
    }
    case 'invalid_value': {
      const values = issue.values.map(shown);
      if (values.length === 1) return `${subject} must be ${values[0]}.`;
      if (values.length <= 12) return `${subject} must be one of ${orList(values)}: check its spelling.`;
      return `${subject} is not one of the values Rackside knows here: check its spelling.`;
    }
    case 'unrecognized_keys': {
      const keys = andList(issue.keys.map(shown));
      return issue.keys.length === 1
        ? `${keys} is not a field Rackside knows here: remove it, or check its spelling.`
        : `${keys} are not fields Rackside knows here: remove them, or check their spelling.`;
    }
    case 'invalid_format':
      if (issue.format === 'email') return `${subject} must be an email address, such as sam@example.com.`;
      return `${subject} is not in the right form: check which characters it uses.`;
    case 'not_multiple_of':
      return `${subject} must be a multiple of ${issue.divisor}.`;
    case 'invalid_union':
      return `${subject} does not match any form Rackside reads here: check its fields and their spelling.`;
    case 'invalid_key':
    case 'invalid_element':
      return `${subject} holds an entry Rackside can’t read: check its names and values.`;
    default:
      return `${subject} is not valid here: check it and try again.`;
  }
}
