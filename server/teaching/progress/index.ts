/** A player's progress over their finished exchanges: what the rest of the server uses. */
export { progressRouter } from './routes';
