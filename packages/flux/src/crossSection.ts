/**
 * Absorption cross-section σ(ω) = (π/ω²) Σ_{l,m} Γ_{slm}(ω), the partial-wave
 * sum over all modes of one helicity (the s = 0 low-frequency limit σ → A_H is
 * Das, Gibbons & Mathur, Phys. Rev. Lett. 78, 417 (1997)).
 *
 * l-truncation rule: sum whole l-shells (all m) from l = s upward; stop once
 * l exceeds the geometric-optics cut ω·b_max (b_max = 5M bounds the capture
 * impact parameter of every Kerr hole, 3√3 M at a = 0) and the shell
 * contributions have fallen for two shells in a row below tol·|σ|. Beyond the
 * barrier Γ falls geometrically in l, so the dropped tail is bounded by
 * S_last·q/(1 − q) with q = S_last/S_previous; that bound is reported.
 */
import { ConvergenceError } from '@penumbra/kerr';
import { greybody, type GreybodyOptions, type GreybodyResult } from './greybody.js';
import { validateHole, validateOmega, validateSpin, validateTol } from './validate.js';

export interface CrossSectionProblem {
  spin: number;
  a: number;
  omega: number;
  mass?: number;
}

export interface CrossSectionResult {
  spin: number;
  a: number;
  omega: number;
  mass: number;
  /** σ in units of M² (geometric) */
  sigma: number;
  /** largest l summed */
  lMax: number;
  /** bound on |σ| of the l-shells not summed */
  droppedBound: number;
  /** estimated relative error: mode errors plus the dropped bound */
  relError: number;
  modes: number;
  shells: { l: number; sum: number }[];
}

export function absorptionCrossSection(
  problem: CrossSectionProblem,
  options: GreybodyOptions & { maxL?: number; onMode?: (r: GreybodyResult) => void } = {},
): CrossSectionResult {
  const spin = validateSpin(problem.spin);
  const { a, mass } = validateHole(problem.a, problem.mass ?? 1);
  const omega = validateOmega(problem.omega, mass);
  const tol = validateTol(options.tol ?? 1e-8);
  const maxL = options.maxL ?? 200;
  const lCut = omega * 5 * mass;
  const shells: { l: number; sum: number }[] = [];
  let total = 0;
  let errAbs = 0;
  let modes = 0;
  let below = 0;
  let l = spin;
  for (; l <= maxL; l++) {
    let shell = 0;
    // At a = 0, Γ does not depend on m: one solve per shell, times its 2l + 1 members.
    const ms = a === 0 ? [spin === 0.5 ? 0.5 : 0] : Array.from({ length: 2 * l + 1 }, (_, i) => i - l);
    const weight = a === 0 ? 2 * l + 1 : 1;
    for (const m of ms) {
      const r = greybody({ spin, l, m, a, omega, mass }, { ...options, tol, reflection: false });
      options.onMode?.(r);
      shell += weight * r.gamma;
      errAbs += weight * Math.abs(r.gamma) * r.relError;
      modes++;
    }
    total += shell;
    shells.push({ l, sum: shell });
    if (l > lCut && Math.abs(shell) <= tol * Math.abs(total)) {
      if (++below >= 2) break;
    } else below = 0;
  }
  if (below < 2) {
    throw new ConvergenceError('cross-section l-sum did not converge within maxL', { maxL, lCut, total });
  }
  const last = Math.abs(shells[shells.length - 1].sum);
  const prev = Math.abs(shells[shells.length - 2].sum);
  const q = last / prev;
  if (!(q < 1)) throw new ConvergenceError('cross-section tail is not decreasing', { last, prev, l });
  const droppedBound = (last * q) / (1 - q);
  const scale = Math.PI / (omega * omega);
  return {
    spin,
    a,
    omega,
    mass,
    sigma: scale * total,
    lMax: shells[shells.length - 1].l,
    droppedBound: scale * droppedBound,
    relError: (errAbs + droppedBound) / Math.abs(total),
    modes,
    shells: shells.map((s) => ({ l: s.l, sum: scale * s.sum })),
  };
}
