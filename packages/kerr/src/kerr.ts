/**
 * The Kerr background in Boyer–Lindquist coordinates, geometric units.
 * Formulas: Bardeen, Press & Teukolsky, ApJ 178, 347 (1972); the hidden
 * conformal temperatures follow Castro, Maloney & Strominger, Phys. Rev. D 82,
 * 024008 (2010). Derivations and conventions: docs/kerr.md.
 */
import { InputError, requireFinite } from './errors.js';

export interface KerrHole {
  /** mass M (geometric units) */
  readonly mass: number;
  /** spin parameter a = J/M, |a| < M; negative a is a hole counter-rotating relative to m > 0 */
  readonly a: number;
  readonly rPlus: number;
  readonly rMinus: number;
  /** horizon angular velocity Ω_H = a / (2 M r+) */
  readonly omegaH: number;
  /** surface gravity κ = (r+ − r−) / (2 (r+² + a²)) */
  readonly kappa: number;
  /** Hawking temperature T_H = κ / 2π */
  readonly temperature: number;
  /** horizon area A = 4π (r+² + a²) */
  readonly area: number;
  /** Bekenstein–Hawking entropy A / 4 */
  readonly entropy: number;
  /** angular momentum J = a M */
  readonly angularMomentum: number;
}

/** Largest |a|/M accepted by horizon-based solvers: the extremal hole is a limit (κ → 0), not a valid input. */
export const MAX_SPIN_RATIO = 1;

export function kerrHole(a: number, mass = 1): KerrHole {
  requireFinite('mass', mass, 'a finite number > 0');
  if (!(mass > 0)) throw new InputError('mass', 'a finite number > 0', mass);
  requireFinite('a', a, `a finite number with |a| < M = ${mass}`);
  if (!(Math.abs(a) < mass)) {
    throw new InputError(
      'a',
      `|a| < M = ${mass}`,
      a,
      Math.abs(a) === mass
        ? 'the extremal hole has zero surface gravity and coincident horizons; horizon-based solvers take it only as a limit'
        : 'a hole with |a| > M has no horizon',
    );
  }
  // sqrt(M² − a²) as sqrt((M − a)(M + a)) keeps full relative accuracy near extremality.
  const root = Math.sqrt((mass - a) * (mass + a));
  const rPlus = mass + root;
  // r− = a²/r+ avoids cancellation in M − root when a is small.
  const rMinus = (a * a) / rPlus;
  const twoMrPlus = 2 * mass * rPlus; // = r+² + a²
  const kappa = root / twoMrPlus;
  const area = 4 * Math.PI * twoMrPlus;
  return {
    mass,
    a,
    rPlus,
    rMinus,
    omegaH: a / twoMrPlus,
    kappa,
    temperature: kappa / (2 * Math.PI),
    area,
    entropy: area / 4,
    angularMomentum: a * mass,
  };
}

/** Δ(r) = r² − 2Mr + a² = (r − r+)(r − r−). */
export function delta(hole: KerrHole, r: number): number {
  return (r - hole.rPlus) * (r - hole.rMinus);
}

/**
 * Tortoise coordinate as a function of the distance x = r − r+ > 0 from the
 * outer horizon, with the integration constant of physics notes:
 * r* = r + (2M r+/(r+ − r−)) ln((r − r+)/2M) − (2M r−/(r+ − r−)) ln((r − r−)/2M).
 * Taking x rather than r keeps full relative accuracy for x down to 1e-300.
 */
export function tortoiseFromHorizonDistance(hole: KerrHole, x: number): number {
  const { mass: M, rPlus, rMinus } = hole;
  const b = rPlus - rMinus;
  const r = rPlus + x;
  const cPlus = (2 * M * rPlus) / b;
  const cMinus = (2 * M * rMinus) / b;
  // ln((r − r−)/2M) = ln((b + x)/2M), computed without forming r − r−.
  return r + cPlus * Math.log(x / (2 * M)) - cMinus * Math.log((b + x) / (2 * M));
}

/** Tortoise coordinate r*(r) for r > r+. */
export function tortoise(hole: KerrHole, r: number): number {
  requireFinite('r', r);
  if (!(r > hole.rPlus)) throw new InputError('r', `r > r+ = ${hole.rPlus}`, r);
  return tortoiseFromHorizonDistance(hole, r - hole.rPlus);
}

/** Derivative of r* with respect to r: (r² + a²)/Δ. */
export function tortoiseDerivative(hole: KerrHole, r: number): number {
  return (r * r + hole.a * hole.a) / delta(hole, r);
}

/**
 * Inverse of the tortoise coordinate: the distance x = r − r+ at which
 * r*(r) = rStar. Newton's method on u = ln x, where r* is smooth and monotone
 * (its u-derivative is (r² + a²)/(r − r−) > 0), converging to a few ulp.
 */
export function horizonDistanceFromTortoise(hole: KerrHole, rStar: number): number {
  requireFinite('rStar', rStar);
  const { rPlus, rMinus, a } = hole;
  const b = rPlus - rMinus;
  const cPlus = (2 * hole.mass * rPlus) / b;
  const cMinus = (2 * hole.mass * rMinus) / b;
  // Starting guess: the near-horizon logarithm where it gives x < M, else r ≈ r*.
  const twoM = 2 * hole.mass;
  let u = Math.log(twoM) + (rStar - rPlus + cMinus * Math.log(b / twoM)) / cPlus;
  if (u > Math.log(hole.mass)) u = Math.log(Math.max(rStar - rPlus, hole.mass));
  for (let iter = 0; iter < 200; iter++) {
    const x = Math.exp(u);
    const f = tortoiseFromHorizonDistance(hole, x) - rStar;
    const r = rPlus + x;
    const dfdu = (r * r + a * a) / (x + b); // x times the r-derivative of r*, with Δ = x(x + b)
    let step = f / dfdu;
    // Damp steps so u never jumps by more than 2 e-folds (keeps the far branch safe).
    if (step > 2) step = 2;
    if (step < -2) step = -2;
    u -= step;
    if (Math.abs(step) <= 4e-16 * Math.max(1, Math.abs(u))) {
      return Math.exp(u);
    }
  }
  return Math.exp(u);
}

/** Inverse tortoise coordinate r(r*). */
export function radiusFromTortoise(hole: KerrHole, rStar: number): number {
  return hole.rPlus + horizonDistanceFromTortoise(hole, rStar);
}

/**
 * Near-region (hidden conformal) temperatures and central charges,
 * Phys. Rev. D 82, 024008 (2010): T_L = (r+ + r−)/(4π a), T_R = (r+ − r−)/(4π a),
 * c_L = c_R = 12 J. Undefined at a = 0 (the description needs rotation).
 */
export interface NearRegion {
  TL: number;
  TR: number;
  cL: number;
  cR: number;
}

export function nearRegion(hole: KerrHole): NearRegion {
  if (hole.a === 0) throw new InputError('a', 'a ≠ 0 (the near-region temperatures diverge at a = 0)', hole.a);
  const { rPlus, rMinus, a } = hole;
  const J = hole.angularMomentum;
  return {
    TL: (rPlus + rMinus) / (4 * Math.PI * a),
    TR: (rPlus - rMinus) / (4 * Math.PI * a),
    cL: 12 * J,
    cR: 12 * J,
  };
}

/** Cardy entropy (π²/3)(c_L T_L + c_R T_R); equals A/4 identically. */
export function cardyEntropy(n: NearRegion): number {
  return ((Math.PI * Math.PI) / 3) * (n.cL * n.TL + n.cR * n.TR);
}
