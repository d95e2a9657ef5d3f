import { ConvergenceError, InputError, requireFinite } from '@penumbra/kerr';
import { basisLayout, buildBand } from './band.js';
import { leaverRoot } from './leaver.js';
import { checkModeNumbers, checkRealC, lowestL, sphericalEigenvalue } from './quantum.js';
import {
  type SpectralSolution,
  estimateSize,
  settledSolution,
  settleEigenvalue,
  settleEigenvalueCold,
  solveBisection,
  solveDense,
  solveWarm,
  tailConverged,
} from './spectral.js';

export interface SpheroidalQuery {
  s: number;
  l: number;
  m: number;
  c: number;
}

export interface SpheroidalDiagnostics {
  /** 'exact' (c = 0), 'spectral-dense', 'spectral-rqi', or either of the latter + '+leaver'. */
  method: string;
  /** Number of spin-weighted spherical harmonics kept in the expansion. */
  truncation: number;
  /** ‖K b − A b‖ / ‖K‖ of the spectral eigenpair. */
  residual: number;
  /** Spectral iterations (RQI steps or dense attempts) plus Newton steps on the continued fraction. */
  iterations: number;
  /** |A_spectral − A_Leaver| / max(1, |A|): the two independent methods' disagreement. */
  agreement?: number;
  /** Depth reached by the continued fraction. */
  continuedFractionDepth?: number;
}

export interface SpheroidalEigenvalue {
  s: number;
  l: number;
  m: number;
  c: number;
  /** Angular separation constant A_{slm}(c); A(0) = (l − s)(l + s + 1). */
  A: number;
  /** E = A + s(s + 1), symmetric under s → −s. */
  E: number;
  diagnostics: SpheroidalDiagnostics;
}

export interface SolveOptions {
  /**
   * Leaver's continued fraction as a second method: 'off' (default), 'check'
   * (solve it from the spectral value and report the agreement), or 'polish'
   * (also adopt its root when the two agree to 1e-9). Measured against a
   * 40-digit reference the spectral value is already at rounding level
   * (docs/spheroidal.md), so 'polish' does not improve real-c eigenvalues.
   */
  leaver?: 'off' | 'check' | 'polish';
  /** Use and update the per-mode continuation cache (default true). */
  continuation?: boolean;
}

/** Largest disagreement between spectral and continued-fraction values that we accept. */
const AGREEMENT_LIMIT = 1e-9;

interface ModeState {
  c: number;
  leaver: string;
  result: SpheroidalEigenvalue;
  spectral: SpectralSolution | null;
}

/** Last solved point of each mode, for warm starts and exact repeats. */
const modeCache = new Map<string, ModeState>();
const MODE_CACHE_LIMIT = 4096;

function modeKey(s: number, l: number, m: number): string {
  return `${2 * s},${2 * l},${2 * m}`;
}

/** Forget every cached mode (for benchmarks of the cold path). */
export function clearSpheroidalCache(): void {
  modeCache.clear();
}

export interface SolvedMode {
  result: SpheroidalEigenvalue;
  spectral: SpectralSolution | null;
}

export function solveMode(q: SpheroidalQuery, options: SolveOptions = {}): SolvedMode {
  if (q === null || typeof q !== 'object') throw new InputError('query', 'an object { s, l, m, c }', q);
  checkModeNumbers(q);
  const c = checkRealC(q.c);
  const { s, l, m } = q;
  const leaver = options.leaver ?? 'off';
  const useCache = options.continuation ?? true;
  const key = modeKey(s, l, m);
  const previous = useCache ? modeCache.get(key) : undefined;
  if (previous && previous.c === c && previous.leaver === leaver) {
    return { result: previous.result, spectral: previous.spectral };
  }

  if (c === 0) {
    const A = sphericalEigenvalue(s, l);
    const result: SpheroidalEigenvalue = {
      s, l, m, c, A, E: A + s * (s + 1),
      diagnostics: { method: 'exact', truncation: 1, residual: 0, iterations: 0 },
    };
    if (useCache) remember(key, { c, leaver, result, spectral: null });
    return { result, spectral: null };
  }

  const { lFirst, stride, index } = basisLayout(s, l, m);
  // The truncation follows from a history-free guess, so that warm and cold
  // solves work on the same band (see `settle`).
  // Six terms beyond the estimate: a failed tail check costs a second bisection,
  // six more terms cost little (measured on the bench workload).
  const size = Math.max(estimateSize(s, m, c, lFirst, stride, index, sphericalEigenvalue(s, l) - 0.5 * c * c) + 6, index + 3);
  let spectral: SpectralSolution | null = null;
  if (previous) {
    const prevA = previous.result.A;
    const dAdc = previous.spectral ? previous.spectral.dAdc : 0;
    const guess = prevA + dAdc * (c - previous.c);
    spectral = solveWarm(s, m, c, lFirst, stride, index, size, guess, previous.spectral?.vector ?? null, false);
  } else {
    spectral = solveBisection(s, m, c, lFirst, stride, index, size, false);
  }
  spectral ??= solveDense(s, m, c, lFirst, stride, index, size);

  spectral = settle(s, m, c, lFirst, stride, index, size, spectral);

  let A = spectral.A;
  const diagnostics: SpheroidalDiagnostics = {
    method: spectral.method,
    truncation: spectral.band.size,
    residual: spectral.residual,
    iterations: spectral.iterations,
  };
  if (leaver !== 'off') {
    const root = leaverCheck(s, l, m, c, A, spectral.band.norm);
    diagnostics.agreement = root.agreement;
    diagnostics.continuedFractionDepth = root.depth;
    if (leaver === 'polish' && root.agreement <= AGREEMENT_LIMIT) {
      A = root.A;
      diagnostics.method += '+leaver';
      diagnostics.iterations += root.iterations;
    }
  }
  const result: SpheroidalEigenvalue = { s, l, m, c, A, E: A + s * (s + 1), diagnostics };
  if (useCache) remember(key, { c, leaver, result, spectral });
  return { result, spectral };
}

/**
 * Make the result a function of (s, l, m, c) alone. The warm or cold solve only
 * supplies a seed; the returned eigenvalue is the Sylvester-count step of a
 * band whose size follows from a history-free guess, located by dyadic
 * bisection to adjacent floats (`settleEigenvalue`), and the eigenvector comes
 * from inverse iteration at that value from a fixed start. Continuation still
 * pays: the seed lets the bisection skip all but the last ~10–15 levels.
 */
function settle(
  s: number,
  m: number,
  c: number,
  lFirst: number,
  stride: 1 | 2,
  index: number,
  initialSize: number,
  solved: SpectralSolution,
): SpectralSolution {
  let size = initialSize;
  let seed = solved.A;
  // The seed is a converged Rayleigh quotient: within a few ε‖K‖ of the step.
  let margin = Math.max(64 * solved.residual, 4e-15) * solved.band.norm;
  for (let attempt = 0; attempt < 8; attempt++) {
    const band = size === solved.band.size ? solved.band : buildBand(s, m, c, lFirst, stride, size);
    const point =
      settleEigenvalue(band, index, seed, margin) ??
      settleEigenvalue(band, index, seed, 1e-9 * band.norm) ??
      settleEigenvalueCold(band, index);
    const settled = settledSolution(band, point.A, solved.iterations + point.counts, solved.method);
    if (tailConverged(settled)) return settled;
    seed = point.A;
    margin = 1e-13 * band.norm;
    size = Math.ceil(size * 1.5) + 8;
  }
  throw new ConvergenceError('spheroidal spectral expansion did not converge in the deterministic finish', {
    s, m, c, index, size,
  });
}

/**
 * Newton on the continued fraction from the spectral value. The expansion is
 * about x = −1 with the factor e^{−|c|x} (σ = −sign c), which keeps the series
 * free of exponential cancellation whichever pole S is concentrated at
 * (docs/spheroidal.md). Throws ConvergenceError if Newton fails.
 */
export function leaverCheck(
  s: number,
  l: number,
  m: number,
  c: number,
  start: number,
  scale: number,
): { A: number; agreement: number; depth: number; iterations: number } {
  const sigma: 1 | -1 = c > 0 ? -1 : 1;
  const root = leaverRoot(s, m, c, start, l - lowestL(s, m), scale, 12, sigma);
  return { ...root, agreement: Math.abs(root.A - start) / Math.max(1, Math.abs(start)) };
}

function remember(key: string, state: ModeState): void {
  if (!modeCache.has(key) && modeCache.size >= MODE_CACHE_LIMIT) {
    const oldest = modeCache.keys().next().value;
    if (oldest !== undefined) modeCache.delete(oldest);
  }
  modeCache.set(key, state);
}

/**
 * Spin-weighted spheroidal eigenvalue A_{slm}(c) for real c = aω, in the
 * convention of the angular equation
 *   (1/sinθ)(sinθ S′)′ + (c²cos²θ − m²/sin²θ − 2cs cosθ − 2ms cosθ/sin²θ − s²cot²θ + s + A) S = 0.
 * Spectral expansion in spin-weighted spherical harmonics (warm-started from
 * the last c solved for the same mode), polished by Newton on Leaver's
 * continued fraction. Throws InputError for bad quantum numbers or c, and
 * ConvergenceError if either method fails or they disagree.
 */
export function spheroidalEigenvalue(q: SpheroidalQuery, options?: SolveOptions): SpheroidalEigenvalue {
  return solveMode(q, options).result;
}

/** λ = A + a²ω² − 2amω, the radial separation constant */
export function radialSeparationConstant(A: number, a: number, omega: number, m: number): number {
  requireFinite('A', A);
  requireFinite('a', a);
  requireFinite('omega', omega);
  requireFinite('m', m);
  return A + a * a * omega * omega - 2 * a * m * omega;
}
