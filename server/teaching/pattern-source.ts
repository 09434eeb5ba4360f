// Stays only while server/realtime/table-master.ts and server/routes/tables.ts import from here; use ./pattern-lists.
export { mayUseList, patternsForTable } from './pattern-lists';
