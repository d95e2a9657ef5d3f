/**
 * `radialFunction` of a massive Dirac mode (docs/massive-dirac.md): the
 * radial pair P₊ = Δ^{1/2}R₊, P₋ = R₋ of Chandrasekhar's equations on the
 * requested radii, normalised as the greybody solve normalises it (at the
 * horizon P₊ → e^{−ikr*} up to a constant phase and P₋ → 0, so the conserved
 * current |P₊|² − |P₋|² is 1), with ln|A| and ln|B| of the same solution
 * (Γ = (ω + k∞)/(2k∞|A|²)) and the λ of the mode's kappaSign.
 */
import { InputError, validateOptions } from '@penumbra/core';
import { INTEGRATORS, solveMassiveDiracRadial, type DiracRadialDiagnostics, type DiracRadialSample } from '@penumbra/radial';
import { MAX_RADII } from './greybody.js';
import { massiveDiracMode } from './massiveDirac.js';
import { GREYBODY_OPTIONS, type GreybodyOptions, type GreybodyProblem } from './validate.js';

/** A massive Dirac problem as `radialFunction` types it: spin 1/2, a field mass (> 0) and kappaSign. */
export type MassiveDiracProblem = GreybodyProblem & {
  readonly mode: { readonly field: { readonly spin: 0.5 | '1/2'; readonly mass: number }; readonly kappaSign: 1 | -1 };
};

/** The options `radialFunction` takes. */
export type RadialFunctionOptions = Pick<GreybodyOptions, 'tol' | 'integrator'>;

/** The massive Dirac radial pair on a grid of radii. */
export interface DiracRadialFunction {
  /** (P₊, P₋) at each requested radius, in ascending r */
  samples: DiracRadialSample[];
  /** ln|A|, the incoming amplitude at infinity of the wave (1, −μ/(ω + k∞)) e^{−i(k∞r + η ln r)} */
  logAbsIn: number;
  /** ln|B|, the outgoing amplitude of (−μ/(ω + k∞), 1) e^{+i(k∞r + η ln r)} */
  logAbsOut: number;
  /** k∞ = √(ω² − μ²) */
  kInf: number;
  /** Chandrasekhar's separation constant λ of the mode (its sign at a = 0 is kappaSign) */
  lambda: number;
  diagnostics: DiracRadialDiagnostics;
}

/**
 * The massive Dirac pair at the radii (each > r₊, at most MAX_RADII); the
 * integrator tolerance is tol × 1e-3 (at least 1e-14), as `radialFunction`'s.
 * InputError for a bad problem, radius or option.
 */
export function radialFunctionDirac(
  problem: GreybodyProblem,
  radii: readonly number[],
  options?: RadialFunctionOptions,
): DiracRadialFunction {
  const { radial, angular } = massiveDiracMode(problem);
  const checked = validateOptions<RadialFunctionOptions>(options, {
    tol: GREYBODY_OPTIONS.tol,
    integrator: GREYBODY_OPTIONS.integrator,
  });
  const tol = checked.tol ?? 1e-8;
  const grid = checkRadii(radii, radial.hole.rPlus).sort((x, y) => x - y);
  const sol = solveMassiveDiracRadial(radial, {
    tol: Math.max(tol * 1e-3, 1e-14),
    integrator: checked.integrator ?? INTEGRATORS[0],
    grid,
  });
  return {
    samples: sol.samples,
    logAbsIn: sol.logAbsIn,
    logAbsOut: sol.logAbsOut,
    kInf: sol.kInf,
    lambda: angular.lambda,
    diagnostics: sol.diagnostics,
  };
}

function checkRadii(radii: unknown, rPlus: number): number[] {
  const allowed = `an array of at most ${MAX_RADII} finite radii r > r+ = ${rPlus}`;
  if (!Array.isArray(radii) || radii.length > MAX_RADII) throw new InputError('radii', allowed, radii);
  radii.forEach((r, i) => {
    if (typeof r !== 'number' || !(r > rPlus) || !Number.isFinite(r)) throw new InputError(`radii[${i}]`, allowed, r);
  });
  return [...(radii as number[])];
}
