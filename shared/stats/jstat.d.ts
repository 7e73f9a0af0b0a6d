/** The parts of jStat (npm package "jstat", no bundled types) that the engine uses. */
declare module 'jstat' {
  export const jStat: {
    gammaln(x: number): number;
    betaln(a: number, b: number): number;
    erfc(x: number): number;
    normal: { cdf(x: number, mean: number, sd: number): number; inv(p: number, mean: number, sd: number): number };
    studentt: { cdf(x: number, dof: number): number; inv(p: number, dof: number): number };
    centralF: { cdf(x: number, df1: number, df2: number): number; inv(p: number, df1: number, df2: number): number };
    chisquare: { cdf(x: number, dof: number): number; inv(p: number, dof: number): number };
  };
}
