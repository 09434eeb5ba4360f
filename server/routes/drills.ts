// Stays only while server/app.ts imports the router from here; the drills live in server/teaching/drills/.
export { drillsRouter } from '../teaching/drills';
