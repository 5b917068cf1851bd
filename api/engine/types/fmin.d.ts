// Local declaration for fmin's Nelder-Mead (the package ships no types).
declare module 'fmin' {
  const fmin: {
    nelderMead(
      f: (x: number[]) => number,
      x0: number[],
      parameters?: { maxIterations?: number; minErrorDelta?: number; minTolerance?: number; history?: unknown },
    ): { x: number[]; fx: number };
  };
  export default fmin;
}
