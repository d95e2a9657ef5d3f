/**
 * Three ODE integrators behind one small contract: advance a 4-component
 * real state from r to rEnd, stopping early (with the state intact) when its
 * size passes a threshold so the caller can rescale.
 *
 * - 'gbs': the default, an allocation-free Gragg–Bulirsch–Stoer extrapolation
 *   loop (gbsStepper.ts) with ODEX's step and order control; it takes the
 *   same steps as 'odex' and returns the same doubles, about twice as fast.
 * - 'odex': Hairer & Wanner's extrapolation code (npm `odex`), the same
 *   algorithm through the generic package, kept as a cross-check of 'gbs';
 *   at the 1e-10…1e-13 tolerances we need extrapolation takes 5–8× fewer
 *   right-hand-side evaluations than Cash–Karp (bench/).
 * - 'cash-karp': the Cash–Karp 4(5) pair (npm `ode45-cash-karp`), kept as an
 *   independent second integrator for cross-checks.
 *
 * Each throws a ConvergenceError with diagnostics where it stops short (its
 * step limit, or a failure inside the package), quoting the caller's method
 * and evaluation counter (stepperFailure.ts).
 */
import ode45 from 'ode45-cash-karp';
import * as odexModule from 'odex';
import type { OdexSolverClass } from 'odex';
import type { DiracKernel } from './dirac/equation.js';
import { gbsStepper } from './gbsStepper.js';
import type { EquationKernel, EvaluationCounter, Rhs } from './rhs.js';
import { type FailureContext, stepperFailure } from './stepperFailure.js';

// odex is CommonJS. Node's ESM loader exposes its exports both as named
// exports and as `default`; bundlers differ in which they fill, so take the
// one that carries the solver, and check it once.
const OdexSolver: OdexSolverClass = (() => {
  const solver = odexModule.Solver ?? odexModule.default?.Solver;
  if (typeof solver !== 'function') throw new Error('the odex package did not export Solver');
  return solver;
})();

/** Names of the ODE integrators `solveRadial` and `solveTwoSided` accept. */
export type IntegratorName = 'gbs' | 'odex' | 'cash-karp';

/** Every accepted integrator name; the first is the default. */
export const INTEGRATORS: readonly IntegratorName[] = ['gbs', 'odex', 'cash-karp'];

/** Outcome of one `Stepper.advance` call. */
export interface AdvanceResult {
  /** where the integration stopped (rEnd unless it stopped to rescale) */
  r: number;
  /** steps taken */
  steps: number;
  /** suggested next step */
  h: number;
  /**
   * sum over the accepted steps of the integrator's own local error estimate
   * relative to tol (each at most 1); absent where the integrator does not
   * report it ('odex', 'cash-karp'), and the caller then counts 1 per step
   */
  errorSum?: number;
}

/** One integrator bound to one right-hand side and tolerance. */
export interface Stepper {
  /** Advance y in place from r towards rEnd; stop early once |Re R| + |Im R| > overflow. */
  advance(y: Float64Array, r: number, rEnd: number, h: number, overflow: number): AdvanceResult;
}

/** What a stepper is built from. */
export interface StepperSpec {
  /** which integrator */
  integrator: IntegratorName;
  /** the right-hand side it integrates */
  rhs: Rhs;
  /** local relative tolerance */
  tol: number;
  /** r+ in the integrator's argument (the error weights of Cash–Karp scale R' by |R|/(r − r+)); 0 when the argument is x = r − r+ */
  rPlus: number;
  /** step limit of one advance call */
  maxSteps: number;
  /** the same right-hand side as packed coefficients: 'gbs' then evaluates it inline (faster, the same doubles) */
  kernel?: EquationKernel;
  /** the massive Dirac pair as constants: 'gbs' then evaluates it inline (faster, the same doubles) */
  dirac?: DiracKernel;
  /** the caller's method, quoted by a failure */
  method: string;
  /** the counter `rhs` (and `kernel`) increment, quoted by a failure */
  counter: EvaluationCounter;
  /** the integrator's argument is r − origin (default 0); a failure quotes the radius */
  origin?: number;
}

/** Error weights: one scale per complex pair, so a component crossing zero does not shrink the step. */
function pairScales(y: ArrayLike<number>, x: number): [number, number] {
  const magR = Math.hypot(y[0], y[1]);
  const magD = Math.hypot(y[2], y[3]) + magR / x;
  return [magR + 1e-300, magD + 1e-300];
}

/** A stepper for the named integrator. */
export function makeStepper({
  integrator,
  rhs,
  tol,
  rPlus,
  maxSteps,
  kernel,
  dirac,
  method,
  counter,
  origin = 0,
}: StepperSpec): Stepper {
  const failure: FailureContext = { method, counter, origin };
  if (integrator === 'gbs') return gbsStepper(rhs, tol, maxSteps, failure, kernel, dirac);
  return integrator === 'odex' ? odexStepper(rhs, tol, maxSteps, failure) : cashKarpStepper(rhs, tol, rPlus, maxSteps, failure);
}

function odexStepper(rhs: Rhs, tol: number, maxSteps: number, failure: FailureContext): Stepper {
  const solver = new OdexSolver(4);
  solver.maxSteps = maxSteps;
  // odex copies the returned array at once, so one buffer serves every call
  // (saves an allocation per evaluation; garbage collection was ~20 % of the time).
  const dy = [0, 0, 0, 0];
  const f = (r: number, y: number[]) => {
    rhs(dy, y, r);
    return dy;
  };
  return {
    advance(y, r, rEnd, h, overflow) {
      // Pure relative control: the solution's size changes by many orders of
      // magnitude within one call, so any fixed absolute floor would be wrong
      // somewhere (measured: a floor set at the call's start cost 100× accuracy).
      solver.relativeTolerance = tol;
      solver.absoluteTolerance = 0;
      solver.initialStepSize = h;
      let rLast = r;
      let hLast = h;
      let stopped = false;
      const res = solver.solve(f, r, Array.from(y), rEnd, (_n, xOld, x, yy) => {
        rLast = x;
        if (x > xOld) hLast = x - xOld;
        if (Math.abs(yy[0]) + Math.abs(yy[1]) > overflow) {
          stopped = true;
          return false;
        }
        return true;
      });
      if (res.outcome === 1) {
        throw stepperFailure(failure, 'odex', `exceeded its step limit of ${maxSteps} steps`, res.nStep, rLast, maxSteps);
      }
      if (res.outcome !== 0 && !stopped) {
        throw stepperFailure(failure, 'odex', `stopped with outcome ${res.outcome}`, res.nStep, rLast, maxSteps);
      }
      for (let i = 0; i < 4; i++) y[i] = res.y[i];
      return { r: stopped ? rLast : rEnd, steps: res.nStep, h: hLast };
    },
  };
}

function cashKarpStepper(rhs: Rhs, tol: number, rPlus: number, maxSteps: number, failure: FailureContext): Stepper {
  return {
    advance(y, r, rEnd, h, overflow) {
      let magR = 1,
        magD = 1;
      const integrator = ode45(y, rhs, r, h, {
        tol,
        verbose: false,
        maxIncreaseFactor: 4,
        errorScaleFunction: (i: number) => {
          if (i === 0) [magR, magD] = pairScales(integrator.y, integrator.t - rPlus);
          return i < 2 ? magR : magD;
        },
      });
      let steps = 0;
      const step = () => {
        try {
          return integrator.step(rEnd);
        } catch (e) {
          // the package's own stop (a NaN in the state)
          throw stepperFailure(failure, 'cash-karp', `failed (${(e as Error).message})`, steps, integrator.t, maxSteps);
        }
      };
      while (step()) {
        steps++;
        if (steps > maxSteps) {
          throw stepperFailure(
            failure,
            'cash-karp',
            `exceeded its step limit of ${maxSteps} steps`,
            steps,
            integrator.t,
            maxSteps,
          );
        }
        if (Math.abs(y[0]) + Math.abs(y[1]) > overflow) return { r: integrator.t, steps, h: integrator.dt };
      }
      steps++;
      return { r: rEnd, steps, h: integrator.dt };
    },
  };
}
