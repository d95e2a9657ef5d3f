import { describe, expect, test } from 'vitest';
import { greybody } from '@penumbra/flux';
import { run } from './helpers.js';

describe('penumbra greybody, massive spin 1/2 (docs/massive-dirac.md)', () => {
  test('--field-mass with --kappa-sign prints the library Γ exactly and says which sign was computed', async () => {
    const r = await run(
      'greybody',
      '--spin',
      '1/2',
      '--l',
      '1/2',
      '--m',
      '1/2',
      '--a',
      '0.5',
      '--omega',
      '0.3',
      '--field-mass',
      '0.1',
      '--kappa-sign',
      '-1',
      '--json',
    );
    expect(r.code).toBe(0);
    const json = JSON.parse(r.stdout);
    expect(json.kappaSign).toBe(-1);
    expect(json.fieldMass).toBe(0.1);
    const lib = greybody({
      hole: { a: 0.5 },
      mode: { field: { spin: 0.5, mass: 0.1 }, l: 0.5, m: 0.5, kappaSign: -1 },
      omega: 0.3,
    });
    expect(json.gamma).toBe(lib.gamma);
  });

  test('--field-mass 0 gives the massless result exactly; ω ≤ μ and a missing --kappa-sign are errors naming the parameter', async () => {
    const massless = JSON.parse(
      (await run('greybody', '--spin', '1/2', '--l', '1/2', '--m', '1/2', '--a', '0', '--omega', '0.3', '--json')).stdout,
    );
    const zero = JSON.parse(
      (
        await run(
          'greybody',
          '--spin',
          '1/2',
          '--l',
          '1/2',
          '--m',
          '1/2',
          '--a',
          '0',
          '--omega',
          '0.3',
          '--field-mass',
          '0',
          '--json',
        )
      ).stdout,
    );
    expect(zero.gamma).toBe(massless.gamma);
    const below = await run(
      'greybody',
      '--spin',
      '1/2',
      '--l',
      '1/2',
      '--m',
      '1/2',
      '--a',
      '0',
      '--omega',
      '0.1',
      '--field-mass',
      '0.2',
      '--kappa-sign',
      '1',
    );
    expect(below.code).not.toBe(0);
    expect(below.stderr).toMatch(/omega/);
    const unsigned = await run(
      'greybody',
      '--spin',
      '1/2',
      '--l',
      '1/2',
      '--m',
      '1/2',
      '--a',
      '0',
      '--omega',
      '0.3',
      '--field-mass',
      '0.2',
    );
    expect(unsigned.code).not.toBe(0);
    expect(unsigned.stderr).toMatch(/kappa/i);
  });
});
