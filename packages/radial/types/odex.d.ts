// Types for the part of the CommonJS package odex 2.0.4 that @penumbra/radial uses.
// tsconfig.json maps 'odex' here through "paths": the package ships its TypeScript
// source next to the JavaScript, and that source does not compile under strict settings.
export type OdexDerivative = (x: number, y: number[]) => number[];
export type OdexOutput = (n: number, xOld: number, x: number, y: number[]) => boolean;
export interface OdexResult {
  y: number[];
  outcome: number;
  nStep: number;
  xEnd: number;
  nAccept: number;
  nReject: number;
  nEval: number;
}
export interface OdexSolver {
  maxSteps: number;
  initialStepSize: number;
  maxStepSize: number;
  relativeTolerance: number | number[];
  absoluteTolerance: number | number[];
  solve(f: OdexDerivative, x: number, y0: number[], xEnd: number, solOut?: OdexOutput): OdexResult;
}
export type OdexSolverClass = new (n: number) => OdexSolver;
// Either may be missing depending on how the CommonJS module was interoperated.
export declare const Solver: OdexSolverClass | undefined;
declare const odex: { Solver?: OdexSolverClass } | undefined;
export default odex;
