import { readFileSync } from 'node:fs';
import { describe, expect, test } from 'vitest';
import { emissionTotals } from '@penumbra/emission';

// Reference totals at tol 1e-9 (fixtures/make-totals-reference.mjs): checking looser runs against
// tighter solves of the same sums is an internal consistency check (common practice, no source).
const reference = JSON.parse(readFileSync(new URL('./fixtures/totals-reference.json', import.meta.url), 'utf8')) as {
  rows: { a: number; spin: 0 | 0.5 | 1 | 2; [k: string]: unknown }[];
};
const KEYS = ['numberRate', 'power', 'torque'] as const;

function trueOverReported(a: number, spin: 0 | 0.5 | 1 | 2, tol: number): number[] {
  const ref = reference.rows.find((r) => r.a === a && r.spin === spin)!;
  const r = emissionTotals({ hole: { a }, field: { spin } }, { tol });
  return KEYS.map((k) => {
    const cell = ref[k] as { value: string; absError: string };
    // the reference's own error counts against the check
    const off = Math.abs(r[k].value - Number(cell.value)) - Number(cell.absError);
    return off / r[k].absError;
  });
}

describe('reported errors of emission totals against tighter solves (tol 1e-9 reference)', () => {
  test('at tol 1e-3, a = 0.5 and 0.9, all four spins: every total (number rate, power, torque) lies within its reported absolute error of the reference', () => {
    for (const a of [0.5, 0.9])
      for (const spin of [0, 0.5, 1, 2] as const)
        for (const ratio of trueOverReported(a, spin, 1e-3)) expect(ratio).toBeLessThanOrEqual(1);
  });
  test('at tol 1e-5, a = 0.9, photons: every total lies within its reported absolute error of the reference', () => {
    for (const ratio of trueOverReported(0.9, 1, 1e-5)) expect(ratio).toBeLessThanOrEqual(1);
  });
  test('greybody tolerances follow each mode’s share: at a = 0.9, tol 1e-4, the largest modes are solved to tol/5 and the negligible ones no tighter than 1e-2', () => {
    const r = emissionTotals({ hole: { a: 0.9 }, field: { spin: 0 } }, { tol: 1e-4 });
    const N = r.numberRate.value;
    const shares = r.modes.map((m) => ({ share: m.number / N, tol: m.greybodyTol }));
    for (const s of shares) {
      if (s.share > 0.1) expect(s.tol).toBeLessThanOrEqual(2e-5 * (1 + 1e-12));
      if (s.share < 1e-9) expect(s.tol).toBe(1e-2);
    }
    expect(shares.some((s) => s.share < 1e-9)).toBe(true);
  });
});
