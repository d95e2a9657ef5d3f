/**
 * The l-tail truncation rule shared by every sum over l-shells (absorption
 * cross-sections, emission spectra, emission totals).
 *
 * Whole shells (all m of one l) are added from the lowest l upward. The sum
 * stops once l is beyond the geometric-optics cut `lCut` (above it the
 * centrifugal barrier exceeds the wave's energy) and `shellsBelow` shells in a
 * row each add at most tol·|total|. Beyond the barrier Γ falls geometrically
 * in l, so the dropped tail is bounded by |S_last|·q/(1 − q) with
 * q = |S_last|/|S_previous|; a tail that is not decreasing is a
 * ConvergenceError, never a silent truncation.
 *
 * A shell may carry several quantities at once (e.g. number and energy
 * rates, which share every greybody solve): it is negligible only when each
 * of them is, and each gets its own tail bound.
 */
import type { Diagnostics } from './diagnostics.js';
import { ConvergenceError, InputError, requireFinite, requireObject } from './errors.js';

/** When a sum over l-shells may stop, and when it has failed to converge. */
export interface LShellRule {
  /** geometric-optics cut: shells with l ≤ lCut never end the sum */
  lCut: number;
  /** relative size below which a shell counts as negligible */
  tol: number;
  /** largest l summed before the sum counts as not converged */
  maxL: number;
  /** negligible shells needed in a row (default 2) */
  shellsBelow?: number;
  /** smallest l that may end the sum (default: the first) */
  lMinToStop?: number;
  /**
   * Extra diagnostics (e.g. RHS evaluations so far, the problem) merged into
   * any ConvergenceError the sum itself throws; they override the defaults.
   */
  context?: () => Partial<Diagnostics> & Record<string, unknown>;
}

/** A converged sum over l-shells, with its tail bound. */
export interface LShellSum {
  /** sum of the shells summed */
  total: number;
  /** each shell's l and its sum over m */
  shells: { l: number; sum: number }[];
  /** largest l summed */
  lMax: number;
  /** bound on |sum| of the shells not summed */
  tailBound: number;
  /** ratio of the last two shells (the geometric rate used for the bound) */
  q: number;
  /** shell evaluations */
  evaluations: number;
}

/** `LShellSum` for shells carrying several quantities: one total, tail bound and rate per quantity. */
export interface LShellVectorSum {
  totals: number[];
  shells: { l: number; sums: number[] }[];
  /** largest l summed */
  lMax: number;
  /** bound on |sum| of the shells not summed, per quantity */
  tailBounds: number[];
  /** ratio of the last two shells, per quantity */
  q: number[];
  /** shell evaluations */
  evaluations: number;
}

const METHOD = 'l-shell sum with geometric tail bound';

/** The geometric tail after shells `prev`, `last`, or null if they do not decrease. */
function geometricTail(last: number, prev: number): { bound: number; q: number } | null {
  const L = Math.abs(last);
  if (L === 0) return { bound: 0, q: 0 };
  const q = L / Math.abs(prev);
  return q < 1 ? { bound: (L * q) / (1 - q), q } : null;
}

/** Bound on the geometric tail after shells `prev`, `last`; throws if they do not decrease. */
export function geometricTailBound(last: number, prev: number, what: string): { bound: number; q: number } {
  requireFinite('last', last);
  requireFinite('prev', prev);
  if (typeof what !== 'string') throw new InputError('what', 'a string', what);
  const tail = geometricTail(last, prev);
  if (tail) return tail;
  throw new ConvergenceError(`${what}: l-shells are not decreasing`, {
    method: METHOD,
    steps: 0,
    rhsEvaluations: 0,
    errorEstimate: Infinity,
    message: `last two shells ${Math.abs(last)} and ${Math.abs(prev)} do not decrease`,
  });
}

/**
 * The smallest l at which a sum under `rule` could stop: past the cut, at or
 * past `lMinToStop`, with `shellsBelow` negligible shells in a row.
 */
function earliestStop(lFirst: number, rule: LShellRule): number {
  const need = rule.shellsBelow ?? 2;
  // the first l strictly above lCut with l − lFirst an integer (half-integer l for fermions)
  const past = lFirst + Math.max(0, Math.floor(rule.lCut - lFirst) + 1);
  return Math.max(past, rule.lMinToStop ?? lFirst) + need - 1;
}

/**
 * Refuse, before any shell is computed, a sum that could not stop within
 * rule.maxL: a ConvergenceError whose diagnostics name the limit (`maxL`, and
 * `limit` when the caller says where it comes from, e.g. core's MAX_L).
 */
export function requireLShellReach(lFirst: number, rule: LShellRule, what = 'l-shell sum', limit?: string): void {
  const needed = earliestStop(lFirst, rule);
  if (!(needed > rule.maxL)) return;
  const source = limit ? ` (${limit})` : '';
  throw new ConvergenceError(`${what} would need l up to at least ${needed}, beyond maxL = ${rule.maxL}${source}`, {
    method: METHOD,
    steps: 0,
    rhsEvaluations: 0,
    errorEstimate: Infinity,
    message: `the sum may stop only past the geometric-optics cut lCut = ${rule.lCut} after ${rule.shellsBelow ?? 2} negligible shells, at l ≥ ${needed} > maxL = ${rule.maxL}${source}; refused before any work`,
    maxL: rule.maxL,
    lCut: rule.lCut,
    lNeeded: needed,
    ...(limit ? { limit } : {}),
    ...rule.context?.(),
  });
}

/** The arguments of an l-shell sum, checked for callers outside TypeScript (maxL bounds the work). */
function checkSumArguments(lFirst: unknown, rule: unknown, shell: unknown, what: unknown): void {
  if (typeof lFirst !== 'number' || !Number.isInteger(2 * lFirst) || lFirst < 0 || lFirst > 1000)
    throw new InputError('lFirst', 'an integer or half-integer in [0, 1000]', lFirst);
  const r = requireObject('rule', rule, 'an l-shell rule {lCut, tol, maxL, …}');
  // lCut may be ±Infinity (no cut, or never stop below it), not NaN
  if (typeof r.lCut !== 'number' || Number.isNaN(r.lCut))
    throw new InputError('rule.lCut', 'a number (±Infinity allowed)', r.lCut);
  const tol = requireFinite('rule.tol', r.tol, 'a number in [0, 1]');
  if (!(tol >= 0 && tol <= 1)) throw new InputError('rule.tol', 'a number in [0, 1]', tol);
  const maxL = requireFinite('rule.maxL', r.maxL, 'a number in [lFirst, lFirst + 1000]');
  if (!(maxL >= lFirst && maxL <= lFirst + 1000)) throw new InputError('rule.maxL', 'a number in [lFirst, lFirst + 1000]', maxL);
  if (r.shellsBelow !== undefined) {
    const n = r.shellsBelow;
    if (typeof n !== 'number' || !Number.isInteger(n) || n < 1 || n > 1000)
      throw new InputError('rule.shellsBelow', 'an integer in [1, 1000]', n);
  }
  if (r.lMinToStop !== undefined) requireFinite('rule.lMinToStop', r.lMinToStop);
  if (r.context !== undefined && typeof r.context !== 'function') throw new InputError('rule.context', 'a function', r.context);
  if (typeof shell !== 'function') throw new InputError('shell', 'a function', shell);
  if (typeof what !== 'string') throw new InputError('what', 'a string', what);
}

/** Sum `shell(l)` for l = lFirst, lFirst + 1, … under `rule`; see the module comment. */
export function sumLShells(lFirst: number, rule: LShellRule, shell: (l: number) => number, what = 'l-shell sum'): LShellSum {
  checkSumArguments(lFirst, rule, shell, what);
  const r = sumLShellVectors(lFirst, rule, (l) => [shell(l)], what);
  return {
    total: r.totals[0],
    shells: r.shells.map((s) => ({ l: s.l, sum: s.sums[0] })),
    lMax: r.lMax,
    tailBound: r.tailBounds[0],
    q: r.q[0],
    evaluations: r.evaluations,
  };
}

/**
 * Sum shells carrying several quantities under `rule`: a shell is negligible
 * when every quantity is below tol·|its total|; every quantity's tail must
 * decrease and gets its own bound.
 */
export function sumLShellVectors(
  lFirst: number,
  rule: LShellRule,
  shell: (l: number) => readonly number[],
  what = 'l-shell sum',
): LShellVectorSum {
  checkSumArguments(lFirst, rule, shell, what);
  const need = rule.shellsBelow ?? 2;
  const lMinToStop = rule.lMinToStop ?? lFirst;
  requireLShellReach(lFirst, rule, what);
  const shells: { l: number; sums: number[] }[] = [];
  const totals: number[] = [];
  let below = 0;
  const fail = (message: string, detail: string): never => {
    throw new ConvergenceError(message, {
      method: METHOD,
      steps: shells.length,
      rhsEvaluations: 0,
      errorEstimate: Infinity,
      message: detail,
      maxL: rule.maxL,
      lCut: rule.lCut,
      ...rule.context?.(),
    });
  };
  for (let l = lFirst; l <= rule.maxL; l++) {
    const out: unknown = shell(l);
    if (!Array.isArray(out) || out.length === 0 || !out.every((x) => typeof x === 'number' && Number.isFinite(x)))
      fail(`${what}: shell ${l} is not a list of finite numbers`, `shell(${l}) returned ${String(out)}`);
    const sums = [...(out as number[])];
    if (totals.length > 0 && sums.length !== totals.length)
      fail(`${what}: shell ${l} has ${sums.length} quantities, not ${totals.length}`, `shell(${l}) changed length`);
    if (totals.length === 0) totals.push(...sums.map(() => 0));
    for (const [d, s] of sums.entries()) totals[d] += s;
    shells.push({ l, sums });
    if (l > rule.lCut && l >= lMinToStop && sums.every((s, d) => Math.abs(s) <= rule.tol * Math.abs(totals[d]))) {
      if (++below >= need) break;
    } else below = 0;
  }
  if (below < need) {
    fail(
      `${what} did not converge within maxL = ${rule.maxL}`,
      `the shells were still above tol·|total| at l = ${rule.maxL} (lCut = ${rule.lCut}, total = ${totals.join(', ') || 0})`,
    );
  }
  const last = shells[shells.length - 1];
  const prev = shells[shells.length - 2];
  const tails = last.sums.map((s, d) => {
    const p = prev?.sums[d] ?? Infinity;
    return (
      geometricTail(s, p) ??
      fail(`${what}: l-shells are not decreasing`, `last two shells ${Math.abs(s)} and ${Math.abs(p)} do not decrease`)
    );
  });
  return {
    totals,
    shells,
    lMax: last.l,
    tailBounds: tails.map((t) => t.bound),
    q: tails.map((t) => t.q),
    evaluations: shells.length,
  };
}
