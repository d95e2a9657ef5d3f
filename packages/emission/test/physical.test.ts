import { describe, expect, test } from 'vitest';
import { CODATA2018, SOLAR_MASS_KG } from '@penumbra/kerr';
import { toPhysicalRates, toPhysicalSpectrum } from '@penumbra/emission';

describe('physical units (CODATA 2018 constants)', () => {
  test('power P̂/M² becomes P̂ ħc⁶/(G²M²) watts, the unit of Page (1976), to 1e-12', () => {
    const { G, hbar, c } = CODATA2018;
    const kg = 1e12; // 1e15 g
    const r = toPhysicalRates({ numberRate: 2, power: 3, torque: 5 }, 1e15, 'g');
    expect(Math.abs(r.powerWatts / ((3 * hbar * c ** 6) / (G * G * kg * kg)) - 1)).toBeLessThan(1e-12);
    expect(Math.abs(r.numberRatePerSecond / ((2 * c ** 3) / (G * kg)) - 1)).toBeLessThan(1e-12);
    expect(Math.abs(r.torqueJoules / ((5 * hbar * c ** 3) / (G * kg)) - 1)).toBeLessThan(1e-12);
    expect(Math.abs(r.powerGeVPerSecond / (r.powerWatts / (CODATA2018.eV * 1e9)) - 1)).toBeLessThan(1e-12);
  });
  test('a computation at geometric mass M gives the same physical rates as one at M = 1 (scaling 1/M, 1/M², 1/M)', () => {
    const a = toPhysicalRates({ numberRate: 2, power: 3, torque: 5 }, 1, 'msun');
    const b = toPhysicalRates({ numberRate: 2 / 7, power: 3 / 49, torque: 5 / 7 }, 1, 'msun', 7);
    expect(b.powerWatts / a.powerWatts).toBeCloseTo(1, 12);
    expect(b.numberRatePerSecond / a.numberRatePerSecond).toBeCloseTo(1, 12);
    expect(a.massKg).toBe(SOLAR_MASS_KG);
  });
  test('the Hawking temperature 1/(8πM) of a 1e15 g hole is ≈ 10.6 MeV (Page 1976: T ≈ 1.06e13 (1 g/M) GeV, value from memory) to 1e-2', () => {
    const s = toPhysicalSpectrum({ omega: 1 / (8 * Math.PI), number: 1 }, 1e15, 'g');
    expect(Math.abs(s.energyGeV / 1.06e-2 - 1)).toBeLessThan(1e-2);
  });
});
