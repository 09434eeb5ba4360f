/**
 * Reading uploaded JSON so a person can fix it: a syntax error names its line and column
 * (JSON.parse does not always say where), and field paths are written as a reader sees them.
 */

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

/** Where the first syntax error in `text` sits, or null if it is valid JSON. A small scanner: it only finds the place. */
export function locateJsonError(text: string): { line: number; column: number; message: string } | null {
  let i = 0;
  const fail = (message: string): never => {
    throw Object.assign(new Error(message), { position: i });
  };
  const ws = () => {
    while (i < text.length && ' \t\n\r'.includes(text[i])) i++;
  };
  const literal = (word: string) => {
    if (text.startsWith(word, i)) i += word.length;
    else fail('This is not a value: use a string in double quotes, a number, true, false, null, a list [ ] or an object { }.');
  };
  const string = () => {
    i++;
    while (i < text.length && text[i] !== '"') {
      if (text[i] === '\\') i++;
      else if (text[i] === '\n') fail('A string is not closed before the end of the line: add the closing double quote.');
      i++;
    }
    if (i >= text.length) fail('A string is not closed: add the closing double quote.');
    i++;
  };
  const number = () => {
    const match = /^-?(0|[1-9]\d*)(\.\d+)?([eE][+-]?\d+)?/.exec(text.slice(i));
    if (!match) fail('This is not a number.');
    i += match![0].length;
  };
  const value = (): void => {
    ws();
    const c = text[i];
    if (c === undefined) fail('The file ends where a value was expected.');
    if (c === '{') return object();
    if (c === '[') return list();
    if (c === '"') return string();
    if (c === 't') return literal('true');
    if (c === 'f') return literal('false');
    if (c === 'n') return literal('null');
    if (c === '-' || (c >= '0' && c <= '9')) return number();
    if (c === "'") fail('Strings take double quotes ("), not single quotes.');
    fail(`Unexpected "${c}" where a value was expected.`);
  };
  const object = () => {
    i++;
    ws();
    if (text[i] === '}') return void i++;
    for (;;) {
      ws();
      if (text[i] === '}') fail('A comma is followed by "}": remove the comma after the last entry.');
      if (text[i] === ',') fail('Two commas in a row: remove one.');
      if (text[i] !== '"') fail('An entry name needs double quotes, like "name".');
      string();
      ws();
      if (text[i] !== ':') fail('Put a colon (:) after the entry name.');
      i++;
      value();
      ws();
      if (text[i] === ',') {
        i++;
        continue;
      }
      if (text[i] === '}') return void i++;
      fail(text[i] === undefined ? 'The file ends inside an object: a closing "}" is missing.' : 'Put a comma between entries, or close the object with "}".');
    }
  };
  const list = () => {
    i++;
    ws();
    if (text[i] === ']') return void i++;
    for (;;) {
      ws();
      if (text[i] === ']') fail('A comma is followed by "]": remove the comma after the last item.');
      if (text[i] === ',') fail('Two commas in a row: remove one.');
      value();
      ws();
      if (text[i] === ',') {
        i++;
        continue;
      }
      if (text[i] === ']') return void i++;
      fail(text[i] === undefined ? 'The file ends inside a list: a closing "]" is missing.' : 'Put a comma between items, or close the list with "]".');
    }
  };
  try {
    value();
    ws();
    if (i < text.length) fail('There is more after the end of the data. A file holds one object.');
    return null;
  } catch (err) {
    const e = err as Error & { position: number };
    return { ...lineAndColumn(text, Math.min(e.position, text.length)), message: e.message };
  }
}

/** Parses JSON or rejects with the line and column at fault. */
export function parseJsonFile(text: string): unknown {
  if (text.trim() === '') throw new FileRejected([{ where: 'line 1', message: 'The file is empty.' }]);
  try {
    return JSON.parse(text);
  } catch {
    const at = locateJsonError(text) ?? { line: 1, column: 1, message: 'This is not valid JSON.' };
    throw new FileRejected([{ where: `line ${at.line}, column ${at.column}`, message: at.message }]);
  }
}
