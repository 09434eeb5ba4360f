// Stays only while server/app.ts imports the router from here; pattern lists live in server/teaching/pattern-lists/.
export { patternListsRouter } from '../teaching/pattern-lists';
