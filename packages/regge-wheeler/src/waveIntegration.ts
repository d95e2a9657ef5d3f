/**
 * The Cash–Karp march of a real-potential wave y = (Re ψ, Im ψ, Re P, Im P),
 * P = dψ/dr*, from r0 to the matching radius: shared by the massless and the
 * massive scalar integrations, which differ only in their right-hand side.
 */
import createIntegrator from 'ode45-cash-karp';

/** Renormalise the state past this size; the equation is linear, so the factor is tracked exactly in logRescale. */
const RESCALE = 1e100;

/** What a march did: its steps and the log of the factor the state was divided by. */
export interface WaveMarch {
  steps: number;
  logRescale: number;
}

/**
 * March y in place from r0 to matchRadius (first step firstStep) at the given
 * step tolerance. `fail(message, detail, steps)` makes the error thrown on a
 * non-finite state or when more than maxSteps steps are taken.
 */
export function marchWave(
  y: Float64Array,
  deriv: (dydr: Float64Array, s: Float64Array, r: number) => void,
  span: { r0: number; firstStep: number; matchRadius: number },
  stepTolerance: number,
  maxSteps: number,
  fail: (message: string, detail: string, steps: number) => Error,
): WaveMarch {
  // Error measured against the complex moduli |ψ| and |P| (plus the step's
  // own change), so that a zero of Re ψ or Im ψ does not force tiny steps.
  const errorScale = (i: number, dt: number, _yi: number, dydt: number): number =>
    (i < 2 ? Math.hypot(y[0], y[1]) : Math.hypot(y[2], y[3])) + Math.abs(dt * dydt) + 1e-300;
  const integrator = createIntegrator(y, deriv, span.r0, span.firstStep, {
    tol: stepTolerance,
    verbose: false,
    errorScaleFunction: errorScale,
  });
  let steps = 0;
  let logRescale = 0;
  for (let more = true; more; ) {
    more = integrator.step(span.matchRadius);
    steps++;
    const size = Math.abs(y[0]) + Math.abs(y[1]) + Math.abs(y[2]) + Math.abs(y[3]);
    if (!Number.isFinite(size))
      throw fail('integration produced a non-finite state', `non-finite state after ${steps} steps`, steps);
    if (size > RESCALE) {
      for (let i = 0; i < 4; i++) y[i] /= RESCALE;
      logRescale += Math.log(RESCALE);
    }
    if (steps > maxSteps) throw fail('integration step budget exhausted', `more than ${maxSteps} steps`, steps);
  }
  return { steps, logRescale };
}
