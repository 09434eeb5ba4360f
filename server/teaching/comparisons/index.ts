/** Same deal, compared across tables: what the rest of the server uses. */
export { comparisonsRouter } from './routes';
export { dealKey, dealsStillToPlay } from './service';
