import fc from 'fast-check';
import { describe, expect, test } from 'vitest';
import { InputError } from '@penumbra/core';
import { bundledPageTable, evolutionTimeUnitSeconds, evolveHole, pageFunctions } from '@penumbra/emission';
import { greybody } from '@penumbra/flux';
import { computeView, formatState, parseState, printNumber, VIEW_DEFAULTS, VIEWS } from '../src/index.js';

const refused = (query: string): string => {
  try {
    computeView(parseState(query));
  } catch (e) {
    if (e instanceof InputError) return e.parameter;
    throw e;
  }
  throw new Error(`no InputError for ${query}`);
};

describe('the explorer state lives in the URL', () => {
  test('every state round-trips through its query string (fast-check, fixed seed)', () => {
    const state = fc.record({
      view: fc.constantFrom(...VIEWS),
      a: fc.double({ min: -0.99, max: 0.99, noNaN: true }).map((x) => x + 0), // −0 prints as 0
      count: fc.integer({ min: 2, max: 200 }),
      tol: fc.constantFrom(1e-4, 1e-8),
    });
    fc.assert(
      fc.property(state, ({ view, a, count, tol }) => {
        const s = { ...VIEW_DEFAULTS[view], aStar: a, count, tol };
        expect(parseState(formatState(s))).toEqual(s);
      }),
      { seed: 20261203, numRuns: 100 },
    );
  });
  test('an unknown key, a word where a number belongs and an unknown view are InputErrors naming the query key', () => {
    expect(refused('?colour=red')).toBe('colour');
    expect(refused('?a=abc')).toBe('a');
    expect(refused('?view=movie')).toBe('view');
    expect(refused('?count=')).toBe('count');
  });
  test('hostile query strings give a state or an InputError, never another error (fast-check, fixed seed)', () => {
    fc.assert(
      fc.property(fc.string(), (q) => {
        try {
          parseState(q);
        } catch (e) {
          expect(e).toBeInstanceOf(InputError);
        }
      }),
      { seed: 20261203, numRuns: 300 },
    );
  });
});

describe('the views compute with the library and refuse bad input with the library’s errors', () => {
  test('the greybody view prints the same Γ as flux greybody, to all 8 printed digits', () => {
    const view = computeView(parseState('?view=greybody&a=0.9&spin=1&l=1&m=1&from=0.1&to=0.5&count=3'));
    expect(view.rows).toHaveLength(3);
    for (const [l, m, omega, gamma] of view.rows) {
      const g = greybody({ hole: { a: 0.9 }, mode: { field: { spin: 1 }, l, m }, omega }, { tol: 1e-8 });
      expect(printNumber(gamma)).toBe(printNumber(g.gamma));
    }
    // Ω_H = a/(2Mr+) (Teukolsky & Press 1974): the superradiant band of m = 1 ends at Ω_H.
    expect(view.figure.band?.[1]).toBeCloseTo(0.9 / (2 * (1 + Math.sqrt(1 - 0.81))), 12);
  });
  test('a massive scalar (mu = Mμ) gives the same Γ as flux greybody with field.mass, and ω ≤ μ is refused naming omega', () => {
    const view = computeView(parseState('?view=greybody&a=0.9&spin=0&mu=0.3&l=1&m=1&from=0.35&to=0.5&count=2'));
    for (const [l, m, omega, gamma] of view.rows) {
      const g = greybody({ hole: { a: 0.9 }, mode: { field: { spin: 0, mass: 0.3 }, l, m }, omega }, { tol: 1e-8 });
      expect(printNumber(gamma)).toBe(printNumber(g.gamma));
    }
    expect(refused('?view=greybody&spin=0&mu=0.3&l=1&m=1&from=0.1&to=0.5')).toBe('omega');
  });
  test('a ≥ 1, ω ≤ 0, l < |s| and a spectrum without a physical mass are refused naming what the user set', () => {
    expect(refused('?view=greybody&a=1')).toBe('hole.a');
    expect(refused('?view=greybody&from=-0.1')).toBe('from');
    expect(refused('?view=greybody&spin=2&l=1&m=1')).toBe('mode.l');
    expect(refused('?view=spectrum&unit=geometric')).toBe('unit');
    expect(refused('?view=spectrum&species=tachyon')).toBe('species');
  });
  test('the evolution view gives the lifetime of evolveHole with the shipped f, g table (same function, same number)', () => {
    const view = computeView(parseState('?view=evolution&a=0.9&mass=1e15&unit=g'));
    const history = evolveHole({ functions: pageFunctions({ table: bundledPageTable() }), aStar0: 0.9 });
    const lifetime = history.lifetime * evolutionTimeUnitSeconds(1e15, 'g');
    expect(view.summary.at(-1)).toContain(`lifetime ${printNumber(lifetime)} s`);
    // The mass falls and the temperature rises along the track (T_H ∝ 1/M at fixed a*; Hawking 1975).
    const masses = view.rows.map((r) => r[1]);
    expect(masses.every((m, i) => i === 0 || m <= masses[i - 1])).toBe(true);
    expect(view.rows.at(-1)?.[3]).toBeGreaterThan(view.rows[0][3]);
  });
});
