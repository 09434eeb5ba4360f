/** Opening and accepting an e-mailed lesson invitation. What the rest of the server uses. */
export { invitationsRouter } from './routes';
