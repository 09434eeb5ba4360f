/** Drills, a teacher's saved deals: what the rest of the server uses. */
export { drillsRouter } from './routes';
export { drillNotFound, drillTableOptions, findOwnDrill, listNotYours } from './service';
