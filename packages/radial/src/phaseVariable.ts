/**
 * The 'phase' variable u = e^{iφ} R, φ' = K/Δ: the phase of the ingoing
 * horizon solution (e^{−ikr*} near r+, e^{−iωr*} far away) removed. Its
 * equation is the radial equation after the substitution R = e^{−iφ} u
 * (docs/method.md, sections 1 and 7); the ingoing solution then does not carry the
 * e^{−ikr*} winding near the horizon. Measured, it is not cheaper in general
 * (the far-zone outgoing part then oscillates at 2ω), so it is kept as an
 * independent second formulation for cross-checks rather than as the default.
 */
import { tortoiseFromHorizonDistance, type KerrHole } from '@penumbra/kerr';
import { cpolyAt, scale } from './complexPoly.js';
import { substitutePhase, type RadialEquation, type RadialMode } from './equation.js';

/** The equation satisfied by u = e^{iφ}R, given the (unsubstituted) equation of R. */
export function phaseEquation(eq: RadialEquation): RadialEquation {
  return substitutePhase(eq, scale(eq.K, -1));
}

/** φ(r) = ∫K/Δ dr = ω r* − (am/(r+ − r−)) ln((r − r+)/(r − r−)). */
function phaseAt(hole: KerrHole, mode: RadialMode, r: number): number {
  const x = r - hole.rPlus;
  const b = hole.rPlus - hole.rMinus;
  return mode.omega * tortoiseFromHorizonDistance(hole, x) - ((hole.a * mode.m) / b) * Math.log(x / (x + b));
}

/**
 * (R, R') ↔ (u, u') in place, with u = e^{iφ}R, u' = e^{iφ}(R' + iK/Δ R);
 * direction −1 inverts. `eq` supplies K and Δ.
 */
export function convertPhase(
  hole: KerrHole,
  mode: RadialMode,
  eq: RadialEquation,
  r: number,
  y: Float64Array | number[],
  direction: 1 | -1,
): void {
  const phi = direction * phaseAt(hole, mode, r);
  const c = Math.cos(phi),
    sn = Math.sin(phi);
  const x = r - eq.center;
  const W = (direction * cpolyAt(eq.K, x)[0]) / cpolyAt(eq.delta, x)[0];
  if (direction === 1) {
    // u' = e^{iφ}(R' + iWR)
    const dRe = y[2] - W * y[1],
      dIm = y[3] + W * y[0];
    const uRe = c * y[0] - sn * y[1],
      uIm = sn * y[0] + c * y[1];
    y[2] = c * dRe - sn * dIm;
    y[3] = sn * dRe + c * dIm;
    y[0] = uRe;
    y[1] = uIm;
  } else {
    // R = e^{−iφ}u, R' = e^{−iφ}(u' − iWu); here W already carries the sign.
    const RRe = c * y[0] - sn * y[1],
      RIm = sn * y[0] + c * y[1];
    const dRe = c * y[2] - sn * y[3],
      dIm = sn * y[2] + c * y[3];
    y[0] = RRe;
    y[1] = RIm;
    y[2] = dRe - W * RIm;
    y[3] = dIm + W * RRe;
  }
}
