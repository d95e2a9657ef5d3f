import { describe, expect, test } from 'vitest';
import { greybody } from '@penumbra/flux';
import { run } from './helpers.js';

describe('penumbra greybody for a massive vector (--field-mass, --polarization)', () => {
  test('JSON names the polarisation and field mass computed, and equals the library result exactly', async () => {
    const r = await run(
      ...['greybody', '--spin', '1', '--l', '1', '--m', '0', '--a', '0', '--omega', '0.3'],
      ...['--field-mass', '0.1', '--polarization', 'even-2', '--json'],
    );
    expect(r.code).toBe(0);
    const json = JSON.parse(r.stdout);
    expect(json.polarization).toBe('even-2');
    expect(json.fieldMass).toBe(0.1);
    const lib = greybody(
      { hole: { a: 0 }, mode: { field: { spin: 1, mass: 0.1 }, l: 1, m: 0 }, omega: 0.3 },
      { polarization: 'even-2' },
    );
    expect(json.gamma).toBe(lib.gamma);
  });
  test('a ≠ 0 exits 2 naming hole.a; ω ≤ μ exits 2 naming omega; an unknown polarisation exits 2 naming it', async () => {
    const base = ['greybody', '--spin', '1', '--l', '1', '--m', '0', '--json'];
    const kerr = await run(...base, '--a', '0.5', '--omega', '0.3', '--field-mass', '0.1');
    expect(kerr.code).toBe(2);
    expect(kerr.stderr).toMatch(/hole\.a/);
    const bound = await run(...base, '--a', '0', '--omega', '0.1', '--field-mass', '0.2');
    expect(bound.code).toBe(2);
    expect(bound.stderr).toMatch(/omega.*no wave reaches infinity/);
    const bogus = await run(...base, '--a', '0', '--omega', '0.3', '--field-mass', '0.1', '--polarization', 'tensor');
    expect(bogus.code).toBe(2);
    expect(bogus.stderr).toMatch(/polarization/);
  });
});
