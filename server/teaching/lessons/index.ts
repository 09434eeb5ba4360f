/** Lessons: scheduling, inviting, the lesson room's tables and its seats. What the rest of the server uses. */
export { lessonsRouter } from './routes';
