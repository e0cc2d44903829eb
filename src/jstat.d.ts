// jstat 1.9.6 ships no type definitions. Only the functions tandem uses are declared here, and
// only src/stats/distributions.ts may import jstat (see DEVELOPERS.md).
declare module 'jstat' {
  interface JStat {
    studentt: { inv(p: number, df: number): number; cdf(x: number, df: number): number };
    normal: { inv(p: number, mean: number, sd: number): number };
    centralF: { cdf(x: number, df1: number, df2: number): number };
  }
  const jStat: JStat;
  export = jStat;
}
