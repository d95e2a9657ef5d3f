import { describe, expect, it } from 'vitest';
import { InputError } from '@penumbra/kerr';
import { absorptionCrossSection, greybody } from '@penumbra/flux';

const ok = { spin: 1, l: 1, m: 1, a: 0.5, omega: 0.3 };
const bad: [string, Record<string, unknown>, string][] = [
  ['an unsupported spin', { spin: 1.5 }, 'spin'],
  ['a NaN spin', { spin: Number.NaN }, 'spin'],
  ['l < |s|', { spin: 2, l: 1, m: 0 }, 'l'],
  ['l − s not an integer', { spin: 0.5, l: 1, m: 0.5 }, 'l'],
  ['|m| > l', { m: 2 }, 'm'],
  ['m − s not an integer', { spin: 0.5, l: 0.5, m: 0 }, 'm'],
  ['|a| > 0.9999 M', { a: 0.99995 }, 'a'],
  ['a = M (extremal)', { a: 1 }, 'a'],
  ['a NaN', { a: Number.NaN }, 'a'],
  ['ω = 0', { omega: 0 }, 'omega'],
  ['ω < 0', { omega: -0.1 }, 'omega'],
  ['ω infinite', { omega: Number.POSITIVE_INFINITY }, 'omega'],
  ['mass ≤ 0', { mass: 0 }, 'mass'],
];

describe('bad input gets a typed error naming the parameter and the allowed range', () => {
  for (const [what, patch, parameter] of bad) {
    it(`rejects ${what} with InputError(${parameter})`, () => {
      try {
        greybody({ ...ok, ...patch } as typeof ok);
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
    expect(() => absorptionCrossSection({ spin: 0, a: 0, omega: 0.1 }, { tol: Number.NaN })).toThrow(InputError);
  });
});
