/** The few jstat functions Rackside's tests use; jstat ships no type declarations. */
declare module 'jstat' {
  interface JStat {
    hypgeom: { pdf(k: number, populationSize: number, successes: number, drawn: number): number };
    normal: { inv(p: number, mean: number, sd: number): number };
    chisquare: { inv(p: number, dof: number): number };
  }
  const jStat: JStat;
  export default jStat;
}
