import { describe, expect, it } from 'vitest';
import { InputError } from '@penumbra/core';
import {
  absorptionCrossSection,
  greybody,
  lowFrequencyGreybody,
  radialFunction,
  tryGreybody,
  type GreybodyProblem,
} from '@penumbra/flux';
import { parameterOf } from '../../../test/helpers.js';

type Flat = { spin: unknown; l: unknown; m: unknown; a: unknown; omega: unknown; mass?: unknown };
const nest = ({ spin, l, m, a, omega, mass }: Flat): GreybodyProblem =>
  ({ hole: mass === undefined ? { a } : { a, mass }, mode: { field: { spin }, l, m }, omega }) as GreybodyProblem;
const flatOk: Flat = { spin: 1, l: 1, m: 1, a: 0.5, omega: 0.3 };
const ok = nest(flatOk);
const bad: [string, Record<string, unknown>, string][] = [
  ['an unsupported spin', { spin: 1.5 }, 'mode.field.spin'],
  ['a NaN spin', { spin: Number.NaN }, 'mode.field.spin'],
  ['l < |s|', { spin: 2, l: 1, m: 0 }, 'mode.l'],
  ['l − s not an integer', { spin: 0.5, l: 1, m: 0.5 }, 'mode.l'],
  ['|m| > l', { m: 2 }, 'mode.m'],
  ['m − s not an integer', { spin: 0.5, l: 0.5, m: 0 }, 'mode.m'],
  ['|a| > 0.99999 M', { a: 0.999995 }, 'hole.a'],
  ['a = M (extremal)', { a: 1 }, 'hole.a'],
  ['a NaN', { a: Number.NaN }, 'hole.a'],
  ['ω = 0', { omega: 0 }, 'omega'],
  ['ω < 0', { omega: -0.1 }, 'omega'],
  ['ω infinite', { omega: Number.POSITIVE_INFINITY }, 'omega'],
  ['mass ≤ 0', { mass: 0 }, 'hole.mass'],
];

describe('bad input gets a typed error naming the parameter and the allowed range', () => {
  for (const [what, patch, parameter] of bad) {
    it(`rejects ${what} with InputError(${parameter})`, () => {
      try {
        greybody(nest({ ...flatOk, ...patch }));
        expect.unreachable();
      } catch (e) {
        expect(e).toBeInstanceOf(InputError);
        expect((e as InputError).parameter).toBe(parameter);
        expect((e as Error).message).toContain('allowed');
      }
    });
  }
  it('rejects a tolerance outside 1e-12 … 1e-2', () => {
    expect(() => greybody(ok, { tol: 1e-14 })).toThrow(InputError);
    expect(() => greybody(ok, { tol: 0.5 })).toThrow(/tol/);
    expect(() => absorptionCrossSection({ hole: { a: 0 }, field: { spin: 0 }, omega: 0.1 }, { tol: Number.NaN })).toThrow(
      InputError,
    );
  });
  it("accepts the field spin '1/2' as 0.5 and gives the same Γ to the last bit", () => {
    const text = greybody({ hole: { a: 0.5 }, mode: { field: { spin: '1/2' }, l: 0.5, m: 0.5 }, omega: 0.3 });
    const number = greybody({ hole: { a: 0.5 }, mode: { field: { spin: 0.5 }, l: 0.5, m: 0.5 }, omega: 0.3 });
    expect(text.gamma).toBe(number.gamma);
    expect(text.mode.field.spin).toBe(0.5);
  });
  it('refuses unknown option keys, unknown integrator names and non-object problems or options with InputError', () => {
    expect(parameterOf(() => greybody(ok, { integrator: 'bogus' as 'odex' }))).toBe('integrator');
    expect(parameterOf(() => greybody(ok, { tolerance: 1e-6 } as object))).toBe('options.tolerance');
    expect(parameterOf(() => greybody(ok, null as unknown as object))).toBe('options');
    expect(parameterOf(() => greybody(null as unknown as GreybodyProblem))).toBe('problem');
    expect(parameterOf(() => greybody({ ...ok, spin: 1 } as unknown as GreybodyProblem))).toBe('problem.spin');
    expect(parameterOf(() => absorptionCrossSection({ hole: { a: 0 }, field: { spin: 0 }, omega: 0.1 }, { maxL: 500 }))).toBe(
      'maxL',
    );
    // σ at Mω = 30 needs l > 150, beyond a caller's maxL = 50: refused at once, not after thousands of solves.
    expect(parameterOf(() => absorptionCrossSection({ hole: { a: 0.5 }, field: { spin: 0 }, omega: 30 }, { maxL: 50 }))).toBe(
      'omega',
    );
    expect(parameterOf(() => lowFrequencyGreybody(nest({ ...flatOk, omega: -1 })))).toBe('omega');
    expect(parameterOf(() => lowFrequencyGreybody(nest({ ...flatOk, omega: '0.1' })))).toBe('omega');
    expect(parameterOf(() => radialFunction(ok, ['3'] as unknown as number[]))).toBe('radii[0]');
  });
  it('tryGreybody reports a status instead of throwing: success, invalid-input', () => {
    expect(tryGreybody(ok).status).toBe('success');
    const bad = tryGreybody(nest({ ...flatOk, a: 2 }));
    expect(bad.status).toBe('invalid-input');
  });
});
