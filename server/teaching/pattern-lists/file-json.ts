/** Pattern-list files as JSON: writing one, and reading version 1 or 2 (the format: file.ts). */
import { withCurrentFields } from '../../../shared/analysis/pattern';
import { fieldPath, FileRejected, jsonValueLines, parseJsonFile, type FileProblem } from '../files/json-text';
import { checkFormat, checkList, PATTERN_LIST_FORMAT, PATTERN_LIST_VERSION, type PatternListFile } from './file';

export function patternListJson(list: PatternListFile): string {
  return `${JSON.stringify({ format: PATTERN_LIST_FORMAT, version: PATTERN_LIST_VERSION, name: list.name, description: list.description, patterns: list.patterns }, null, 2)}\n`;
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
