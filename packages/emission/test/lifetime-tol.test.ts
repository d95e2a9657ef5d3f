/**
 * `tol` of evolveHole and massForLifetime (core's tolerance rule): a result
 * whose error estimate exceeds it is a ConvergenceError with diagnostics, a
 * bad value an InputError naming tol; and the estimates are honest against
 * tighter runs — the ODE at odeTol 1e-11 (1e-10 for massForLifetime), and for the table part the shipped
 * 50-node massless table (scripts/make-page-table.mjs) as the finer run
 * against a table of every other node of it.
 */
import { describe, expect, test } from 'vitest';
import { ConvergenceError, InputError } from '@penumbra/core';
import {
  bundledPageTable,
  evolveHole,
  massForLifetime,
  massLossRates,
  pageFunctions,
  resolveContent,
  type PageTable,
} from '@penumbra/emission';

const shipped = bundledPageTable();
/** The shipped table on every other θ node (θ = 0 kept, a* ≤ 0.985). */
function everyOtherNode(t: PageTable): PageTable {
  const pick = (v: readonly number[]) => v.filter((_, i) => i % 2 === 0 && i < v.length - 1);
  return {
    ...t,
    aStar: pick(t.aStar),
    theta: pick(t.theta),
    spins: t.spins.map((r) => ({
      spin: r.spin,
      power: pick(r.power),
      torqueOverA: pick(r.torqueOverA),
      powerError: pick(r.powerError),
      torqueOverAError: pick(r.torqueOverAError),
    })),
  };
}
const coarse = everyOtherNode(shipped);

/** The error a call throws, checked to be of the given class. */
function thrown<E>(call: () => unknown, kind: new (...args: never[]) => E): E {
  try {
    call();
  } catch (e) {
    expect(e).toBeInstanceOf(kind);
    return e as E;
  }
  throw new Error(`expected a ${kind.name}`);
}

describe('evolveHole tol', () => {
  const functions = pageFunctions({ table: shipped });
  test('a lifetime within tol is returned unchanged; one whose error estimate exceeds it throws ConvergenceError with the diagnostics; tol outside 1e-12 … 1e-2 or not a number is an InputError naming tol', () => {
    const free = evolveHole({ functions, aStar0: 0.5 });
    expect(evolveHole({ functions, aStar0: 0.5 }, { tol: 1e-3 }).lifetime).toBe(free.lifetime);
    expect(free.diagnostics.errorEstimate).toBeGreaterThan(1e-5);
    const e = thrown(() => evolveHole({ functions, aStar0: 0.5 }, { tol: 1e-5 }), ConvergenceError);
    expect(e.diagnostics.errorEstimate).toBe(free.diagnostics.errorEstimate);
    expect(e.diagnostics.tol).toBe(1e-5);
    expect(e.diagnostics.lifetime).toBe(free.lifetime);
    for (const tol of [0, 1e-13, 0.02, Number.NaN, '1e-3'])
      expect(thrown(() => evolveHole({ functions, aStar0: 0.5 }, { tol } as never), InputError).parameter).toBe('tol');
  });
  test('honest against tighter runs (default content and gravitons alone, a* = 0.5 and 0.9): the ODE part bounds the change to odeTol 1e-11; the estimate of the half table bounds its distance to the shipped table plus the shipped estimate', () => {
    for (const content of [undefined, ['graviton']])
      for (const aStar0 of [0.5, 0.9]) {
        const fine = pageFunctions({ table: shipped, content });
        const ev = evolveHole({ functions: fine, aStar0 });
        const tight = evolveHole({ functions: fine, aStar0 }, { odeTol: 1e-11 });
        expect(Math.abs(ev.lifetime / tight.lifetime - 1)).toBeLessThanOrEqual(ev.diagnostics.odeError);
        const half = evolveHole({ functions: pageFunctions({ table: coarse, content }), aStar0 });
        const distance = Math.abs(half.lifetime / tight.lifetime - 1);
        // the half table's error is visible (the check has teeth) and within its estimate
        expect(distance).toBeGreaterThan(1e-5);
        expect(distance + ev.diagnostics.errorEstimate).toBeLessThanOrEqual(half.diagnostics.errorEstimate);
      }
  });
});

describe('massForLifetime tol', () => {
  const rates = massLossRates({ species: resolveContent() });
  test('a mass within tol is returned unchanged; one whose error estimate exceeds it throws ConvergenceError with the diagnostics; a bad tol is an InputError naming tol, an unknown option one naming it', () => {
    const free = massForLifetime({ rates });
    expect(massForLifetime({ rates }, { tol: 1e-3 }).massGrams).toBe(free.massGrams);
    expect(free.diagnostics.errorEstimate).toBeGreaterThan(0);
    const e = thrown(() => massForLifetime({ rates }, { tol: 1e-8 }), ConvergenceError);
    expect(e.diagnostics.errorEstimate).toBeGreaterThan(1e-8);
    expect(e.diagnostics.tol).toBe(1e-8);
    expect(Math.abs((e.diagnostics.massGrams as number) / free.massGrams - 1)).toBeLessThan(free.relError);
    for (const tol of [0, 0.05, '1e-3'])
      expect(thrown(() => massForLifetime({ rates }, { tol } as never), InputError).parameter).toBe('tol');
    expect(thrown(() => massForLifetime({ rates }, { width: 1 } as never), InputError).parameter).toBe('options.width');
  });
  test('honest against tighter runs (default content, formation a* = 0.9, where the table error is largest): relError bounds the change to odeTol 1e-10, and that of the half table its distance to the shipped table plus the shipped relError', () => {
    const half = massLossRates({ species: resolveContent(), pageTable: coarse });
    const aStar0 = 0.9;
    const r = massForLifetime({ rates, aStar0 });
    const tight = massForLifetime({ rates, aStar0 }, { odeTol: 1e-10 });
    expect(Math.abs(r.massGrams / tight.massGrams - 1)).toBeLessThanOrEqual(r.relError);
    const h = massForLifetime({ rates: half, aStar0 });
    const distance = Math.abs(h.massGrams / tight.massGrams - 1);
    expect(distance).toBeGreaterThan(1e-6);
    expect(distance + r.relError).toBeLessThanOrEqual(h.relError);
  });
});
