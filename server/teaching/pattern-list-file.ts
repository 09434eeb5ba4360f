// Stays only while tests/bench imports the reader from here; use ./pattern-lists/file-json.
export { readPatternListJson } from './pattern-lists/file-json';
