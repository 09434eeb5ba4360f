// Stays only while server/app.ts imports the router from here; comparisons live in server/teaching/comparisons/.
export { comparisonsRouter } from '../teaching/comparisons';
