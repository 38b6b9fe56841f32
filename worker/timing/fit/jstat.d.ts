// The part of jstat 1.9.6 (no bundled types) that the engine uses.
declare module 'jstat' {
  export const jStat: {
    centralF: { cdf(x: number, df1: number, df2: number): number; inv(p: number, df1: number, df2: number): number };
    chisquare: { cdf(x: number, dof: number): number };
    ibeta(x: number, a: number, b: number): number;
  };
}
