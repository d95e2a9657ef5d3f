import { describe, expect, test } from 'vitest';
import type { Diagnostics } from '@penumbra/core';
import {
  bundledPageTable,
  contentTotals,
  emissionSpectrum,
  emissionTotals,
  evolveHole,
  pageFunctions,
  pageTable,
} from '@penumbra/emission';
import { inputErrorOf } from '../../../test/helpers.js';

const fns = pageFunctions({ table: bundledPageTable() });

function expectDiagnostics(d: Diagnostics): void {
  expect(typeof d.method).toBe('string');
  expect(typeof d.message).toBe('string');
  expect(Number.isInteger(d.steps)).toBe(true);
  expect(Number.isInteger(d.rhsEvaluations)).toBe(true);
  expect(d.errorEstimate).toBeGreaterThanOrEqual(0);
}

describe('the solve contract (problem → solve(problem, options) → solution with diagnostics)', () => {
  test('unknown option keys and unknown problem keys are refused with an InputError naming the key', () => {
    const hole = { a: 0 };
    const field = { spin: 1 as const };
    expect(inputErrorOf(() => emissionTotals({ hole, field }, { tolerance: 1e-4 } as never)).parameter).toBe('options.tolerance');
    expect(inputErrorOf(() => emissionSpectrum({ hole, field, grid: [0.1] }, { onMode: () => {} } as never)).parameter).toBe(
      'options.onMode',
    );
    expect(inputErrorOf(() => emissionTotals({ hole, field, omega: 0.1 } as never)).parameter).toBe('problem.omega');
    expect(inputErrorOf(() => contentTotals({ hole }, { points: 5 } as never)).parameter).toBe('options.points');
    expect(inputErrorOf(() => evolveHole({ functions: fns, aStar0: 0.5 }, { tolerance: 1e-8 } as never)).parameter).toBe(
      'options.tolerance',
    );
    expect(inputErrorOf(() => pageTable({ points: 5 }, { aMax: 0.5 } as never)).parameter).toBe('options.aMax');
  });
  test('options that are not objects, and bad option values, are InputErrors naming the key (not TypeErrors, not silent defaults)', () => {
    expect(inputErrorOf(() => evolveHole({ functions: fns, aStar0: 0.5 }, null as never)).parameter).toBe('options');
    expect(inputErrorOf(() => pageTable(null as never)).parameter).toBe('problem');
    expect(inputErrorOf(() => pageTable(5 as never)).parameter).toBe('problem');
    expect(inputErrorOf(() => pageTable({ points: 4 })).parameter).toBe('points');
    expect(inputErrorOf(() => pageTable({ spins: [3] as never })).parameter).toBe('spins[0]');
    expect(inputErrorOf(() => emissionTotals({ hole: { a: 0 }, field: { spin: 1 } }, { maxL: -1 })).parameter).toBe('maxL');
    expect(inputErrorOf(() => emissionTotals({ hole: { a: 0 }, field: { spin: 2 } }, { maxL: 1 })).parameter).toBe('maxL');
    expect(
      inputErrorOf(() => emissionSpectrum({ hole: { a: 0 }, field: { spin: 0 }, grid: [0.1] }, { maxL: 2.5 })).parameter,
    ).toBe('maxL');
    expect(
      inputErrorOf(() => emissionSpectrum({ hole: { a: 0 }, field: { spin: 0 }, grid: [0.1] }, { onPoint: 1 as never }))
        .parameter,
    ).toBe('onPoint');
    expect(inputErrorOf(() => evolveHole({ functions: fns, aStar0: 0.5 }, { aStarThresholds: [0.5, 1.5] })).parameter).toBe(
      'aStarThresholds[1]',
    );
    expect(inputErrorOf(() => evolveHole({ functions: {} as never, aStar0: 0.5 })).parameter).toBe('functions');
    expect(inputErrorOf(() => pageFunctions({ table: { aStar: [0], theta: [0] } as never })).parameter).toBe('table.theta');
  });
  test('one tolerance range for every solve: 1e-12 … 1e-2 (core), refused outside with the key named', () => {
    expect(inputErrorOf(() => emissionTotals({ hole: { a: 0 }, field: { spin: 1 } }, { tol: 1e-13 })).parameter).toBe('tol');
    expect(
      inputErrorOf(() => emissionSpectrum({ hole: { a: 0 }, field: { spin: 1 }, grid: [0.1] }, { tol: 0.02 })).parameter,
    ).toBe('tol');
    expect(inputErrorOf(() => pageTable({}, { tol: 0 })).parameter).toBe('tol');
    // evolveHole takes tol (the lifetime's requested accuracy) under the same rule
    expect(inputErrorOf(() => evolveHole({ functions: fns, aStar0: 0.5 }, { tol: 0.05 })).parameter).toBe('tol');
    expect(inputErrorOf(() => evolveHole({ functions: fns, aStar0: 0.5 }, { tol: 1e-13 })).parameter).toBe('tol');
  });
  test('the hole and field are checked by core: |a| ≤ 0.99999 M, mass > 0, field spin 0, 1/2, 1, 2', () => {
    expect(inputErrorOf(() => emissionTotals({ hole: { a: 0.999995 }, field: { spin: 1 } })).parameter).toBe('hole.a');
    expect(inputErrorOf(() => emissionSpectrum({ hole: { a: 0, mass: -1 }, field: { spin: 1 }, grid: [0.1] })).parameter).toBe(
      'hole.mass',
    );
    expect(inputErrorOf(() => emissionSpectrum({ hole: { a: 0 }, field: { spin: 1.5 as never }, grid: [0.1] })).parameter).toBe(
      'field.spin',
    );
  });
  test("a frequency grid may be core's FrequencyGrid; Mω above 30 and a decreasing grid are refused", () => {
    expect(inputErrorOf(() => emissionSpectrum({ hole: { a: 0, mass: 2 }, field: { spin: 0 }, grid: [10, 16] })).parameter).toBe(
      'grid[1]',
    );
    expect(
      inputErrorOf(() =>
        emissionSpectrum({ hole: { a: 0 }, field: { spin: 0 }, grid: { spacing: 'linear', from: 0.3, to: 0.1, count: 3 } }),
      ).message,
    ).toMatch(/increasing/);
    expect(
      inputErrorOf(() => emissionSpectrum({ hole: { a: 0 }, field: { spin: 0 }, grid: { spacing: 'cubic' } as never })).parameter,
    ).toBe('grid.spacing');
  });
  test('field spin "1/2" is the same field as 0.5: identical spectrum points, bit for bit', () => {
    const grid = { spacing: 'log', from: 0.05, to: 0.2, count: 2 } as const;
    const text = emissionSpectrum({ hole: { a: 0.3 }, field: { spin: '1/2' }, grid }, { tol: 1e-3 });
    const number = emissionSpectrum({ hole: { a: 0.3 }, field: { spin: 0.5 }, grid: [0.05, 0.2] }, { tol: 1e-3 });
    expect(text.field.spin).toBe(0.5);
    expect(text.points).toEqual(number.points);
  });
  test("spectrum, totals, content totals and evolution carry diagnostics extending core's Diagnostics, with greybody RHS evaluations counted", () => {
    const spectrum = emissionSpectrum({ hole: { a: 0.5 }, field: { spin: 0 }, grid: [0.1, 0.3] }, { tol: 1e-3 });
    expectDiagnostics(spectrum.diagnostics);
    expect(spectrum.diagnostics.rhsEvaluations).toBeGreaterThan(spectrum.diagnostics.gammaCalls);
    expect(spectrum.diagnostics.errorEstimate).toBe(Math.max(...spectrum.points.map((p) => p.relError)));
    const totals = emissionTotals({ hole: { a: 0 }, field: { spin: 2 } }, { tol: 1e-3 });
    expectDiagnostics(totals.diagnostics);
    expect(totals.diagnostics.rhsEvaluations).toBeGreaterThan(totals.diagnostics.gammaCalls);
    expect(totals.diagnostics.errorEstimate).toBeLessThanOrEqual(1e-3);
    const content = contentTotals({ hole: { a: 0 }, content: ['graviton'] }, { tol: 1e-3 });
    expectDiagnostics(content.diagnostics);
    expect(content.diagnostics.rhsEvaluations).toBe(totals.diagnostics.rhsEvaluations);
    const ev = evolveHole({ functions: fns, aStar0: 0.5 });
    expectDiagnostics(ev.diagnostics);
    expect(ev.diagnostics.rhsEvaluations).toBeGreaterThan(ev.diagnostics.steps);
    expect(ev.diagnostics.errorEstimate).toBe(ev.diagnostics.odeError + ev.diagnostics.tableError);
    expect(ev.diagnostics.odeError).toBeGreaterThan(ev.diagnostics.halvedTolChange);
  });
});
