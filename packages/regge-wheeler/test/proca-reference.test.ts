import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import { procaGreybody, type ProcaPolarization } from '@penumbra/regge-wheeler';

// 30-digit reference values from mpmath (test/fixtures/proca-reference.py):
// the Proca equations re-derived with sympy, the flux from the conserved
// current at finite radius, integration with mpmath's Taylor method at 40 digits.
const FIXTURE = fileURLToPath(new URL('./fixtures/proca-reference.json', import.meta.url));
interface Row {
  polarization: ProcaPolarization;
  l: number;
  Momega: string;
  Mmu: string;
  gamma: string;
}
const rows = (JSON.parse(readFileSync(FIXTURE, 'utf8')) as { modes: Row[] }).modes;
const value = (text: string) => {
  const [a, b] = text.split('/').map(Number);
  return b === undefined ? a : a / b;
};

describe('Proca Γ against the 30-digit mpmath reference (test/fixtures/proca-reference.json)', () => {
  for (const row of rows) {
    it(`${row.polarization}, l = ${row.l}, Mω = ${row.Momega}, Mμ = ${row.Mmu}: relative error ≤ 1e-8 at tol 1e-8, and within 10× the solver's own error estimate at tol 1e-10`, () => {
      const reference = Number(row.gamma);
      const problem = {
        field: { spin: 1 as const, mass: value(row.Mmu) },
        l: row.l,
        omega: value(row.Momega),
        polarization: row.polarization,
      };
      const loose = procaGreybody(problem, { tol: 1e-8 });
      expect(Math.abs(loose.gamma - reference) / reference).toBeLessThan(1e-8);
      const tight = procaGreybody(problem, { tol: 1e-10 });
      const error = Math.abs(tight.gamma - reference) / reference;
      expect(error).toBeLessThan(10 * tight.diagnostics.errorEstimate);
    });
  }
});
