/**
 * Honest error estimates at tight tolerances: against the 40–50 digit mpmath
 * fixture (test/fixtures/greybody/reference.json, an independent Python
 * calculation; see its README) and against tighter solves. The full sweep
 * (649 rows at tol 1e-12, the s = 2 superradiant band) is bench/honesty.bench.mjs;
 * here are the rows where the old estimate (two solves at the same radii,
 * plus 1e-15) was furthest below the true error, and the refusal contract.
 */
import { readFileSync } from 'node:fs';
import { InputError } from '@penumbra/core';
import { greybody, tryGreybody } from '@penumbra/flux';
import { kerrHole } from '@penumbra/kerr';
import { describe, expect, it } from 'vitest';

interface Row {
  spin: number;
  l: number;
  m: number | null;
  a: number;
  omega: number;
  gamma: number;
  superradiant?: boolean;
}
const fixture = JSON.parse(readFileSync(new URL('../../../test/fixtures/greybody/reference.json', import.meta.url), 'utf8')) as {
  kerr: { rows: Row[] };
  schwarzschild: { rows: Row[] };
};
const rows = [...fixture.kerr.rows, ...fixture.schwarzschild.rows];
const problemOf = (r: Row) => ({
  hole: { a: r.a },
  mode: { field: { spin: r.spin as 0 }, l: r.l, m: r.m ?? (r.spin === 0.5 ? 0.5 : 0) },
  omega: r.omega,
});
function row(spin: number, l: number, m: number | null, a: number, omega: number): Row {
  const found = rows.find((r) => r.spin === spin && r.l === l && r.m === m && r.a === a && r.omega === omega);
  if (!found) throw new Error(`no fixture row s=${spin} l=${l} m=${m} a=${a} Mω=${omega}`);
  return found;
}

// Old estimate / true error at tol 1e-12 in brackets (bench/honesty.bench.mjs before the change).
const WORST_BEFORE: Row[] = [
  row(0, 1, 0, 0.99, 2), // 1.3e-15 / 5.8e-14 (43×)
  row(0.5, 0.5, 0.5, 0, 1), // 1.9e-15 / 7.9e-14 (42×)
  row(2, 5, null, 0, 0.5), // 1.0e-15 / 3.5e-14 (35×)
  row(0.5, 1.5, 0.5, 0.999, 1), // 3.7e-15 / 1.1e-13 (31×)
  row(0.5, 1.5, 0.5, 0.999, 2), // 1.7e-13 / 1.1e-12: missed the tolerance, Γ > 1
  row(2, 2, -2, 0.999, 2), // 1.4e-13 / 8.4e-13, Γ > 1
  row(2, 2, -2, 0.999, 0.3),
  row(1, 5, null, 0, 1),
];

describe('greybody error estimates at tight tolerances', () => {
  it('at tol 1e-12, on the rows where the old estimate was furthest below the true error, relError ≥ |Γ/Γ_mpmath − 1| and ≤ 1e-12 (or tol is refused naming tol; at least 5 of the 8 are met), and Γ ≤ 1 + relError', () => {
    let solved = 0;
    for (const r of WORST_BEFORE) {
      const out = tryGreybody(problemOf(r), { tol: 1e-12 });
      if (out.status === 'invalid-input') {
        expect(out.error.parameter).toBe('tol');
        continue;
      }
      solved++;
      expect(out.status).toBe('success');
      if (out.status !== 'success') continue;
      const { gamma, relError } = out.solution;
      expect(Math.abs(gamma / r.gamma - 1)).toBeLessThanOrEqual(relError);
      expect(relError).toBeLessThanOrEqual(1e-12);
      expect(gamma).toBeLessThanOrEqual(1 + relError * Math.abs(gamma));
    }
    expect(solved).toBeGreaterThanOrEqual(5);
  });

  it('at tol 1e-10 and 1e-8, every 12th fixture row (55 rows, all spins, a = 0 … 0.999) has relError ≥ its true error against mpmath and ≤ tol', () => {
    for (const tol of [1e-10, 1e-8]) {
      rows.forEach((r, i) => {
        if (i % 12 !== 0) return;
        const { gamma, relError } = greybody(problemOf(r), { tol });
        expect(Math.abs(gamma / r.gamma - 1)).toBeLessThanOrEqual(relError);
        expect(relError).toBeLessThanOrEqual(tol);
      });
    }
  });

  it('an estimate also sees a poor start point: with startFraction 0.2 at s = 2, l = 2, m = −2, a = 0.999, Mω = 2 (Γ was 1 + 1.65e-11 with relError 1.8e-13), relError ≥ the true error at tol 1e-8', () => {
    const r = row(2, 2, -2, 0.999, 2);
    const { gamma, relError } = greybody(problemOf(r), { tol: 1e-8, startFraction: 0.2 });
    expect(Math.abs(gamma / r.gamma - 1)).toBeLessThanOrEqual(relError);
    expect(gamma).toBeLessThanOrEqual(1 + relError);
  });

  it('across the s = 2, l = m = 2 superradiant band at a = 0.999 (9 points up to 0.99 of 2Ω_H; at 0.975 the amplification −Γ exceeds 1), tol 1e-10 converges and relError ≥ the difference from a tol 1e-11 solve', () => {
    const top = 2 * kerrHole({ a: 0.999 }).omegaH;
    for (const f of [0.1, 0.3, 0.5, 0.7, 0.85, 0.9, 0.95, 0.975, 0.99]) {
      const problem = { hole: { a: 0.999 }, mode: { field: { spin: 2 as const }, l: 2, m: 2 }, omega: f * top };
      const coarse = greybody(problem, { tol: 1e-10 });
      const fine = greybody(problem, { tol: 1e-11 });
      expect(coarse.superradiant).toBe(true);
      expect(Math.abs(coarse.gamma / fine.gamma - 1)).toBeLessThanOrEqual(coarse.relError + fine.relError);
      expect(coarse.relError).toBeLessThanOrEqual(1e-10);
      if (f === 0.975) expect(coarse.amplification).toBeGreaterThan(1);
    }
  });

  // (at Mω = 2 the horizon series summed with the throat factor now meets tol 1e-12: Γ − 1 = 2e-14 where the plain series gave 1.5e-12)
  it('refuses tol 1e-12 where double rounding rules it out (s = 2, l = m = 2, a = 0.9999, Mω = 3) with an InputError naming tol and the tightest tolerance, and that tolerance is then met', () => {
    const problem = { hole: { a: 0.9999 }, mode: { field: { spin: 2 as const }, l: 2, m: 2 }, omega: 3 };
    let caught: unknown;
    try {
      greybody(problem, { tol: 1e-12 });
    } catch (e) {
      caught = e;
    }
    expect(caught).toBeInstanceOf(InputError);
    const error = caught as InputError;
    expect(error.parameter).toBe('tol');
    expect(error.message).toMatch(/double rounding/);
    const tightest = Number(/tol ≥ ([0-9.e+-]+)/.exec(error.allowed)?.[1]);
    expect(tightest).toBeGreaterThan(1e-12);
    expect(tightest).toBeLessThan(1e-11);
    expect(greybody(problem, { tol: tightest }).relError).toBeLessThanOrEqual(tightest);
  });
});
