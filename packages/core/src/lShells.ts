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
 */
import { ConvergenceError } from './errors.js';

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
}

export interface LShellSum {
  total: number;
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

/** Bound on the geometric tail after shells `prev`, `last`; throws if they do not decrease. */
export function geometricTailBound(last: number, prev: number, what: string): { bound: number; q: number } {
  const L = Math.abs(last);
  if (L === 0) return { bound: 0, q: 0 };
  const q = L / Math.abs(prev);
  if (!(q < 1)) {
    throw new ConvergenceError(`${what}: l-shells are not decreasing`, {
      method: 'l-shell sum with geometric tail bound', steps: 0, rhsEvaluations: 0, errorEstimate: Infinity,
      message: `last two shells ${L} and ${Math.abs(prev)} do not decrease`,
    });
  }
  return { bound: (L * q) / (1 - q), q };
}

/** Sum `shell(l)` for l = lFirst, lFirst + 1, … under `rule`; see the module comment. */
export function sumLShells(lFirst: number, rule: LShellRule, shell: (l: number) => number, what = 'l-shell sum'): LShellSum {
  const need = rule.shellsBelow ?? 2;
  const lMinToStop = rule.lMinToStop ?? lFirst;
  const shells: { l: number; sum: number }[] = [];
  let total = 0;
  let below = 0;
  for (let l = lFirst; l <= rule.maxL; l++) {
    const sum = shell(l);
    total += sum;
    shells.push({ l, sum });
    if (l > rule.lCut && l >= lMinToStop && Math.abs(sum) <= rule.tol * Math.abs(total)) {
      if (++below >= need) break;
    } else below = 0;
  }
  if (below < need) {
    throw new ConvergenceError(`${what} did not converge within maxL = ${rule.maxL}`, {
      method: 'l-shell sum with geometric tail bound', steps: shells.length, rhsEvaluations: 0, errorEstimate: Infinity,
      message: `the shells were still above tol·|total| at l = ${rule.maxL} (lCut = ${rule.lCut}, total = ${total})`,
    });
  }
  const last = shells[shells.length - 1];
  const prev = shells[shells.length - 2] ?? { sum: Infinity };
  const { bound, q } = geometricTailBound(last.sum, prev.sum, what);
  return { total, shells, lMax: last.l, tailBound: bound, q, evaluations: shells.length };
}
