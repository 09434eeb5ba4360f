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
 */
import { parse } from 'csv-parse/sync';
import { stringify } from 'csv-stringify/sync';
import { buildsWithoutCalls, patternValue, withCurrentFields, type Group, type Pattern } from '../../shared/analysis/pattern';
import { issueProblems } from '../../shared/field-errors';
import { PATTERN_LIST_LIMITS, patternListInputSchema, patternProblems, type PatternProblem } from '../../shared/pattern-lists';
import { fieldPath, FileRejected, jsonValueLines, parseJsonFile, type FileProblem } from './json-text';

export const PATTERN_LIST_FORMAT = 'rackside-pattern-list';
export const PATTERN_LIST_VERSION = 2;
/** Versions this Rackside reads: 1 (fields `points` and `concealed`) and 2. */
export const READABLE_VERSIONS = [1, 2] as const;
type Version = (typeof READABLE_VERSIONS)[number];
export const CSV_COLUMNS = ['id', 'name', 'family', 'value', 'sealed', 'size', 'tile', 'suit', 'rank', 'dragon'] as const;
/** Version 1's header: the same columns, with `points` and `concealed` for `value` and `sealed`. */
export const CSV_COLUMNS_V1 = ['id', 'name', 'family', 'points', 'concealed', 'size', 'tile', 'suit', 'rank', 'dragon'] as const;
type Column = (typeof CSV_COLUMNS)[number];
/** A column's name in a file of the given version. */
const columnName = (column: Column, version: Version): string => (version === 1 ? CSV_COLUMNS_V1[CSV_COLUMNS.indexOf(column)] : column);

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

// ───────────── writing ─────────────

export function patternListJson(list: PatternListFile): string {
  return `${JSON.stringify({ format: PATTERN_LIST_FORMAT, version: PATTERN_LIST_VERSION, name: list.name, description: list.description, patterns: list.patterns }, null, 2)}\n`;
}

function rankCell(group: Group): string {
  if (!('rank' in group)) return '';
  if (typeof group.rank === 'number') return String(group.rank);
  const { var: v, offset } = group.rank;
  return offset === 0 ? v : `${v}${offset > 0 ? '+' : ''}${offset}`;
}

/**
 * A spreadsheet may run a cell that starts with = + - @, a tab or a carriage return as a
 * formula; a leading apostrophe keeps it text. A cell that already starts with apostrophes
 * before one of those gets one more, so reading it back removes exactly the one added.
 */
const RISKY = /^'*[=+\-@\t\r]/;
const guard = (cell: string) => (RISKY.test(cell) ? `'${cell}` : cell);
const unguard = (cell: string) => (cell.startsWith("'") && RISKY.test(cell) ? cell.slice(1) : cell);

export function patternListCsv(list: PatternListFile): string {
  const rows: string[][] = [[PATTERN_LIST_FORMAT, String(PATTERN_LIST_VERSION)], ['name', list.name]];
  if (list.description) rows.push(['description', list.description]);
  rows.push([...CSV_COLUMNS]);
  for (const p of list.patterns) {
    p.groups.forEach((group, index) => {
      const first = index === 0;
      rows.push([
        p.id,
        first ? p.name : '',
        first ? p.family : '',
        first ? String(patternValue(p)) : '',
        first ? (buildsWithoutCalls(p) ? 'yes' : 'no') : '',
        String(group.size),
        'tile' in group ? group.tile : '',
        'suit' in group ? group.suit : '',
        rankCell(group),
        'dragon' in group ? group.dragon : '',
      ]);
    });
  }
  return stringify(rows.map((row) => row.map(guard)));
}

// ───────────── reading ─────────────

/** How a reader names the place of a problem: a list field (name, patterns), or one pattern's. */
interface Places {
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
function checkList(candidate: { name: unknown; description: unknown; patterns: unknown }, places: Places, earlier: FileProblem[] = [], skip = new Set<number>()): PatternListFile {
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

function checkFormat(format: unknown, version: unknown, where: { format: string; version: string }): Version {
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

/** In a version 2 file, a pattern still using version 1's names is told which names to use. */
function oldNamesIn(patterns: unknown, place: (index: number, key: string) => string): { problems: FileProblem[]; indexes: Set<number> } {
  const problems: FileProblem[] = [];
  const indexes = new Set<number>();
  if (!Array.isArray(patterns)) return { problems, indexes };
  patterns.forEach((p: unknown, index) => {
    if (typeof p !== 'object' || p === null) return;
    for (const [old, now] of [['points', 'value'], ['concealed', 'sealed']] as const) {
      if (old in p) {
        indexes.add(index);
        problems.push({ where: place(index, old), message: `Version 2 names this field "${now}"; "${old}" is version 1's name. Rename it, or mark the file as version 1.` });
      }
    }
  });
  return { problems, indexes };
}

export function readPatternListJson(text: string): PatternListFile {
  const data = parseJsonFile(text);
  if (typeof data !== 'object' || data === null || Array.isArray(data)) {
    throw new FileRejected([{ where: '(the whole file)', message: 'A pattern-list file holds one object with "format", "version", "name" and "patterns".' }]);
  }
  const head = data as Record<string, unknown>;
  const version = checkFormat(head.format, head.version, { format: 'format', version: 'version' });
  const known = new Set(['format', 'version', 'name', 'description', 'patterns']);
  const extra = Object.keys(data).filter((k) => !known.has(k));
  if (extra.length) throw new FileRejected([{ where: extra[0], message: `"${extra[0]}" is not part of a pattern-list file. Remove it.` }]);
  const d = data as Record<string, unknown>;
  const lines = jsonValueLines(text);
  /** "line 14, pattern 2 (anchor-2), groups[3]": the line of the most exact place the file has. */
  const place = (index: number, key: string) => {
    const path = ['patterns', String(index), ...(key ? key.split('.') : [])];
    let line: number | undefined;
    for (let n = path.length; n >= 2 && line === undefined; n--) line = lines.get(path.slice(0, n).join('.'));
    const raw = Array.isArray(d.patterns) ? (d.patterns[index] as { id?: unknown } | null) : null;
    const id = typeof raw?.id === 'string' && raw.id ? ` (${raw.id})` : '';
    return `${line ? `line ${line}, ` : ''}pattern ${index + 1}${id}${key ? `, ${fieldPath(key.split('.'))}` : ''}`;
  };
  const old = version === 2 ? oldNamesIn(d.patterns, place) : { problems: [], indexes: new Set<number>() };
  const patterns = version === 1 && Array.isArray(d.patterns) ? d.patterns.map(withCurrentFields) : d.patterns;
  return checkList(
    { name: d.name, description: d.description, patterns },
    { field: (key) => fieldPath(key.split('.')), pattern: (p) => place(p.index, p.key.split('.').slice(2).join('.')) },
    old.problems,
    old.indexes,
  );
}

/** A rank cell: a number, or a variable letter with an optional offset; a string is the problem. */
function parseRank(cell: string): number | { var: string; offset: number } | string {
  if (/^\d+$/.test(cell)) return Number(cell);
  const m = /^([a-z])\s*(?:([+-])\s*(\d+))?$/.exec(cell);
  if (!m) return `The rank "${cell}" is not a number 1–9 or a variable with an offset (n, n+1, n-2).`;
  return { var: m[1], offset: m[2] ? Number(`${m[2]}${m[3]}`) : 0 };
}

const shown = (value: unknown) => (value === true ? 'yes' : value === false ? 'no' : String(value));

interface Row {
  line: number;
  cells: string[];
}

export function readPatternListCsv(text: string): PatternListFile {
  let rows: Row[];
  try {
    const records = parse(text, { bom: true, relax_column_count: true, skip_empty_lines: true, trim: true, info: true }) as unknown as { record: string[]; info: { lines: number } }[];
    rows = records.map((r) => ({ line: r.info.lines, cells: r.record.map(unguard) }));
  } catch (err) {
    const e = err as { lines?: number; message: string };
    throw new FileRejected([{ where: `line ${e.lines ?? 1}`, message: `This line can't be read as CSV (${e.message.replace(/^Invalid [^:]*:\s*/, '')}). Check its quotes and commas.` }]);
  }
  if (rows.length === 0) throw new FileRejected([{ where: 'line 1', message: 'The file is empty.' }]);
  const [first, ...rest] = rows;
  const version = /^\d+$/.test(first.cells[1] ?? '') ? Number(first.cells[1]) : first.cells[1];
  const fileVersion = checkFormat(first.cells[0], version, { format: `line ${first.line}`, version: `line ${first.line}` });
  const columns = fileVersion === 1 ? CSV_COLUMNS_V1 : CSV_COLUMNS;

  const meta: Record<string, string> = {};
  let at = 0;
  while (at < rest.length && rest[at].cells[0] !== 'id') {
    const { line, cells } = rest[at];
    if (cells[0] !== 'name' && cells[0] !== 'description') {
      throw new FileRejected([{ where: `line ${line}`, message: `Expected "name,…", "description,…" or the header row starting with "id"; found "${cells[0]}".` }]);
    }
    meta[cells[0]] = cells.slice(1).join(',');
    at++;
  }
  if (at >= rest.length) throw new FileRejected([{ where: `line ${rows[rows.length - 1].line}`, message: `The header row is missing: ${columns.join(',')}.` }]);
  const head = rest[at];
  const fileIndex = new Map<string, number>(head.cells.map((name, i) => [name, i]));
  const missing = (columns as readonly string[]).filter((c) => !fileIndex.has(c));
  const unknown = head.cells.filter((c) => !(columns as readonly string[]).includes(c));
  if (missing.length || unknown.length) {
    const message = missing.length ? `The header row lacks ${missing.map((c) => `"${c}"`).join(', ')}.` : `The header row has unknown columns: ${unknown.map((c) => `"${c}"`).join(', ')}.`;
    throw new FileRejected([{ where: `line ${head.line}`, message }]);
  }
  // Columns by today's names, wherever the file put them and whatever its version called them.
  const index = new Map<Column, number>(CSV_COLUMNS.map((c) => [c, fileIndex.get(columnName(c, fileVersion))!]));
  const groupRows = rest.slice(at + 1);
  if (groupRows.length > PATTERN_LIST_LIMITS.patternsMax * 14) {
    throw new FileRejected([{ where: `line ${groupRows[0].line}`, message: 'The file has too many rows for one list.' }]);
  }

  const problems: FileProblem[] = [];
  const cell = (row: Row, column: Column) => row.cells[index.get(column)!] ?? '';
  const patterns: (Omit<Pattern, 'value' | 'sealed'> & { value: unknown; sealed: unknown })[] = [];
  // Where each pattern and group came from, to name the line of each problem.
  const lines: { pattern: number; groups: number[] }[] = [];
  // Patterns with a cell that could not be read: their problems are named here, not checked again.
  const unreadable = new Set<number>();
  let current: (typeof patterns)[number] | null = null;
  const done = new Set<string>();
  for (const row of groupRows) {
    const id = cell(row, 'id');
    const at = (column: Column) => `line ${row.line}, ${id ? `pattern ${id}, ` : ''}column ${columnName(column, fileVersion)}`;
    if (!id) {
      problems.push({ where: at('id'), message: 'Every row names the id of the pattern its group belongs to.' });
      continue;
    }
    if (!current || current.id !== id) {
      if (done.has(id)) {
        problems.push({ where: at('id'), message: `This pattern already ended above; keep the rows of one pattern together.` });
        continue;
      }
      done.add(id);
      const value = cell(row, 'value');
      const sealed = cell(row, 'sealed').toLowerCase();
      current = {
        id,
        name: cell(row, 'name'),
        family: cell(row, 'family'),
        value: /^\d+$/.test(value) ? Number(value) : value,
        sealed: ['yes', 'true'].includes(sealed) ? true : ['no', 'false'].includes(sealed) ? false : sealed,
        groups: [],
      };
      patterns.push(current);
      lines.push({ pattern: row.line, groups: [] });
    }
    const before = problems.length;
    if (current.groups.length === 0) {
      if (typeof current.value === 'string') problems.push({ where: at('value'), message: `${columnName('value', fileVersion)} must be a whole number, such as 40.` });
      if (typeof current.sealed === 'string') problems.push({ where: at('sealed'), message: `${columnName('sealed', fileVersion)} must be yes or no.` });
    } else {
      for (const column of ['name', 'family', 'value', 'sealed'] as const) {
        const value = cell(row, column);
        if (value && value.toLowerCase() !== shown(current[column]).toLowerCase()) {
          problems.push({ where: at(column), message: `The pattern's ${columnName(column, fileVersion)} is given on its first row; leave this cell empty.` });
        }
      }
    }
    const label = `Group ${current.groups.length + 1}`;
    const sizeText = cell(row, 'size');
    const size = /^\d+$/.test(sizeText) ? Number(sizeText) : NaN;
    if (Number.isNaN(size)) problems.push({ where: at('size'), message: `${label}: size is a number of tiles, 1 to 6.` });
    const tile = cell(row, 'tile');
    const suit = cell(row, 'suit');
    const rankText = cell(row, 'rank');
    const dragon = cell(row, 'dragon');
    let group: Record<string, unknown>;
    if (tile) {
      if (suit || rankText || dragon) problems.push({ where: at('tile'), message: `${label}: a group with a tile leaves suit, rank and dragon empty.` });
      group = { size, tile };
    } else if (dragon) {
      if (dragon !== 'match') problems.push({ where: at('dragon'), message: `${label}: dragon is "match" (the dragon of the group's suit) or empty.` });
      if (rankText) problems.push({ where: at('rank'), message: `${label}: a matching dragon has a suit but no rank.` });
      group = { size, dragon: 'match', suit };
    } else {
      const rank = parseRank(rankText);
      if (!suit) problems.push({ where: at('suit'), message: `${label}: give a tile, or a suit with a rank, or dragon "match" with a suit.` });
      if (typeof rank === 'string') problems.push({ where: at('rank'), message: `${label}: ${rankText ? rank : 'a suit group needs a rank.'}` });
      group = { size, suit, rank: typeof rank === 'string' ? rankText : rank };
    }
    if (problems.length > before) unreadable.add(patterns.length - 1);
    current.groups.push(group as Group);
    lines[lines.length - 1].groups.push(row.line);
    if (problems.length > MAX_PROBLEMS) break;
  }

  const COLUMN_SET: readonly string[] = CSV_COLUMNS;
  const places: Places = {
    field: (key) => (key === 'name' ? `line ${first.line + 1}` : `line ${head.line + 1}`),
    /** "line 9, pattern anchor-2, column size": a group's problem at its own row, the pattern's at its first. */
    pattern: (p) => {
      const parts = p.key.split('.');
      const at = lines[p.index];
      const id = patterns[p.index].id;
      if (parts[2] === 'groups' && parts[3] !== undefined) {
        const column = parts[4] && ['tile', 'suit', 'rank', 'dragon', 'size'].includes(parts[4]) ? `, column ${parts[4]}` : '';
        return `line ${at.groups[Number(parts[3])] ?? at.pattern}, pattern ${id}${column}`;
      }
      const column = parts[2] && COLUMN_SET.includes(parts[2]) ? `, column ${columnName(parts[2] as Column, fileVersion)}` : '';
      return `line ${at.pattern}, pattern ${id}${column}`;
    },
  };
  return checkList({ name: meta.name, description: meta.description ?? '', patterns }, places, problems, unreadable);
}

/** Which reader a file name asks for. */
export function readPatternListFile(text: string, kind: 'json' | 'csv'): PatternListFile {
  return kind === 'csv' ? readPatternListCsv(text) : readPatternListJson(text);
}
