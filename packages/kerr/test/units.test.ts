import { describe, expect, test } from 'vitest';
import { CODATA2018, GM_SUN_IAU2015, kerrHole, massToKg, physicalBackground, SOLAR_MASS_KG, unitScales } from '@penumbra/kerr';

const relativeError = (value: number, reference: number) => Math.abs(value - reference) / Math.abs(reference);

describe('constants (CODATA 2018, Tiesinga et al., Rev. Mod. Phys. 93, 025010 (2021); IAU 2015 Resolution B3)', () => {
  test('exact SI constants c, h, k_B, e and the CODATA 2018 value of G are those published', () => {
    expect(CODATA2018.c).toBe(299792458);
    expect(CODATA2018.hbar * 2 * Math.PI).toBeCloseTo(6.62607015e-34, 49);
    expect(CODATA2018.kB).toBe(1.380649e-23);
    expect(CODATA2018.eV).toBe(1.602176634e-19);
    expect(CODATA2018.G).toBe(6.6743e-11);
    expect(GM_SUN_IAU2015).toBe(1.3271244e20);
  });

  test('solar mass GM_sun/G = 1.98841e30 kg to 1e-5 relative (IAU 2015 nominal GM_sun with CODATA 2018 G)', () => {
    expect(relativeError(SOLAR_MASS_KG, 1.98841e30)).toBeLessThan(1e-5);
    expect(massToKg(1, 'msun')).toBe(SOLAR_MASS_KG);
    expect(massToKg(1e15, 'g')).toBe(1e12);
    expect(massToKg(3, 'kg')).toBe(3);
  });
});

describe('physical units of the Hawking temperature and the horizon', () => {
  test('T_H of a one-solar-mass Schwarzschild hole ≈ 6.17e-8 K to 1e-3 relative (well-known figure)', () => {
    const sun = physicalBackground(kerrHole({ a: 0 }), 1, 'msun');
    expect(relativeError(sun.temperatureK, 6.17e-8)).toBeLessThan(1e-3);
  });

  test('a 1e15 g Schwarzschild hole has k_B T_H ≈ 10.6 MeV to 5e-3 relative (well-known figure)', () => {
    const hole = physicalBackground(kerrHole({ a: 0 }), 1e15, 'g');
    expect(relativeError(hole.temperatureGeV, 10.6e-3)).toBeLessThan(5e-3);
  });

  test('T_H = ħc³/(8πG M k_B) for a Schwarzschild hole to 1e-14 relative (Hawking, Commun. Math. Phys. 43, 199 (1975); constants typed in here, not read from units.ts)', () => {
    const hbar = 6.62607015e-34 / (2 * Math.PI);
    const c = 299792458;
    const G = 6.6743e-11;
    const kB = 1.380649e-23;
    for (const kg of [1e12, 1e3, 2e30, 7.3e22]) {
      const reference = (hbar * c ** 3) / (8 * Math.PI * G * kg * kB);
      expect(relativeError(physicalBackground(kerrHole({ a: 0 }), kg, 'kg').temperatureK, reference)).toBeLessThan(1e-14);
    }
  });

  test('Schwarzschild radius of the Sun 2GM_sun/c² ≈ 2.95 km and GM_sun/c³ ≈ 4.93 μs, both to 2e-3 relative (well-known figures)', () => {
    const sun = physicalBackground(kerrHole({ a: 0 }), 1, 'msun');
    expect(relativeError(sun.rPlusMetres, 2.95e3)).toBeLessThan(2e-3);
    expect(relativeError(sun.timeUnitSeconds, 4.93e-6)).toBeLessThan(2e-3);
    // and exactly from the IAU parameter, which fixes GM_sun independently of G
    expect(relativeError(sun.rPlusMetres, (2 * GM_SUN_IAU2015) / 299792458 ** 2)).toBeLessThan(1e-14);
  });

  test('Bekenstein–Hawking entropy of a solar-mass hole ≈ 1.05e77 k_B to 1e-2 relative (value from memory)', () => {
    const sun = physicalBackground(kerrHole({ a: 0 }), 1, 'msun');
    expect(relativeError(sun.entropyKB, 1.05e77)).toBeLessThan(1e-2);
  });

  test('a Kerr hole keeps its geometric ratios in physical units: T(a)/T(0), A(a)/A(0), Ω_H·GM/c³ match the geometric values to 1e-14 relative', () => {
    const kerr = kerrHole({ a: 0.9 });
    const schwarzschild = kerrHole({ a: 0 });
    const physicalKerr = physicalBackground(kerr, 5e14, 'g');
    const physicalSchwarzschild = physicalBackground(schwarzschild, 5e14, 'g');
    expect(
      relativeError(physicalKerr.temperatureK / physicalSchwarzschild.temperatureK, kerr.temperature / schwarzschild.temperature),
    ).toBeLessThan(1e-14);
    expect(
      relativeError(physicalKerr.areaSquareMetres / physicalSchwarzschild.areaSquareMetres, kerr.area / schwarzschild.area),
    ).toBeLessThan(1e-14);
    expect(relativeError(physicalKerr.omegaHPerSecond * physicalKerr.timeUnitSeconds, kerr.omegaH)).toBeLessThan(1e-14);
  });

  test('the geometric mass of the hole object does not matter: a = 1.8, M = 2 gives the same physical values as a = 0.9, M = 1 to 1e-14 relative', () => {
    const unit = physicalBackground(kerrHole({ a: 0.9, mass: 1 }), 1, 'msun');
    const scaled = physicalBackground(kerrHole({ a: 1.8, mass: 2 }), 1, 'msun');
    for (const key of Object.keys(unit) as (keyof typeof unit)[]) {
      expect(relativeError(scaled[key], unit[key]), key).toBeLessThan(1e-14);
    }
  });

  test('kelvin and GeV scales agree through k_B and e: T[GeV] = T[K]·k_B/(e·1e9) to 1e-15 relative (SI definitions)', () => {
    const scales = unitScales(1e12);
    expect(relativeError(scales.GeV, (scales.kelvin * 1.380649e-23) / (1.602176634e-19 * 1e9))).toBeLessThan(1e-15);
    expect(relativeError(scales.joule * scales.second, CODATA2018.hbar)).toBeLessThan(1e-15);
  });
});
