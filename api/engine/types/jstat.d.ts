// Local declaration for the few jStat distributions the engine uses (the package ships no types).
declare module 'jstat' {
  interface Dist { cdf(x: number, a: number, b: number): number; inv(p: number, a: number, b: number): number; pdf(x: number, a: number, b: number): number }
  const pkg: { jStat: { normal: Dist; beta: Dist; lognormal: Dist; betaln(a: number, b: number): number; chisquare: { inv(p: number, dof: number): number }; centralF: { inv(p: number, df1: number, df2: number): number } } };
  export default pkg;
}
