// Stays only while server/app.ts imports the router from here; progress lives in server/teaching/progress/.
export { progressRouter } from '../teaching/progress';
