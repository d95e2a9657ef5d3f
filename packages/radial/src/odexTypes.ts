/** The part of the `odex` package API that penumbra uses. */
export type OdexDerivative = (x: number, y: number[]) => number[];
export type OdexOutput = (n: number, xOld: number, x: number, y: number[]) => boolean | void;
export interface OdexSolver {
  maxSteps: number;
  initialStepSize: number;
  maxStepSize: number;
  relativeTolerance: number | number[];
  absoluteTolerance: number | number[];
  solve(
    f: OdexDerivative,
    x: number,
    y0: number[],
    xEnd: number,
    solOut?: OdexOutput,
  ): { y: number[]; outcome: number; nStep: number; xEnd: number; nAccept: number; nReject: number; nEval: number };
}
export interface OdexModule {
  Solver: new (n: number) => OdexSolver;
}
