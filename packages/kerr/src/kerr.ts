/**
 * The Kerr background in Boyer–Lindquist coordinates, geometric units.
 * Formulas: Bardeen, Press & Teukolsky, ApJ 178, 347 (1972); the hidden
 * conformal temperatures follow Castro, Maloney & Strominger, Phys. Rev. D 82,
 * 024008 (2010). Derivations and conventions: docs/kerr.md.
 */
import { ConvergenceError, InputError, requireFinite, type Hole } from '@penumbra/core';

/** A hole with its derived background quantities. */
export interface KerrHole extends Hole {
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

/** Masses (geometric units) for which every background quantity, A = 8πMr+ included, is a normal double. */
export const MASS_RANGE = { min: 1e-150, max: 1e150 } as const;

// Built once: formatting 1e-150 and 1e150 on every call was measured at 7 % of a greybody factor.
const MASS_ALLOWED = `${MASS_RANGE.min} ≤ mass ≤ ${MASS_RANGE.max} (geometric units)`;

/**
 * The background of a hole { a, mass } (mass default 1): horizons, Ω_H, κ,
 * T_H, area, entropy. Any |a| < M is accepted; the extremal hole is a limit.
 */
export function kerrHole(hole: Hole): KerrHole {
  if (typeof hole !== 'object' || hole === null || Array.isArray(hole)) {
    throw new InputError('hole', 'an object { a, mass? } with |a| < mass', hole);
  }
  const { a, mass = 1 } = hole;
  requireFinite('mass', mass, MASS_ALLOWED);
  if (!(mass >= MASS_RANGE.min && mass <= MASS_RANGE.max)) {
    throw new InputError(
      'mass',
      MASS_ALLOWED,
      mass,
      'outside it M², the area or T_H leave double range; physical masses go through physicalBackground',
    );
  }
  requireFinite('a', a, `a finite number with |a| < M = ${mass}`);
  if (!(Math.abs(a) < mass)) {
    throw new InputError(
      'a',
      `|a| < M = ${mass}`,
      a,
      Math.abs(a) === mass
        ? 'the extremal hole has zero surface gravity and coincident horizons; horizon-based solvers take it only as a limit'
        : 'a hole with |a| > M has no horizon; the extremal hole |a| = M is itself only a limit for horizon-based solvers',
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

/** Throw an InputError unless `hole` is a background made by `kerrHole`. */
export function requireKerrHole(hole: unknown, parameter = 'hole'): KerrHole {
  const h = hole as Partial<KerrHole> | null;
  if (
    typeof h !== 'object' ||
    h === null ||
    // a hole from kerrHole has these finite, with r+ > r− (a changed field is refused, not computed with);
    // checked one by one: a list and a callback per check were measured in the far-zone matching
    !(
      Number.isFinite(h.a) &&
      Number.isFinite(h.mass) &&
      Number.isFinite(h.rPlus) &&
      Number.isFinite(h.rMinus) &&
      Number.isFinite(h.kappa) &&
      Number.isFinite(h.omegaH)
    ) ||
    !((h.rPlus as number) > (h.rMinus as number)) ||
    !((h.mass as number) > 0 && Math.abs(h.a as number) < (h.mass as number))
  ) {
    throw new InputError(parameter, 'a hole background made by kerrHole({ a, mass })', hole);
  }
  return hole as KerrHole;
}

/** Δ(r) = r² − 2Mr + a² = (r − r+)(r − r−). */
export function delta(hole: KerrHole, r: number): number {
  requireKerrHole(hole);
  requireFinite('r', r);
  const d = (r - hole.rPlus) * (r - hole.rMinus);
  // (r − r+)(r − r−) overflows for |r| beyond about 1e154
  if (!Number.isFinite(d)) throw new InputError('r', 'a radius with Δ(r) in the double range (|r| ≲ 1e154)', r);
  return d;
}

/**
 * Tortoise coordinate as a function of the distance x = r − r+ > 0 from the
 * outer horizon, with the integration constant of docs/kerr.md:
 * r* = r + (2M r+/(r+ − r−)) ln((r − r+)/2M) − (2M r−/(r+ − r−)) ln((r − r−)/2M).
 * Evaluated in the equivalent form (using 2M r+/b − 2M r−/b = 2M, b = r+ − r−)
 * r* = r + 2M ln((x + b)/2M) − (2M r+/b) ln(1 + b/x),
 * which has no large cancelling logarithms near extremality and stays
 * accurate to a few ulp of r* for x from 1e-300 to 1e300.
 */
export function tortoiseFromHorizonDistance(hole: KerrHole, x: number): number {
  requireKerrHole(hole);
  // NaN or x ≤ 0 lies on or inside the horizon; x = +Infinity would return Infinity silently.
  if (typeof x !== 'number' || !(x > 0 && x < Infinity)) throw new InputError('x', 'a finite number > 0 (x = r − r+)', x);
  return checkedTortoise(hole, x, 'x');
}

/** r*(x), refused naming `parameter` where it leaves the double range (x subnormal, ln x near −745). */
function checkedTortoise(hole: KerrHole, x: number, parameter: string): number {
  const { hi, lo } = tortoiseTerms(hole, x);
  const rStar = hi + lo;
  if (!Number.isFinite(rStar))
    throw new InputError(parameter, 'a point whose r* is a finite double (not within a subnormal distance of r+)', x);
  return rStar;
}

/**
 * r* as an unevaluated sum hi + lo (double-double) and the magnitude of its
 * largest term. Products and sums are error-free transformations, so the only
 * rounding left is that of the two logarithms: round trips r → r* → r then
 * stay near the limit set by storing r* in one double.
 */
function tortoiseTerms(hole: KerrHole, x: number): { hi: number; lo: number; scale: number } {
  const { mass: M, a, rPlus, rMinus } = hole;
  const twoM = 2 * M;
  const b = horizonGap(M, a);
  // (x + b)/2M = 1 + (x − 2r−)/2M, since b = 2M − 2r−.
  const farLogFactor = Math.log1p((x - 2 * rMinus) / twoM);
  const horizonLogFactor = Math.log1p(b / x);
  const cPlus = (twoM * rPlus) / b;
  let hi = rPlus + x;
  let lo = twoSumError(rPlus, x, hi);
  const far = twoM * farLogFactor;
  [hi, lo] = addDoubleDouble(hi, lo, far, twoProductError(twoM, farLogFactor, far));
  const horizon = cPlus * horizonLogFactor;
  [hi, lo] = addDoubleDouble(hi, lo, -horizon, -twoProductError(cPlus, horizonLogFactor, horizon));
  return { hi, lo, scale: Math.max(rPlus + x, Math.abs(far), horizon) };
}

/** r+ − r− = 2√(M² − a²), formed without the cancellation in r+ − r− near extremality. */
function horizonGap(M: number, a: number): number {
  return 2 * Math.sqrt((M - a) * (M + a));
}

/** Rounding error of s = a + b (Knuth's TwoSum): a + b = s + error exactly. */
function twoSumError(a: number, b: number, s: number): number {
  const bVirtual = s - a;
  return a - (s - bVirtual) + (b - bVirtual);
}

const DEKKER_SPLITTER = 134217729; // 2^27 + 1

/** Rounding error of p = a·b (Dekker's TwoProduct): a·b = p + error exactly. */
function twoProductError(a: number, b: number, p: number): number {
  let t = DEKKER_SPLITTER * a;
  const aHi = t - (t - a);
  const aLo = a - aHi;
  t = DEKKER_SPLITTER * b;
  const bHi = t - (t - b);
  const bLo = b - bHi;
  const error = aHi * bHi - p + aHi * bLo + aLo * bHi + aLo * bLo;
  // Splitting overflows only for |a|, |b| near 1e300; the error term is then negligible anyway.
  return Number.isFinite(error) ? error : 0;
}

function addDoubleDouble(aHi: number, aLo: number, bHi: number, bLo: number): [number, number] {
  const s = aHi + bHi;
  const lo = twoSumError(aHi, bHi, s) + aLo + bLo;
  const hi = s + lo;
  return [hi, lo - (hi - s)];
}

/** Tortoise coordinate r*(r) for r > r+. */
export function tortoise(hole: KerrHole, r: number): number {
  requireKerrHole(hole);
  requireFinite('r', r);
  if (!(r > hole.rPlus)) throw new InputError('r', `r > r+ = ${hole.rPlus}`, r);
  return checkedTortoise(hole, r - hole.rPlus, 'r');
}

/** Derivative of r* with respect to r: (r² + a²)/Δ, for r outside the outer horizon. */
export function tortoiseDerivative(hole: KerrHole, r: number): number {
  requireKerrHole(hole);
  requireFinite('r', r);
  if (!(r > hole.rPlus)) throw new InputError('r', `r > r+ = ${hole.rPlus}`, r);
  const value = (r * r + hole.a * hole.a) / delta(hole, r);
  if (!Number.isFinite(value)) throw new InputError('r', 'a radius whose dr*/dr is a finite double', r);
  return value;
}

/** Result of inverting the tortoise coordinate, with its diagnostics. */
export interface TortoiseInversion {
  /** distance from the outer horizon x = r − r+ */
  horizonDistance: number;
  /** Boyer–Lindquist radius r = r+ + x */
  r: number;
  /** Newton iterations taken (0 when the near-horizon asymptote is already exact) */
  iterations: number;
  /** r*(x) − rStar at the returned point */
  residual: number;
  /** rounding-error floor of r*(x) at the returned point; |residual| is of this order */
  residualFloor: number;
}

const MAX_TORTOISE_ITERATIONS = 100;

/**
 * Inverse of the tortoise coordinate with diagnostics: the distance x = r − r+
 * at which r*(r) = rStar. Newton's method in u = ln x, where r* is smooth and
 * monotone (its u-derivative is (r² + a²)/(r − r−) > 0). Iteration stops when
 * the Newton step is at the rounding-error floor of r* itself, so the result is
 * as accurate as the forward map allows; if that does not happen the
 * iteration throws ConvergenceError.
 */
export function invertTortoise(hole: KerrHole, rStar: number): TortoiseInversion {
  requireKerrHole(hole);
  requireFinite('rStar', rStar);
  const { rPlus, rMinus, a } = hole;
  const twoM = 2 * hole.mass;
  const b = horizonGap(hole.mass, a);
  const cPlus = (twoM * rPlus) / b;
  const cMinus = (twoM * rMinus) / b;
  // Near-horizon asymptote r* ≈ r+ + cPlus ln(x/2M) − cMinus ln(b/2M); its
  // relative error in x is about x (1 + cMinus/b) / cPlus.
  const u = Math.log(twoM) + (rStar - rPlus + cMinus * Math.log(b / twoM)) / cPlus;
  if (Math.exp(u) * (1 + cMinus / b) < 1e-17 * cPlus) {
    // Asymptote exact to rounding; also covers x below the float range (x = 0, r = r+).
    const x = Math.exp(u);
    // x = 0 (below the float range) means r = r+ to machine precision
    const terms = x > 0 ? tortoiseTerms(hole, x) : { hi: rStar, lo: 0, scale: Math.abs(rStar) };
    return {
      horizonDistance: x,
      r: rPlus + x,
      iterations: 0,
      residual: terms.hi - rStar + terms.lo,
      residualFloor: 2 * Number.EPSILON * terms.scale,
    };
  }
  let x = u > Math.log(hole.mass) ? Math.max(rStar - rPlus, hole.mass) : Math.exp(u);
  const eps = Number.EPSILON;
  for (let iter = 1; iter <= MAX_TORTOISE_ITERATIONS; iter++) {
    const r = rPlus + x;
    const { hi, lo, scale } = tortoiseTerms(hole, x);
    // hi − rStar is exact near convergence (Sterbenz), so f keeps the low part.
    const f = hi - rStar + lo;
    // x times dr*/dr, with Δ = x (x + b)
    const dfdu = (r * r + a * a) / (x + b);
    // Rounding floor of f: the two logarithms' errors (≈ 1 ulp each), not the sum's.
    const floor = 2 * eps * scale;
    let step = f / dfdu;
    // Damp steps so ln x never jumps by more than 2 (keeps the far branch safe).
    if (step > 2) step = 2;
    if (step < -2) step = -2;
    // Update x multiplicatively rather than ln x: ln x carries only |ln x|·eps of relative precision.
    x *= Math.exp(-step);
    if (Math.abs(step) <= floor / dfdu + 2 * eps) {
      return {
        horizonDistance: x,
        r: rPlus + x,
        iterations: iter,
        residual: residualAt(hole, x, rStar),
        residualFloor: floor,
      };
    }
  }
  throw new ConvergenceError('tortoise inversion did not converge', {
    method: 'Newton iteration on r*(ln x)',
    steps: MAX_TORTOISE_ITERATIONS,
    rhsEvaluations: MAX_TORTOISE_ITERATIONS,
    errorEstimate: Infinity,
    message: `no convergence in ${MAX_TORTOISE_ITERATIONS} Newton steps`,
    rStar,
    a,
    mass: hole.mass,
    iterations: MAX_TORTOISE_ITERATIONS,
    lastHorizonDistance: x,
  });
}

function residualAt(hole: KerrHole, x: number, rStar: number): number {
  const { hi, lo } = tortoiseTerms(hole, x);
  return hi - rStar + lo;
}

/** Inverse of the tortoise coordinate: the distance x = r − r+ at which r*(r) = rStar. */
export function horizonDistanceFromTortoise(hole: KerrHole, rStar: number): number {
  return invertTortoise(hole, rStar).horizonDistance;
}

/** Inverse tortoise coordinate r(r*). */
export function radiusFromTortoise(hole: KerrHole, rStar: number): number {
  return invertTortoise(hole, rStar).r;
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

/** The near-region temperatures T_L, T_R (dimensionless) and central charges c_L = c_R = 12 J of a hole; an InputError at a = 0. */
export function nearRegion(hole: KerrHole): NearRegion {
  requireKerrHole(hole);
  if (hole.a === 0) throw new InputError('hole.a', 'a ≠ 0 (the near-region temperatures diverge at a = 0)', hole.a);
  const { rPlus, rMinus, a } = hole;
  const J = hole.angularMomentum;
  const n = {
    TL: (rPlus + rMinus) / (4 * Math.PI * a),
    TR: horizonGap(hole.mass, a) / (4 * Math.PI * a),
    cL: 12 * J,
    cR: 12 * J,
  };
  // a tiny a (subnormal, or |a/M| ≲ 1e-300) puts T_L, T_R or J outside the double range
  if (!Object.values(n).every((v) => Number.isFinite(v) && v !== 0))
    throw new InputError('hole.a', '|a| large enough that T_L, T_R and J are normal doubles', a);
  return n;
}

/** Cardy entropy (π²/3)(c_L T_L + c_R T_R); equals A/4 identically. */
export function cardyEntropy(n: NearRegion): number {
  if (typeof n !== 'object' || n === null) throw new InputError('n', 'the result of nearRegion ({TL, TR, cL, cR})', n);
  for (const key of ['TL', 'TR', 'cL', 'cR'] as const) requireFinite(`n.${key}`, n[key]);
  const s = ((Math.PI * Math.PI) / 3) * (n.cL * n.TL + n.cR * n.TR);
  if (!Number.isFinite(s)) throw new InputError('n', 'near-region values whose Cardy entropy is a finite double', n);
  return s;
}
