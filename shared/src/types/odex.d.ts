/**
 * Types for the parts of odex@2.0.4 (Hairer's ODEX, Gragg–Bulirsch–Stoer extrapolation) that the
 * tests use as an independent reference integrator. The package ships raw TypeScript that fails
 * strict checking, so shared/tsconfig.json maps `odex` here with `paths`; at run time vitest loads
 * the real package. Never imported by shipped code.
 */
export type Derivative = (x: number, y: number[]) => number[];

export type OutputFunction = (
  step: number,
  xOld: number,
  x: number,
  y: number[],
  dense?: (component: number, x: number) => number,
) => boolean | void;

export interface Solution {
  y: number[];
  /** 0 converged, 1 too many steps, 2 stopped by the output function. */
  outcome: number;
  nStep: number;
  xEnd: number;
  nAccept: number;
  nReject: number;
  nEval: number;
}

export class Solver {
  constructor(n: number);
  n: number;
  maxSteps: number;
  initialStepSize: number;
  maxStepSize: number;
  denseOutput: boolean;
  denseComponents: number[] | undefined;
  relativeTolerance: number | number[];
  absoluteTolerance: number | number[];
  solve(f: Derivative, x: number, y0: number[], xEnd: number, solOut?: OutputFunction): Solution;
}
