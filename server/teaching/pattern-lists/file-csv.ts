/** Pattern-list files as CSV: writing one, and reading version 1 or 2, a row per group (the format: file.ts). */
import { parse } from 'csv-parse/sync';
import { stringify } from 'csv-stringify/sync';
import { buildsWithoutCalls, patternValue, type Group, type Pattern } from '../../../shared/analysis/pattern';
import { PATTERN_LIST_LIMITS } from '../../../shared/pattern-lists';
import { FileRejected, type FileProblem } from '../files/json-text';
import { checkFormat, checkList, MAX_PROBLEMS, PATTERN_LIST_FORMAT, PATTERN_LIST_VERSION, type PatternListFile, type Places, type Version } from './file';

const CSV_COLUMNS = ['id', 'name', 'family', 'value', 'sealed', 'size', 'tile', 'suit', 'rank', 'dragon'] as const;
/** Version 1's header: the same columns, with `points` and `concealed` for `value` and `sealed`. */
const CSV_COLUMNS_V1 = ['id', 'name', 'family', 'points', 'concealed', 'size', 'tile', 'suit', 'rank', 'dragon'] as const;
type Column = (typeof CSV_COLUMNS)[number];
/** A column's name in a file of the given version. */
const columnName = (column: Column, version: Version): string => (version === 1 ? CSV_COLUMNS_V1[CSV_COLUMNS.indexOf(column)] : column);

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
