/**
 * Types for the parts of `odex` the tests use. The package ships its TypeScript source, which
 * does not pass our strict settings; tsconfig.json maps `odex` here instead.
 */
declare module 'odex' {
  export type Derivative = (x: number, y: number[]) => number[];
  export type OutputFunction = (n: number, xOld: number, x: number, y: number[], dense?: (c: number, x: number) => number) => boolean | void;
  export class Solver {
    constructor(n: number);
    absoluteTolerance: number | number[];
    relativeTolerance: number | number[];
    denseOutput: boolean;
    maxSteps: number;
    grid(dt: number, out: (xOut: number, yOut: number[]) => unknown): OutputFunction;
    solve(f: Derivative, x: number, y0: number[], xEnd: number, solOut?: OutputFunction): { y: number[]; outcome: number; nStep: number; xEnd: number };
  }
}
