import { ConvergenceError, InputError, requireFinite, type Diagnostics } from '@penumbra/core';
import { basisLayout, buildBand } from './band.js';
import { failureDiagnostics, type Tally } from './diagnostics.js';
import { leaverRoot } from './leaver.js';
import {
  type SpheroidalOptions,
  type SpheroidalProblem,
  validateRealC,
  validateSpheroidalOptions,
  validateSpheroidalProblem,
} from './problem.js';
import { lowestL, sphericalA0 } from './quantum.js';
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

/** How a real-c eigenvalue was obtained (core's Diagnostics plus the spectral details). */
export interface SpheroidalDiagnostics extends Diagnostics {
  /** 'exact' (c = 0), 'spectral-dense', 'spectral-rqi', or either of the latter + '+leaver'. */
  method: string;
  /**
   * Spectral iterations (RQI steps or dense attempts, plus the Sylvester counts
   * of the deterministic finish) and, when its root is adopted, Newton steps
   * on the continued fraction.
   */
  steps: number;
  /**
   * Matrix and continued-fraction evaluations, all attempts included: LDLᵀ
   * factorisations of K − σI, dense eigen-solves of K, and evaluations of
   * Leaver's continued fraction (with `leaver: 'check' | 'polish'`).
   */
  rhsEvaluations: number;
  /**
   * Relative error bound of A (scaled by max(1, |A|)): the residual of the
   * symmetric band, at least four rounding units of ‖K‖ (for a symmetric matrix
   * an eigenvalue lies within ‖Kb − Ab‖ of A). 'polish' adopts the
   * continued-fraction root only within this bound, so it does not change it.
   * The truncation error is below it by the tail check (≤ 1e-16).
   */
  errorEstimate: number;
  /** Number of spin-weighted spherical harmonics kept in the expansion. */
  truncation: number;
  /** ‖K b − A b‖ / ‖K‖ of the spectral eigenpair. */
  residual: number;
  /** |A_spectral − A_Leaver| / max(1, |A|): the two independent methods' disagreement. */
  agreement?: number;
  /** Depth reached by the continued fraction. */
  continuedFractionDepth?: number;
}

/** The solution of a real-c problem: the problem's numbers, A, E and diagnostics. */
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

/**
 * Largest relative disagreement between the spectral value and the
 * continued-fraction root that passes `leaver: 'check'`: the fraction's own
 * rounding reaches 8e-9 at |c| = 15…30 (measured, see leaverCheck); distinct
 * roots are O(1) apart there. A larger disagreement is a ConvergenceError.
 */
const CHECK_LIMIT = 1e-7;

/** Four rounding units: the assembled matrix elements carry a few rounding errors each. */
const ROUNDING_FLOOR = 4 * Number.EPSILON;

/** Largest |c| where a failed warm start falls back on bisection before the dense solve (see solveValidMode). */
const BISECTION_FALLBACK_C = 10;

const SPECTRAL_MESSAGE =
  'converged: eigenvalue bisected to adjacent floats by Sylvester counts on a truncation whose eigenvector tail is below 1e-16';

/**
 * A mode's last solve. The next solve of the same mode builds its band and
 * eigenvector in this one's stores (`spectral.band`'s diagonals and
 * `spectral.vector` are read only while the solve that made them runs, and
 * by callers of `solveMode` at once: the warm start copies the vector
 * first); a solve that throws drops the entry (its stores may be part-written).
 */
interface ModeState {
  c: number;
  leaver: string;
  result: SpheroidalEigenvalue;
  spectral: SpectralSolution | null;
}

/** Last solved point of each mode, for warm starts and exact repeats. */
const modeCache = new Map<number, ModeState>();
const MODE_CACHE_LIMIT = 4096;

/** A number per (s, l, m) (2s, 2l, 2m are integers with |2s| ≤ 4, 0 ≤ 2l ≤ 2·MAX_L, |2m| ≤ 2l): a string key was measured at ~3 % of a warm solve. */
function modeKey(s: number, l: number, m: number): number {
  return (2 * l * 2048 + (2 * m + 1024)) * 16 + (2 * s + 8);
}

/** Forget every cached mode (for benchmarks of the cold path; results never depend on the cache). */
export function clearSpheroidalCache(): void {
  modeCache.clear();
}

/** A solved mode with its spectral eigenpair (null at c = 0), shared by the eigenvalue, harmonic and complex-c solves. */
export interface SolvedMode {
  result: SpheroidalEigenvalue;
  spectral: SpectralSolution | null;
}

/** Validate and solve one real-c problem (cached per mode); the common core of every solve in the package. */
export function solveMode(problem: unknown, options: unknown): SolvedMode {
  const { s, l, m, c } = validateSpheroidalProblem(problem);
  const { leaver, continuation: useCache } = validateSpheroidalOptions(options);
  return solveValidMode(s, l, m, c, leaver, useCache);
}

/**
 * The eigenvalue of a mode whose numbers the caller has already validated as
 * a mode of a field (core's validateMode: s one of SPIN_WEIGHTS, |s| ≤ l ≤ MAX_L,
 * |m| ≤ l, l − s and m − s integers), with the default options: the same
 * result as `spheroidalEigenvalue({ s, l, m, c })` without re-checking the
 * problem object. c is still checked (InputError naming problem.c).
 */
export function spheroidalEigenvalueOfValidMode(s: number, l: number, m: number, c: number): SpheroidalEigenvalue {
  return solveValidMode(s, l, m, validateRealC(c), 'off', true).result;
}

function solveValidMode(s: number, l: number, m: number, c: number, leaver: string, useCache: boolean): SolvedMode {
  const key = modeKey(s, l, m);
  const previous = useCache ? modeCache.get(key) : undefined;
  if (previous && previous.c === c && previous.leaver === leaver) {
    return { result: previous.result, spectral: previous.spectral };
  }

  if (c === 0) {
    const A = sphericalA0(s, l);
    const result: SpheroidalEigenvalue = {
      s,
      l,
      m,
      c,
      A,
      E: A + s * (s + 1),
      diagnostics: {
        method: 'exact',
        steps: 0,
        rhsEvaluations: 0,
        errorEstimate: 0,
        message: 'exact: A = (l − s)(l + s + 1) at c = 0',
        truncation: 1,
        residual: 0,
      },
    };
    if (useCache) remember(key, { c, leaver, result, spectral: null });
    return { result, spectral: null };
  }

  try {
    return solveNonzero(key, previous, s, l, m, c, leaver, useCache);
  } catch (e) {
    if (previous) modeCache.delete(key);
    throw e;
  }
}

function solveNonzero(
  key: number,
  previous: ModeState | undefined,
  s: number,
  l: number,
  m: number,
  c: number,
  leaver: string,
  useCache: boolean,
): SolvedMode {
  const tally: Tally = { evaluations: 0 };
  const { lFirst, stride, index } = basisLayout(s, l, m);
  const stores = previous?.spectral ? { band: previous.spectral.band.d0.buffer, vector: previous.spectral.vector.buffer } : null;
  // The truncation follows from a history-free guess, so that warm and cold
  // solves work on the same band (see `settle`).
  // Six terms beyond the estimate: a failed tail check costs a second bisection,
  // six more terms cost little (measured on the bench workload). (Two up to |c| = 10
  // saved ~10 % of an eigenvalue but moved A in its last bits, and with it the bytes
  // of grid files.)
  const size = Math.max(estimateSize(s, m, c, lFirst, stride, index, sphericalA0(s, l) - 0.5 * c * c) + 6, index + 3);
  let spectral: SpectralSolution | null = null;
  if (previous) {
    const prevA = previous.result.A;
    const dAdc = previous.spectral ? previous.spectral.dAdc : 0;
    const guess = prevA + dAdc * (c - previous.c);
    const band = stores ? buildBand(s, m, c, lFirst, stride, size, stores.band) : undefined;
    // Up to |c| = BISECTION_FALLBACK_C (no close pairs) the settle certifies the index alone.
    const checkIndex = Math.abs(c) > BISECTION_FALLBACK_C;
    const seedVector = previous.spectral?.vector ?? null;
    spectral = solveWarm(s, m, c, lFirst, stride, index, size, guess, seedVector, tally, false, band, checkIndex);
  }
  // A warm start that lands on a neighbouring eigenvalue fell back on the dense solve (tens of µs, tred2/tql2);
  // up to |c| = BISECTION_FALLBACK_C the bisection seed settles to the same doubles (bench/angular-cost.bench.mjs)
  // at a fraction of the cost. Beyond it the settled value was seen to depend on the seed (8 of 2,400 random
  // problems with |c| > 20, up to 4e-9 relative: the bisection's Sylvester counts are then presumably not
  // monotone in σ), so the earlier order is kept there.
  if (!previous || (spectral === null && Math.abs(c) <= BISECTION_FALLBACK_C)) {
    spectral = solveBisection(s, m, c, lFirst, stride, index, size, tally, false);
  }
  spectral ??= solveDense(s, m, c, lFirst, stride, index, size, tally);

  spectral = settle(s, m, c, lFirst, stride, index, size, spectral, tally, stores?.vector);

  let A = spectral.A;
  const diagnostics: SpheroidalDiagnostics = {
    method: spectral.method,
    steps: spectral.iterations,
    rhsEvaluations: 0,
    errorEstimate: (Math.max(spectral.residual, ROUNDING_FLOOR) * spectral.band.norm) / Math.max(1, Math.abs(A)),
    message: SPECTRAL_MESSAGE,
    truncation: spectral.band.size,
    residual: spectral.residual,
  };
  if (leaver !== 'off') {
    const root = leaverCheck(s, l, m, c, A, spectral.band.norm);
    tally.evaluations += root.iterations;
    diagnostics.agreement = root.agreement;
    diagnostics.continuedFractionDepth = root.depth;
    if (root.agreement > CHECK_LIMIT) {
      diagnostics.rhsEvaluations = tally.evaluations;
      throw new ConvergenceError("spheroidal eigenvalue failed the check against Leaver's continued fraction", {
        ...diagnostics,
        errorEstimate: root.agreement,
        message: `spectral value ${A} and continued-fraction root ${root.A} differ by ${root.agreement.toExponential(2)} (relative) > ${CHECK_LIMIT}`,
        s,
        l,
        m,
        c,
      });
    }
    // Adopted only within the spectral bound: a polished value never moves beyond its own error estimate.
    if (leaver === 'polish' && root.agreement <= diagnostics.errorEstimate) {
      A = root.A;
      diagnostics.method += '+leaver';
      diagnostics.steps += root.iterations;
      diagnostics.message = `${SPECTRAL_MESSAGE}; Leaver's continued-fraction root adopted (within the spectral bound)`;
    }
  }
  diagnostics.rhsEvaluations = tally.evaluations;
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
  tally: Tally,
  vectorStore?: ArrayBufferLike,
): SpectralSolution {
  let size = initialSize;
  let seed = solved.A;
  let steps = solved.iterations;
  // The seed is a converged Rayleigh quotient: within a few ε‖K‖ of the step. Up to
  // |c| = BISECTION_FALLBACK_C a quarter of the wider bracket settled to the same doubles
  // from warm and cold seeds (40,000 random problems, |c| ≤ 20) and saves two counts;
  // beyond it a warm and a cold seed were seen to settle apart (1 in 10,000, |c| ≤ 40).
  const narrow = Math.abs(c) <= BISECTION_FALLBACK_C;
  let margin = (narrow ? Math.max(8 * solved.residual, 1e-15) : Math.max(64 * solved.residual, 4e-15)) * solved.band.norm;
  for (let attempt = 0; attempt < 8; attempt++) {
    const band = size === solved.band.size ? solved.band : buildBand(s, m, c, lFirst, stride, size);
    const point =
      settleEigenvalue(band, index, seed, margin, tally) ??
      settleEigenvalue(band, index, seed, 1e-9 * band.norm, tally) ??
      settleEigenvalueCold(band, index, tally);
    const settled = settledSolution(band, point.A, solved.iterations + point.counts, solved.method, tally, vectorStore);
    if (tailConverged(settled)) return settled;
    steps += point.counts;
    seed = point.A;
    margin = 1e-13 * band.norm;
    size = Math.ceil(size * 1.5) + 8;
  }
  throw new ConvergenceError(
    'spheroidal spectral expansion did not converge in the deterministic finish',
    failureDiagnostics(solved.method, 'eigenvector tail above 1e-16 after 8 truncations', steps, tally.evaluations, {
      s,
      m,
      c,
      index,
      size,
    }),
  );
}

/**
 * Newton on the continued fraction from the spectral value, in two exact
 * forms: the fraction of (s, m) itself, and that of (−s, m) with
 * A_s = A_{−s} − 2s (E = A + s(s + 1) is symmetric under s → −s). The
 * expansion is about x = −1 with the factor e^{−|c|x} (σ = −sign c), which
 * keeps the series free of exponential cancellation whichever pole S is
 * concentrated at (docs/spheroidal.md); at large |c| with s·c < 0 Newton on
 * the first form lands on a neighbouring root (s = −2, l = 4, m = 1, c = 40:
 * off by 0.34 relative), while the second finds A to 2e-16, and the other way
 * round for s·c > 0. The check keeps the form that agrees best; measured over
 * 9702 points (every s, l ≤ |s| + 8, every m, 1 ≤ |c| ≤ 40) the better form
 * agrees to ≤ 6e-14 for |c| ≤ 10 and ≤ 8e-9 up to |c| = 40. Throws
 * ConvergenceError if Newton fails in both forms.
 */
function leaverCheck(
  s: number,
  l: number,
  m: number,
  c: number,
  start: number,
  scale: number,
): { A: number; agreement: number; depth: number; iterations: number } {
  const sigma: 1 | -1 = c > 0 ? -1 : 1;
  let best: { A: number; agreement: number; depth: number; iterations: number } | undefined;
  let iterations = 0;
  let failure: unknown;
  for (const t of s === 0 ? [s] : [s, -s]) {
    const shift = t === s ? 0 : 2 * s; // A_t = A_s + shift
    try {
      const root = leaverRoot(t, m, c, start + shift, l - lowestL(t, m), scale, 12, sigma);
      iterations += root.iterations;
      const A = root.A - shift;
      const agreement = Math.abs(A - start) / Math.max(1, Math.abs(start));
      if (!best || agreement < best.agreement) best = { A, agreement, depth: root.depth, iterations: 0 };
    } catch (e) {
      if (!(e instanceof ConvergenceError)) throw e;
      failure = e;
    }
  }
  if (!best) throw failure;
  return { ...best, iterations };
}

function remember(key: number, state: ModeState): void {
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
 * the last c solved for the same mode, with a history-free deterministic
 * finish). By default (`leaver: 'off'`) that spectral value is the result and
 * Leaver's continued fraction is not evaluated; `leaver: 'check'` also solves
 * the continued fraction by Newton from it and reports the agreement (a
 * disagreement above 1e-7 is a ConvergenceError); `'polish'` adopts that
 * root only where it agrees within the spectral error bound (the fraction
 * loses digits at large |c|, so it never improves a real-c value beyond it).
 * Throws InputError for a bad problem or options and ConvergenceError (with
 * full diagnostics) if a method fails.
 */
export function spheroidalEigenvalue(problem: SpheroidalProblem, options?: SpheroidalOptions): SpheroidalEigenvalue {
  return solveMode(problem, options).result;
}

/** λ = A + a²ω² − 2amω, the radial separation constant. */
export function radialSeparationConstant(A: number, a: number, omega: number, m: number): number {
  requireFinite('A', A);
  requireFinite('a', a);
  requireFinite('omega', omega);
  requireFinite('m', m);
  const lambda = A + a * a * omega * omega - 2 * a * m * omega;
  if (!Number.isFinite(lambda)) {
    // overflow: name the largest argument
    const [name, value] = Object.entries({ A, a, omega, m }).reduce((x, y) => (Math.abs(y[1]) > Math.abs(x[1]) ? y : x));
    throw new InputError(name, 'values whose λ = A + a²ω² − 2amω is a finite double', value);
  }
  return lambda;
}
