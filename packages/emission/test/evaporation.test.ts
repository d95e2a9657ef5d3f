/**
 * The evaporation history in physical units (evaporation.ts) with massless
 * content: it must reproduce the scale-free history of evolveHole, Page's
 * lifetime, and conserve energy; scalar-only emission drives a* to its
 * attractor. Massive content: massive-evaporation.test.ts.
 */
import { describe, expect, test } from 'vitest';
import { ConvergenceError, InputError } from '@penumbra/core';
import {
  AGE_OF_UNIVERSE_SECONDS,
  KNOWN_SPECIES,
  PAGE_1976_CONTENT,
  bundledPageTable,
  burstSpectrum,
  evaporateHole,
  evolutionTimeUnitSeconds,
  evolveHole,
  massForLifetime,
  massLossRates,
  pageFunctions,
} from '@penumbra/emission';

const massless = (names: readonly string[]) => names.map((n) => ({ ...KNOWN_SPECIES[n], massGeV: 0 }));
const pageRates = massLossRates({ species: massless(PAGE_1976_CONTENT) });

describe('evaporation of a hole emitting massless species', () => {
  test('f(M, a*) is independent of M and equals pageFunctions f(a*) to 1e-12 for massless species', () => {
    const fns = pageFunctions({ table: bundledPageTable(), content: PAGE_1976_CONTENT });
    for (const m of [1e-3, 1e9, 1e15, 1e40])
      for (const a of [0, 0.3, 0.9]) {
        expect(Math.abs(pageRates.f(m, a) / fns.f(a) - 1)).toBeLessThan(1e-12);
        expect(Math.abs(pageRates.g(m, a) / fns.g(a) - 1)).toBeLessThan(1e-12);
      }
    // f = 2.0114e-4 for photons, gravitons and two neutrino species (Page, Phys. Rev. D 13, 198 (1976)) to 1e-3
    expect(Math.abs(pageRates.f(1e15, 0) / 2.0114e-4 - 1)).toBeLessThan(1e-3);
  });

  test('lifetime of a non-rotating hole ≈ 8.66e-27 (M/1 g)³ s (Page, Phys. Rev. D 13, 198 (1976), value from memory) to 2e-3, and equal to evolveHole to 1e-7', () => {
    const ev = evaporateHole({ rates: pageRates, mass: 1e15, unit: 'g', aStar0: 0 });
    expect(Math.abs(ev.lifetimeSeconds / (8.66e-27 * 1e45) - 1)).toBeLessThan(2e-3);
    const fns = pageFunctions({ table: bundledPageTable(), content: PAGE_1976_CONTENT });
    const spun = evaporateHole({ rates: pageRates, mass: 1e15, unit: 'g', aStar0: 0.7 });
    const old = evolveHole({ functions: fns, aStar0: 0.7 });
    expect(Math.abs(spun.lifetimeSeconds / (old.lifetime * evolutionTimeUnitSeconds(1e15, 'g')) - 1)).toBeLessThan(1e-7);
  });

  test('energy conservation: the energy carried away by all species equals M₀c² to 1e-9, and each final stage’s species energies add up to its energy to 1e-9', () => {
    const ev = evaporateHole({ rates: pageRates, mass: 2e14, unit: 'g', aStar0: 0.8 }, { finalSeconds: [1, 1e10, 1e30] });
    expect(ev.energyBalance.relError).toBeLessThan(1e-9);
    const sum = ev.species.reduce((s, x) => s + x.energyGeV, 0);
    expect(Math.abs(sum / ev.energyBalance.massLostGeV - 1)).toBeLessThan(1e-9);
    for (const st of ev.finalStages) {
      const e = st.species.reduce((s, x) => s + x.energyGeV, 0);
      expect(Math.abs(e / st.energyGeV - 1)).toBeLessThan(1e-9);
    }
    expect(ev.finalStages[2].wholeLife).toBe(true);
    expect(ev.finalStages[2].massGrams).toBeCloseTo(2e14, -3);
  });

  test('the last τ seconds start at the mass whose own lifetime is τ: M_τ³ · (lifetime per M³) = τ to 1e-6 (τ = 1 s and 1e10 s)', () => {
    const ev = evaporateHole({ rates: pageRates, mass: 1e15, unit: 'g', aStar0: 0.5 }, { finalSeconds: [1, 1e10] });
    const perCube = evaporateHole({ rates: pageRates, mass: 1, unit: 'g', aStar0: 0 }).lifetimeSeconds;
    for (const st of ev.finalStages) {
      expect(st.aStar).toBeLessThan(1e-6);
      expect(Math.abs((perCube * st.massGrams ** 3) / st.seconds - 1)).toBeLessThan(1e-6);
    }
  });

  test('spin-down: a* falls faster than M along the whole track (a*/a*₀ < M/M₀ after the start), photons + gravitons + 3 neutrinos', () => {
    const ev = evaporateHole({
      rates: massLossRates({ species: massless(['photon', 'graviton', 'neutrino-e', 'neutrino-mu', 'neutrino-tau']) }),
      mass: 1e16,
      unit: 'g',
      aStar0: 0.9,
    });
    for (const p of ev.track.slice(1)) expect(p.aStar / 0.9).toBeLessThan(p.massGrams / 1e16);
    // T_H rises as M falls
    for (let i = 1; i < ev.track.length; i++) expect(ev.track[i].temperatureGeV).toBeGreaterThan(ev.track[i - 1].temperatureGeV);
  });

  test('a hole emitting only a massless scalar spins toward a* ≈ 0.555 from above and below (Chambers, Hiscock & Taylor, Phys. Rev. Lett. 78, 3249 (1997), value from memory) to 0.01', () => {
    const rates = massLossRates({ species: massless(['scalar']) });
    for (const a0 of [0.99, 0.2]) {
      const ev = evaporateHole({ rates, mass: 1e10, unit: 'g', aStar0: a0 });
      const end = ev.track[ev.track.length - 1].aStar;
      expect(Math.abs(end - 0.555)).toBeLessThan(0.01);
    }
  });

  test('tol: a lifetime within it is returned unchanged; one whose error estimate exceeds it throws ConvergenceError with the diagnostics; a tol outside 1e-12 … 1e-2 (the core range) is an InputError naming tol', () => {
    const problem = { rates: pageRates, mass: 1e15, unit: 'g' as const, aStar0: 0.5 };
    const free = evaporateHole(problem, { finalSeconds: [] });
    const checked = evaporateHole(problem, { finalSeconds: [], tol: 1e-2 });
    expect(checked.lifetimeSeconds).toBe(free.lifetimeSeconds);
    expect(free.diagnostics.errorEstimate).toBeGreaterThan(1e-6);
    try {
      evaporateHole(problem, { finalSeconds: [], tol: 1e-6 });
      expect.unreachable();
    } catch (e) {
      expect(e).toBeInstanceOf(ConvergenceError);
      expect((e as ConvergenceError).diagnostics.errorEstimate).toBe(free.diagnostics.errorEstimate);
    }
    for (const tol of [0, 1e-13, 0.05, 0.5, Number.NaN, '1e-3'])
      try {
        evaporateHole(problem, { tol } as never);
        expect.unreachable();
      } catch (e) {
        expect(e).toBeInstanceOf(InputError);
        expect((e as InputError).parameter).toBe('tol');
      }
  });

  test('massForLifetime: the lifetime of the mass found is the age of the universe to 1e-6, and the mass is (age / (lifetime per g³))^(1/3) to 1e-6 for massless content', () => {
    const r = massForLifetime({ rates: pageRates });
    expect(Math.abs(r.lifetimeSeconds / AGE_OF_UNIVERSE_SECONDS - 1)).toBeLessThan(1e-6);
    const perCube = evaporateHole({ rates: pageRates, mass: 1, unit: 'g', aStar0: 0 }).lifetimeSeconds;
    expect(Math.abs(r.massGrams / Math.cbrt(AGE_OF_UNIVERSE_SECONDS / perCube) - 1)).toBeLessThan(1e-6);
    // 13.787 Gyr (Planck 2018 results VI, A&A 641, A6 (2020)) in Julian years
    expect(AGE_OF_UNIVERSE_SECONDS).toBeCloseTo(4.3508e17, -13);
  });

  test('burst spectrum of the last second: ∫ E dN/dE dE of each species equals the energy it carries in that stage to 5e-3 (photons, neutrinos; a* = 0)', () => {
    const rates = massLossRates({ species: massless(['photon', 'neutrino-e']) });
    const stage = evaporateHole({ rates, mass: 1e15, unit: 'g', aStar0: 0 }, { finalSeconds: [1] }).finalStages[0];
    const n = 160;
    const E = Array.from({ length: n }, (_, i) => stage.temperatureGeV * 1e-3 * 1e7 ** (i / (n - 1)));
    const b = burstSpectrum({ rates, stage, energiesGeV: E });
    expect(b.diagnostics.approximation).toMatch(/a\* held/);
    for (const [k, sp] of b.species.entries()) {
      let s = 0;
      for (let i = 1; i < n; i++)
        s += 0.5 * (E[i] ** 2 * sp.perGeV[i] + E[i - 1] ** 2 * sp.perGeV[i - 1]) * Math.log(E[i] / E[i - 1]);
      expect(Math.abs(s / stage.species[k].energyGeV - 1)).toBeLessThan(5e-3);
    }
    // the total is the sum over species
    for (let i = 0; i < n; i += 20) expect(b.totalPerGeV[i]).toBeCloseTo(b.species[0].perGeV[i] + b.species[1].perGeV[i], 6);
  });
});
