/**
 * radialFunction for a massive vector (Proca) at a = 0. Checks:
 * - the conserved current j^μ = Im(Ā_ν F^{νμ}) of the Proca field (its
 *   divergence vanishes by the field equations ∇_μF^{μν} = μ²A^ν) gives the
 *   same flux through every sphere, here evaluated from the field at each
 *   radius with h0 from the Lorenz condition, and equal to the horizon value
 *   c_H†Hc_H of docs/massive-vector.md §2;
 * - that flux over the incident flux at infinity is the Γ greybody reports;
 * - as Mμ → 0 the odd mode tends to the electromagnetic Regge–Wheeler solution
 *   (V = f l(l+1)/r², Regge & Wheeler, Phys. Rev. 108, 1063 (1957); for s = 1
 *   Chandrasekhar, The Mathematical Theory of Black Holes (1983), §31),
 *   integrated here by the general-purpose ode45-cash-karp from its own
 *   two-term Frobenius start, with a difference of order (Mμ)².
 */
import createIntegrator from 'ode45-cash-karp';
import { describe, expect, it } from 'vitest';
import { InputError } from '@penumbra/core';
import { greybody, radialFunction } from '@penumbra/flux';

type Pol = 'odd' | 'even-1' | 'even-2' | 'monopole';
const problem = (mu: number, l: number, omega: number, mass = 1) => ({
  hole: { a: 0, mass },
  mode: { field: { spin: 1 as const, mass: mu }, l, m: 0 },
  omega,
});
const proca = (mu: number, l: number, omega: number, polarization: Pol, radii: number[], mass = 1) => {
  const rf = radialFunction(problem(mu, l, omega, mass), radii, { tol: 1e-10, polarization });
  if (!('polarization' in rf)) throw new Error('expected the Proca solution');
  return rf;
};
// near the horizon, the integration zone, and past the matching radius (about 80M here)
const RADII = [2.0001, 2.05, 2.5, 3, 5, 10, 30, 150, 400];
const CASES: Array<[Pol, number, number, number]> = [
  ['odd', 1, 0.1, 0.3],
  ['even-1', 1, 0.1, 0.3],
  ['even-2', 1, 0.1, 0.3],
  ['even-2', 2, 0.5, 0.55],
  ['monopole', 0, 0.1, 0.3],
];

describe('radialFunction for a massive vector (spin 1, mass > 0) at a = 0', () => {
  it.each(CASES)(
    '%s l = %i, Mμ = %f, Mω = %f: the flux is the same at every radius, and equals c_H†Hc_H, to 1e-9',
    (pol, l, mu, omega) => {
      const rf = proca(mu, l, omega, pol, RADII);
      expect(rf.samples.map((s) => s.r)).toEqual(RADII);
      for (const s of rf.samples) expect(Math.abs(s.flux / rf.horizonFlux - 1)).toBeLessThan(1e-9);
    },
  );

  it.each(CASES)(
    '%s l = %i, Mμ = %f, Mω = %f: flux / incident flux is the greybody Γ, and Γ + R = 1, to 1e-9',
    (pol, l, mu, omega) => {
      const rf = proca(mu, l, omega, pol, [3, 10]);
      const g = greybody(problem(mu, l, omega), { tol: 1e-10, polarization: pol });
      expect(Math.abs(rf.gamma / g.gamma - 1)).toBeLessThan(1e-9);
      expect(Math.abs(rf.samples[1].flux / rf.incomingFlux / g.gamma - 1)).toBeLessThan(1e-9);
      expect(Math.abs(rf.gamma + rf.reflection - 1)).toBeLessThan(1e-9);
      expect(rf.relError).toBeLessThanOrEqual(1e-10);
    },
  );

  it('is normalised at the horizon: u e^{iωr*} → c_H (|c_H| = 1; c_H = 1 for the odd mode) within 1e-3 at r − 2M = 1e-4', () => {
    const r = 2.0001;
    const rs = r + 2 * Math.log(r / 2 - 1);
    for (const pol of ['odd', 'even-1', 'even-2'] as const) {
      const rf = proca(0.1, 1, 0.3, pol, [r]);
      const c = rf.horizonAmplitude;
      expect(Math.abs(Math.hypot(...c.map((z) => Math.hypot(z.re, z.im))) - 1)).toBeLessThan(1e-15);
      rf.samples[0].u.forEach((z, i) => {
        const re = z.re * Math.cos(0.3 * rs) - z.im * Math.sin(0.3 * rs);
        const im = z.im * Math.cos(0.3 * rs) + z.re * Math.sin(0.3 * rs);
        expect(Math.hypot(re - c[i].re, im - c[i].im)).toBeLessThan(1e-3);
      });
    }
    expect(proca(0.1, 1, 0.3, 'odd', [3]).horizonAmplitude).toEqual([{ re: 1, im: 0 }]);
  });

  it('takes the hole mass as the unit: M = 2 at ω/2, 2r (same Mω, Mμ) gives the same u and half du/dr', () => {
    const one = proca(0.1, 1, 0.3, 'even-1', [3, 10]);
    const two = proca(0.1, 1, 0.15, 'even-1', [6, 20], 2);
    one.samples.forEach((s, n) => {
      const t = two.samples[n];
      expect(Math.hypot(t.u[1].re - s.u[1].re, t.u[1].im - s.u[1].im) / Math.hypot(s.u[1].re, s.u[1].im)).toBeLessThan(1e-12);
      expect(Math.abs(2 * t.dudr[0].re - s.dudr[0].re)).toBeLessThan(1e-12 * Math.hypot(s.dudr[0].re, s.dudr[0].im));
    });
  });

  it('odd mode as Mμ → 0: tends to the electromagnetic Regge–Wheeler solution as (Mμ)² (difference ratio 4 ± 0.1 (measured 4.0003) from Mμ = 2e-3 to 1e-3, below 1e-4)', () => {
    const l = 2;
    const omega = 0.4;
    const L = l * (l + 1);
    const radii = [2.5, 4, 8, 20];
    // ψ = e^{−iωr*}(1 + a1 (r − 2)), a1 = L / (2 − 8iω), from (f h′)′ − 2iω h′ − (L/r²) h = 0 at r = 2
    const x0 = 1e-5;
    const r0 = 2 + x0;
    const den = 4 + 64 * omega * omega;
    const a1: [number, number] = [(2 * L) / den, (8 * omega * L) / den];
    const rs0 = r0 + 2 * Math.log(r0 / 2 - 1);
    const [c, s] = [Math.cos(-omega * rs0), Math.sin(-omega * rs0)];
    const h: [number, number] = [1 + a1[0] * x0, a1[1] * x0];
    const psi: [number, number] = [c * h[0] - s * h[1], c * h[1] + s * h[0]];
    // dψ/dr* = e^{−iωr*}(−iω h + f a1), f = x0 / r0
    const f0 = x0 / r0;
    const dh: [number, number] = [omega * h[1] + f0 * a1[0], -omega * h[0] + f0 * a1[1]];
    const y = new Float64Array([psi[0], psi[1], c * dh[0] - s * dh[1], c * dh[1] + s * dh[0]]);
    const deriv = (d: Float64Array, v: Float64Array, r: number) => {
      const f = 1 - 2 / r;
      const k = L / (r * r) - (omega * omega) / f;
      d[0] = v[2] / f;
      d[1] = v[3] / f;
      d[2] = k * v[0];
      d[3] = k * v[1];
    };
    const ode = createIntegrator(y, deriv, r0, 1e-7, { tol: 1e-13, dtMaxMag: 0.05 });
    const reference = radii.map((r) => {
      while (ode.step(r)) {
        /* to r */
      }
      return [ode.y[0], ode.y[1]];
    });
    const difference = (mu: number) => {
      const rf = proca(mu, l, omega, 'odd', radii);
      return Math.max(
        ...rf.samples.map((smp, n) => {
          const [re, im] = reference[n];
          return Math.hypot(smp.u[0].re - re, smp.u[0].im - im) / Math.hypot(re, im);
        }),
      );
    };
    const d1 = difference(1e-3);
    const d2 = difference(2e-3);
    expect(d1).toBeLessThan(1e-4);
    expect(d2 / d1).toBeGreaterThan(3.9);
    expect(d2 / d1).toBeLessThan(4.1);
  });

  it('refuses a ≠ 0 naming hole.a, the Cash–Karp integrator naming integrator, and a radius inside the horizon naming it', () => {
    const kerr = { ...problem(0.1, 1, 0.3), hole: { a: 0.3 } };
    expect(() => radialFunction(kerr, [3])).toThrow(InputError);
    expect(() => radialFunction(kerr, [3])).toThrow(/hole\.a/);
    expect(() => radialFunction(problem(0.1, 1, 0.3), [3], { integrator: 'cash-karp' })).toThrow(/integrator/);
    expect(() => radialFunction(problem(0.1, 1, 0.3), [3, 1.9])).toThrow(/radii\[1\]/);
    expect(() => radialFunction(problem(0.3, 1, 0.3), [3])).toThrow(/omega/);
  });

  it('a polarisation for a massless field is refused, naming polarization', () => {
    const photon = { hole: { a: 0 }, mode: { field: { spin: 1 as const }, l: 1, m: 0 }, omega: 0.3 };
    expect(() => radialFunction(photon, [3], { polarization: 'odd' })).toThrow(/polarization/);
  });
});
