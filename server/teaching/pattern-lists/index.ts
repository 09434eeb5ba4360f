/** Pattern lists, the starter list and teachers' own: what the rest of the server uses. */
export { patternListsRouter } from './routes';
export { mayUseList, patternsForTable } from './service';
