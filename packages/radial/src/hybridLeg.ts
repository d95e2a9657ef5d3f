/**
 * A leg crossed by Riccati steps where the solution oscillates (or grows and
 * decays) fast, and by the ODE integrator elsewhere (docs/method.md,
 * section 9). The leg is cut on a geometric ladder in x = r − r+ (each rung
 * doubles x, so the poles of the coefficients at r± are at least one rung
 * length away); a rung is given to a Riccati step when a cheap look at five
 * points says the WKB ratio is small and the rung holds enough phase to be
 * worth it, and a Riccati step that fails anyway falls back to the
 * integrator. Where no rung qualifies the leg is exactly `integrateLeg`'s,
 * so low-frequency modes are unchanged bit for bit.
 */
import type { RadialSample } from './solution.js';
import { LOCAL, LOCAL_SIZE, localRiccati, phaseRate, type RiccatiEquation, riccatiEquation, riccatiStep } from './riccatiStep.js';
import { integrateLeg, type Leg, type RawSample, type Segment } from './shooting.js';

/** How oscillatory stretches of a leg are crossed: Riccati steps where they apply ('riccati', default), or the ODE integrator throughout ('ode', the earlier route, kept for cross-checks). */
export type Oscillation = 'riccati' | 'ode';

/** Every accepted `oscillation`; the first is the default. */
export const OSCILLATIONS: readonly Oscillation[] = ['riccati', 'ode'];

/** Rung ratio of the ladder in x = r − r+. */
const RUNG = 2;
/** Largest WKB ratio (|p'| + |w'|)/|w|² on a rung given to a Riccati step. */
export const WKB_LIMIT = 0.08;
/** Least phase (or growth) ∫|w|/2 dx, in radians, on a rung given to a Riccati step: below it the integrator is as cheap. */
export const MIN_PHASE = 20;

const OVERFLOW = 1e150;
const RESCALE = 1e-300;
const LN_RESCALE = 300 * Math.LN10;

interface Point {
  x: number;
  r: number;
}

/**
 * Whether a Riccati step on [xa, xb] looks worth trying: at five points (in
 * u = ln x) the WKB ratio |Y₀'|/|W|² is below WKB_LIMIT, and the phase (or
 * growth) ∫|W|/2 du on the rung is above MIN_PHASE.
 */
const probe = new Float64Array(LOCAL_SIZE);

export function riccatiWorthIt(e: RiccatiEquation, xa: number, xb: number): boolean {
  const K = 5;
  const ua = Math.log(xa),
    du = (Math.log(xb) - ua) / (K - 1);
  let phase = 0,
    prev = 0;
  for (let j = 0; j < K; j++) {
    localRiccati(e, j === K - 1 ? xb : Math.exp(ua + j * du), probe);
    if (!(probe[LOCAL.RATIO] < WKB_LIMIT)) return false;
    const W = Math.sqrt(probe[LOCAL.W] ** 2 + probe[LOCAL.W + 1] ** 2);
    if (j > 0) phase += 0.25 * (W + prev) * du;
    prev = W;
  }
  return phase > MIN_PHASE;
}

/** Integrate one leg, by Riccati steps where they apply (see above) or entirely by `integrateLeg` ('ode'). */
export function integrateHybridLeg(leg: Leg, oscillation: Oscillation): Segment {
  if (oscillation === 'ode' || leg.variable === 'phase') return integrateLeg(leg);
  const { hole } = leg;
  const rPlus = hole.rPlus;
  const e = riccatiEquation(leg.equation, rPlus);
  const ladder: Point[] = [{ x: leg.fromOffset ?? leg.from - rPlus, r: leg.from }];
  const xEnd = leg.to - rPlus;
  const inside = leg.stops.filter((g) => g > leg.from && g < leg.to);
  let k = 0;
  for (;;) {
    const last = ladder[ladder.length - 1];
    let next: Point = last.x * RUNG >= xEnd ? { x: xEnd, r: leg.to } : { x: last.x * RUNG, r: rPlus + last.x * RUNG };
    while (k < inside.length && inside[k] <= last.r) k++;
    if (k < inside.length && inside[k] < next.r) next = { x: inside[k] - rPlus, r: inside[k] };
    if (!(next.x > last.x)) break;
    ladder.push(next);
    if (next.r === leg.to) break;
  }
  // A cheap look first (the rate at the rung ends): most low-frequency legs stop here.
  const rates = ladder.map((p) => phaseRate(e, p.x));
  const good = ladder
    .slice(1)
    .map((p, i) => 0.25 * (rates[i] + rates[i + 1]) * Math.log(p.x / ladder[i].x) > 0.5 * MIN_PHASE && riccatiWorthIt(e, ladder[i].x, p.x));
  if ((globalThis as any).process?.env?.HDBG) (globalThis as any).console.log('leg s', leg.mode.s, leg.from, leg.to, good.join(','));
  if (!good.includes(true)) return integrateLeg(leg);

  const y = leg.y;
  let logScale = leg.logScale ?? 0;
  let steps = 0,
    rescalings = 0;
  const samples: RadialSample[] = [];
  const raw: RawSample[] = [];
  const scale = new Float64Array(1);
  const byOde = (from: Point, to: Point) => {
    const seg = integrateLeg({
      ...leg,
      from: from.r,
      fromOffset: from.x,
      to: to.r,
      logScale,
      maxSteps: Math.max(leg.maxSteps - steps, 1),
    });
    if ((globalThis as any).process?.env?.HDBG) (globalThis as any).console.log('  ode', from.x.toPrecision(4), to.x.toPrecision(4), seg.steps);
    steps += seg.steps;
    rescalings += seg.rescalings;
    logScale = seg.logScale;
    samples.push(...seg.samples);
    raw.push(...seg.raw);
  };
  let i = 0;
  while (i < good.length) {
    if (!good[i]) {
      let j = i;
      while (j < good.length && !good[j]) j++;
      byOde(ladder[i], ladder[j]);
      i = j;
      continue;
    }
    const from = ladder[i],
      to = ladder[i + 1];
    const step = riccatiStep(e, from.x, to.x, y, leg.tol, scale);
    leg.counter.evaluations += step.evaluations * (1 + step.passes);
    if ((globalThis as any).process?.env?.HDBG) (globalThis as any).console.log('  ric', from.x.toPrecision(4), to.x.toPrecision(4), step.ok, step.passes);
    if (!step.ok) {
      byOde(from, to);
      i++;
      continue;
    }
    steps++;
    logScale += scale[0];
    if (Math.abs(y[0]) + Math.abs(y[1]) > OVERFLOW) {
      for (let c = 0; c < 4; c++) y[c] *= RESCALE;
      logScale += LN_RESCALE;
      rescalings++;
    }
    if (leg.stops.includes(to.r)) {
      const f = Math.exp(logScale);
      samples.push({ r: to.r, R: { re: y[0] * f, im: y[1] * f }, dR: { re: y[2] * f, im: y[3] * f } });
      raw.push({ r: to.r, y: Array.from(y), logScale });
    }
    i++;
  }
  return { logScale, steps, rescalings, samples, raw };
}
