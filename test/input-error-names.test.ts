/**
 * Every InputError a public function throws names a parameter the caller
 * wrote. The walk: start from a valid call of each public function, replace
 * one leaf of its arguments at a time by a bad value (NaN, a string, null, an
 * out-of-range number), and check that any InputError names that argument
 * path — `omega`, `mode.l`, `problem.c`, `options.tol`, `values[2]` — with or
 * without the function's own parameter name in front. Never `lambda`, `x` or
 * another quantity the caller did not write.
 */
import { describe, expect, test } from 'vitest';
import * as core from '@penumbra/core';
import * as kerr from '@penumbra/kerr';
import * as spheroidal from '@penumbra/spheroidal';
import * as flux from '@penumbra/flux';
import * as rw from '@penumbra/regge-wheeler';
import * as emission from '@penumbra/emission';
import * as plot from '@penumbra/plot';

type Fn = (...args: unknown[]) => unknown;
const hole = kerr.kerrHole({ a: 0.5 });
const fns = emission.pageFunctions({ table: emission.bundledPageTable() });
const rates = emission.massLossRates({ species: [{ name: 'photon', spin: 1, dof: 2, massGeV: 0 }] });

/** A valid call of each public function: [name, function, parameter names, arguments]. */
const CALLS: [string, Fn, string[], unknown[]][] = [
  ['linearGrid', core.linearGrid as Fn, ['from', 'to', 'count'], [0, 1, 3]],
  ['logGrid', core.logGrid as Fn, ['from', 'to', 'count'], [0.1, 1, 3]],
  ['gridValues', core.gridValues as Fn, ['grid'], [{ spacing: 'log', from: 0.1, to: 1, count: 3 }]],
  ['validateHole', core.validateHole as Fn, ['hole'], [{ a: 0.5, mass: 1 }]],
  ['validateMode', core.validateMode as Fn, ['mode'], [{ field: { spin: 1 }, l: 2, m: 1 }]],
  ['validateTolerance', core.validateTolerance as Fn, ['tol'], [1e-6]],
  ['toCsv', core.toCsv as Fn, ['table'], [{ columns: [{ name: 'x', unit: '1' }], rows: [[1]] }]],
  ['geometricTailBound', core.geometricTailBound as Fn, ['last', 'prev', 'what'], [0.1, 1, 'sum']],
  [
    'sumLShells',
    core.sumLShells as Fn,
    ['lFirst', 'rule', 'shell'],
    [0, { lCut: 1, tol: 1e-3, maxL: 30 }, (l: number) => 2 ** -l],
  ],
  ['kerrHole', kerr.kerrHole as Fn, ['hole'], [{ a: 0.5, mass: 2 }]],
  ['tortoise', kerr.tortoise as Fn, ['hole', 'r'], [hole, 3]],
  ['tortoiseDerivative', kerr.tortoiseDerivative as Fn, ['hole', 'r'], [hole, 3]],
  ['delta', kerr.delta as Fn, ['hole', 'r'], [hole, 3]],
  ['invertTortoise', kerr.invertTortoise as Fn, ['hole', 'rStar'], [hole, 3]],
  ['physicalBackground', kerr.physicalBackground as Fn, ['hole', 'mass', 'unit'], [hole, 1e15, 'g']],
  ['unitScales', kerr.unitScales as Fn, ['massKg'], [1e12]],
  [
    'spheroidalEigenvalue',
    spheroidal.spheroidalEigenvalue as Fn,
    ['problem', 'options'],
    [{ s: -2, l: 2, m: 1, c: 0.5 }, { leaver: 'off' }],
  ],
  [
    'spheroidalEigenvalueComplex',
    spheroidal.spheroidalEigenvalueComplex as Fn,
    ['problem'],
    [{ s: 0, l: 1, m: 0, c: { re: 1, im: 0.2 } }],
  ],
  ['sphericalEigenvalue', spheroidal.sphericalEigenvalue as Fn, ['s', 'l'], [-1, 2]],
  ['smallCSeries', spheroidal.smallCSeries as Fn, ['s', 'l', 'm'], [-1, 2, 1]],
  ['radialSeparationConstant', spheroidal.radialSeparationConstant as Fn, ['A', 'a', 'omega', 'm'], [4, 0.5, 0.2, 1]],
  [
    'greybody',
    flux.greybody as Fn,
    ['problem', 'options'],
    [{ hole: { a: 0.5 }, mode: { field: { spin: 1 }, l: 1, m: 1 }, omega: 0.3 }, { tol: 1e-4 }],
  ],
  [
    'lowFrequencyGreybody',
    flux.lowFrequencyGreybody as Fn,
    ['problem'],
    [{ hole: { a: 0.5 }, mode: { field: { spin: 0 }, l: 0, m: 0 }, omega: 0.01 }],
  ],
  [
    'absorptionCrossSection',
    flux.absorptionCrossSection as Fn,
    ['problem', 'options'],
    [{ hole: { a: 0 }, field: { spin: 0 }, omega: 0.05 }, { tol: 1e-2 }],
  ],
  ['horizonFactor', flux.horizonFactor as Fn, ['s', 'hole', 'omega', 'k'], [1, hole, 0.3, 0.1]],
  [
    'schwarzschildGreybody',
    rw.schwarzschildGreybody as Fn,
    ['problem', 'options'],
    [{ field: { spin: 0 }, l: 0, omega: 0.2 }, { tol: 1e-4 }],
  ],
  [
    'evolveHole',
    emission.evolveHole as Fn,
    ['problem', 'options'],
    [
      { functions: fns, aStar0: 0.5 },
      { odeTol: 1e-6, aStarThresholds: [0.1] },
    ],
  ],
  ['evolutionTimeUnitSeconds', emission.evolutionTimeUnitSeconds as Fn, ['mass', 'unit'], [1e15, 'g']],
  [
    'massLossRates',
    emission.massLossRates as Fn,
    ['problem'],
    [{ species: [{ name: 'electron', spin: 0.5, dof: 4, massGeV: 0.000511 }] }],
  ],
  [
    'evaporateHole',
    emission.evaporateHole as Fn,
    ['problem', 'options'],
    [
      { rates, mass: 1e15, unit: 'g', aStar0: 0.5 },
      { odeTol: 1e-6, aStarThresholds: [0.1], finalSeconds: [1] },
    ],
  ],
  ['massForLifetime', emission.massForLifetime as Fn, ['problem'], [{ rates, seconds: 1e10, aStar0: 0 }]],
  [
    'toPhysicalRates',
    emission.toPhysicalRates as Fn,
    ['rates', 'mass', 'unit'],
    [{ numberRate: 1e-3, power: 1e-5, torque: 0 }, 1e15, 'g'],
  ],
  ['toPhysicalSpectrum', emission.toPhysicalSpectrum as Fn, ['point', 'mass', 'unit'], [{ omega: 0.1, number: 1e-3 }, 1e15, 'g']],
  ['resolveContent', emission.resolveContent as Fn, ['content'], [['photon', { name: 'axion', spin: 0, dof: 1 }]]],
  ['autoScale', plot.autoScale as Fn, ['values', 'minSpan'], [[1, 10, 1000], 100]],
  ['axisTitle', plot.axisTitle as Fn, ['axis'], [{ title: 'ω', unit: '1/M' }]],
];

const BAD: unknown[] = [Number.NaN, 'x', null, -1e300];

/** Every leaf path of a value: 'a', 'mode.field.spin', 'values[1]'. Functions and class instances are leaves. */
function leaves(value: unknown, path: string, out: Map<string, unknown>, depth = 0): Map<string, unknown> {
  const plain =
    typeof value === 'object' && value !== null && (Array.isArray(value) || Object.getPrototypeOf(value) === Object.prototype);
  if (!plain || depth > 4 || (Array.isArray(value) && value.length === 0)) {
    out.set(path, value);
    return out;
  }
  for (const [key, v] of Object.entries(value as object)) {
    leaves(v, Array.isArray(value) ? `${path}[${key}]` : path ? `${path}.${key}` : key, out, depth + 1);
  }
  return out;
}

/** args with the value at `path` (relative to argument `i`) replaced. */
function replaced(args: unknown[], i: number, path: string, bad: unknown): unknown[] {
  const copy = structuredClone(args.map((a) => (typeof a === 'function' || (a as { f?: unknown })?.f ? undefined : a)));
  args.forEach((a, j) => {
    if (copy[j] === undefined) copy[j] = a;
  });
  if (path === '') {
    copy[i] = bad;
    return copy;
  }
  const keys = path.split(/\.|\[|\]/).filter(Boolean);
  let target = copy[i] as Record<string, unknown>;
  for (const key of keys.slice(0, -1)) target = target[key] as Record<string, unknown>;
  target[keys[keys.length - 1]] = bad;
  return copy;
}

describe('an InputError names a parameter the caller wrote', () => {
  test.each(CALLS.map((c) => [c[0], c] as const))(
    '%s: each argument leaf replaced by NaN, a string, null or -1e300 is refused naming that path (or it returns)',
    (_name, [name, f, params, args]) => {
      expect(() => f(...args), `${name} must accept its valid call`).not.toThrow();
      const wrong: string[] = [];
      for (const [i, arg] of args.entries()) {
        const paths = [...leaves(arg, '', new Map()).keys()];
        const allowedPaths = new Set<string>([
          params[i],
          ...paths.flatMap((p) => (p ? [p, `${params[i]}.${p}`, `${params[i]}${p}`] : [])),
        ]);
        // a path that leads to a leaf is the caller's too (problem.mode when mode.l is bad)
        for (const p of [...allowedPaths]) {
          const parts = p.split('.');
          for (let k = 1; k < parts.length; k++) allowedPaths.add(parts.slice(0, k).join('.'));
        }
        for (const path of paths) {
          for (const bad of BAD) {
            try {
              f(...replaced(args, i, path, bad));
            } catch (error) {
              if (!(error instanceof core.InputError)) continue;
              const named = error.parameter.replace(/\[\d+\]$/, (m) => m);
              if (!allowedPaths.has(named))
                wrong.push(`${params[i]}${path ? `.${path}` : ''} = ${String(bad)} → '${error.parameter}'`);
            }
          }
        }
      }
      expect(wrong).toEqual([]);
    },
  );
});
