// The part of jstat 1.9.6 (no bundled types) that the engine uses.
// jstat's UMD build has no static named exports Node's ESM loader can see, so the engine imports the default
// (module.exports, which carries `jStat` as a property).
declare module 'jstat' {
  const jstat: { jStat: typeof jStat };
  export default jstat;
  export const jStat: {
    centralF: { cdf(x: number, df1: number, df2: number): number; inv(p: number, df1: number, df2: number): number };
    chisquare: { cdf(x: number, dof: number): number };
    ibeta(x: number, a: number, b: number): number;
  };
}
