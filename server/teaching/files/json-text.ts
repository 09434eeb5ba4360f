/**
 * Reading uploaded JSON so a person can fix it: a syntax error names its line and column
 * (JSON.parse does not always say where), and field paths are written as a reader sees them.
 * JSON.parse reads the file; only when it refuses does the scanner below look for the place.
 */
import { controlCharacterAt } from '../../security/control-characters';

export interface FileProblem {
  /** "line 4, column 12", "line 7, column size", or a field path such as "patterns[2].groups[0].size". */
  where: string;
  message: string;
}

export class FileRejected extends Error {
  constructor(readonly problems: FileProblem[]) {
    super(problems.map((p) => `${p.where}: ${p.message}`).join('\n'));
  }
}

/** "patterns.2.groups.0.size" → "patterns[2].groups[0].size". */
export function fieldPath(path: readonly (string | number | symbol)[]): string {
  let out = '';
  for (const part of path) {
    if (typeof part === 'number' || /^\d+$/.test(String(part))) out += `[${String(part)}]`;
    else out += out ? `.${String(part)}` : String(part);
  }
  return out || '(the whole file)';
}

function lineAndColumn(text: string, position: number) {
  const before = text.slice(0, position);
  const line = before.split('\n').length;
  const column = position - before.lastIndexOf('\n');
  return { line, column };
}

/** A syntax error at a place in the text. */
class JsonSyntax extends Error {
  constructor(
    message: string,
    readonly position: number,
  ) {
    super(message);
  }
}

const NUMBER = /-?(0|[1-9]\d*)(\.\d+)?([eE][+-]?\d+)?/y;
const ESCAPES = '"\\/bfnrt';

/**
 * Where the first syntax error in `text` sits, or null if it is valid JSON. A small scanner that
 * only finds the place. It keeps open objects and lists on a stack of its own rather than the
 * call stack, so no depth of nesting makes it fail.
 */
function locateJsonError(text: string): { line: number; column: number; message: string } | null {
  let i = 0;
  const fail = (message: string): never => {
    throw new JsonSyntax(message, i);
  };
  const ws = () => {
    while (i < text.length && (text[i] === ' ' || text[i] === '\t' || text[i] === '\n' || text[i] === '\r')) i++;
  };
  const literal = (word: string) => {
    if (text.startsWith(word, i)) i += word.length;
    else fail('This is not a value: use a string in double quotes, a number, true, false, null, a list [ ] or an object { }.');
  };
  const string = () => {
    i++;
    while (i < text.length && text[i] !== '"') {
      const c = text[i];
      if (c === '\n') fail('A string is not closed before the end of the line: add the closing double quote.');
      if (c < ' ') fail('A string holds a control character such as a tab: write it as an escape, like \\t.');
      if (c === '\\') {
        const next = text[i + 1];
        if (next === 'u' && /^[0-9a-fA-F]{4}$/.test(text.slice(i + 2, i + 6))) i += 6;
        else if (next !== undefined && next !== 'u' && ESCAPES.includes(next)) i += 2;
        else fail('A backslash in a string starts an escape: \\" \\\\ \\/ \\b \\f \\n \\r \\t, or \\u and four hex digits.');
        continue;
      }
      i++;
    }
    if (i >= text.length) fail('A string is not closed: add the closing double quote.');
    i++;
  };
  const number = () => {
    NUMBER.lastIndex = i;
    const match = NUMBER.exec(text);
    if (!match) fail('This is not a number.');
    i += match![0].length;
  };
  /** Objects and lists still open, innermost last. */
  const open: ('{' | '[')[] = [];
  /** Reads a value, or only the opening of an object or list (then true: it is now on the stack). */
  const value = (): boolean => {
    ws();
    const c = text[i];
    if (c === undefined) fail('The file ends where a value was expected.');
    if (c === '{' || c === '[') {
      open.push(c);
      i++;
      return true;
    }
    if (c === '"') string();
    else if (c === 't') literal('true');
    else if (c === 'f') literal('false');
    else if (c === 'n') literal('null');
    else if (c === '-' || (c >= '0' && c <= '9')) number();
    else if (c === "'") fail('Strings take double quotes ("), not single quotes.');
    else fail(`Unexpected "${c}" where a value was expected.`);
    return false;
  };
  /** An object's entry name and colon. */
  const entryName = () => {
    ws();
    if (text[i] === '}') fail('A comma is followed by "}": remove the comma after the last entry.');
    if (text[i] === ',') fail('Two commas in a row: remove one.');
    if (text[i] !== '"') fail('An entry name needs double quotes, like "name".');
    string();
    ws();
    if (text[i] !== ':') fail('Put a colon (:) after the entry name.');
    i++;
  };
  try {
    let opened = value();
    while (opened || open.length > 0) {
      const inObject = open[open.length - 1] === '{';
      ws();
      if (opened) {
        // Just inside "{" or "[": it closes at once, or its first entry or item follows.
        if (text[i] === (inObject ? '}' : ']')) {
          i++;
          open.pop();
          opened = false;
          continue;
        }
        if (inObject) entryName();
        else if (text[i] === ',') fail('Two commas in a row: remove one.');
        opened = value();
        continue;
      }
      // After an entry or item: a comma and the next one, or the close.
      if (text[i] === ',') {
        i++;
        if (inObject) entryName();
        else {
          ws();
          if (text[i] === ']') fail('A comma is followed by "]": remove the comma after the last item.');
          if (text[i] === ',') fail('Two commas in a row: remove one.');
        }
        opened = value();
        continue;
      }
      if (text[i] === (inObject ? '}' : ']')) {
        i++;
        open.pop();
        continue;
      }
      if (inObject) fail(text[i] === undefined ? 'The file ends inside an object: a closing "}" is missing.' : 'Put a comma between entries, or close the object with "}".');
      fail(text[i] === undefined ? 'The file ends inside a list: a closing "]" is missing.' : 'Put a comma between items, or close the list with "]".');
    }
    ws();
    if (i < text.length) fail('There is more after the end of the data. A file holds one object.');
    return null;
  } catch (err) {
    if (!(err instanceof JsonSyntax)) throw err;
    return { ...lineAndColumn(text, Math.min(err.position, text.length)), message: err.message };
  }
}

/** Parses JSON or rejects with the line and column at fault. */
export function parseJsonFile(text: string): unknown {
  if (text.trim() === '') throw new FileRejected([{ where: 'line 1', message: 'The file is empty.' }]);
  let value: unknown;
  try {
    value = JSON.parse(text);
  } catch {
    const at = locateJsonError(text) ?? { line: 1, column: 1, message: 'This is not valid JSON.' };
    throw new FileRejected([{ where: `line ${at.line}, column ${at.column}`, message: at.message }]);
  }
  // An escape such as \u0000 decodes to a control character no Rackside text may hold.
  const at = controlCharacterAt(value);
  if (at) throw new FileRejected([{ where: at, message: 'This text holds a control character (such as NUL), which no Rackside text may hold. Remove it and import again.' }]);
  return value;
}

/**
 * The line on which each value of valid JSON starts, by dotted path ("patterns.2.groups.0"),
 * down to `maxDepth` names deep: to point a reader at the pattern or field at fault. A scan
 * with a stack of its own, so no depth of nesting makes it fail.
 */
export function jsonValueLines(text: string, maxDepth = 6): Map<string, number> {
  const lines = new Map<string, number>();
  const open: { list: boolean; path: string; depth: number; index: number; key: string }[] = [];
  let line = 1;
  let expectKey = false;
  let i = 0;
  const stringEnd = (from: number) => {
    let j = from + 1;
    while (j < text.length && text[j] !== '"') j += text[j] === '\\' ? 2 : 1;
    return j;
  };
  while (i < text.length) {
    const c = text[i];
    if (c === '\n') line++;
    if (c === '\n' || c === ' ' || c === '\t' || c === '\r' || c === ':') {
      i++;
      continue;
    }
    const top = open[open.length - 1];
    if (c === ',') {
      if (top?.list) top.index++;
      else expectKey = true;
      i++;
      continue;
    }
    if (c === '}' || c === ']') {
      open.pop();
      expectKey = false;
      i++;
      continue;
    }
    if (top && !top.list && expectKey) {
      const end = stringEnd(i);
      top.key = String(JSON.parse(text.slice(i, end + 1)));
      expectKey = false;
      i = end + 1;
      continue;
    }
    // A value starts here.
    const depth = top ? top.depth + 1 : 0;
    const name = top ? (top.list ? String(top.index) : top.key) : '';
    const path = top?.path ? `${top.path}.${name}` : name;
    if (depth <= maxDepth && !lines.has(path)) lines.set(path, line);
    if (c === '{' || c === '[') {
      open.push({ list: c === '[', path, depth, index: 0, key: '' });
      expectKey = c === '{';
      i++;
    } else if (c === '"') i = stringEnd(i) + 1;
    else {
      while (i < text.length && !/[\s,}\]]/.test(text[i])) i++;
    }
  }
  return lines;
}
