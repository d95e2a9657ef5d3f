import { spheroidalEigenvalue } from '@penumbra/spheroidal';
import { describe, expect, test } from 'vitest';
import { run } from './helpers.js';

describe('penumbra spheroidal', () => {
  test('--spin -2 --l 2 --m 2 --c 1.5 --json prints spin, l, m, c, A, E equal to the library value (A_{−2} = A_{+2} + 4, physics notes)', async () => {
    const result = await run('spheroidal', '--spin', '-2', '--l', '2', '--m', '2', '--c', '1.5', '--json');
    expect(result.code).toBe(0);
    expect(result.stderr).toBe('');
    const json = JSON.parse(result.stdout) as Record<string, unknown>;
    expect(Object.keys(json).slice(0, 6)).toEqual(['spin', 'l', 'm', 'c', 'A', 'E']);
    expect(json.spin).toBe(-2);
    expect(json.A).toBe(spheroidalEigenvalue({ s: -2, l: 2, m: 2, c: 1.5 }).A);
    const plus = spheroidalEigenvalue({ s: 2, l: 2, m: 2, c: 1.5 }).A;
    expect(Math.abs((json.A as number) - (plus + 4))).toBeLessThan(1e-13);
    expect(json.E).toBe((json.A as number) + 2);
    expect(json).not.toHaveProperty('lambda');
    expect(json).not.toHaveProperty('S');
  });

  test('--a and --omega give c = aω and λ = A + a²ω² − 2amω; spin accepts 1/2 and 0.5 alike', async () => {
    const a = await run('spheroidal', '--spin', '1/2', '--l', '1/2', '--m', '-0.5', '--a', '0.9', '--omega', '0.4', '--json');
    const b = await run('spheroidal', '--spin', '0.5', '--l', '0.5', '--m', '-1/2', '--a', '0.9', '--omega', '0.4', '--json');
    expect(a.code).toBe(0);
    expect(a.stdout).toBe(b.stdout);
    const json = JSON.parse(a.stdout) as { c: number; A: number; lambda: number; spin: number };
    expect(json.spin).toBe(0.5);
    expect(json.c).toBe(0.9 * 0.4);
    expect(json.lambda).toBe(json.A + 0.81 * 0.16 + 2 * 0.9 * 0.5 * 0.4);
  });

  test('--theta 0:3.14159:50 adds 50 samples of S and dS/dθ; at c = 0, s = m = 0, l = 1 they equal sqrt(3/2) cosθ (normalised Legendre P₁) to 1e-15', async () => {
    const result = await run(
      'spheroidal',
      '--spin',
      '0',
      '--l',
      '1',
      '--m',
      '0',
      '--c',
      '0',
      '--theta',
      '0:3.14159:50',
      '--json',
    );
    expect(result.code).toBe(0);
    const json = JSON.parse(result.stdout) as { S: { theta: number[]; S: number[]; dS: number[] } };
    expect(json.S.theta).toHaveLength(50);
    json.S.theta.forEach((theta, i) => {
      expect(Math.abs(json.S.S[i] - Math.sqrt(1.5) * Math.cos(theta))).toBeLessThan(1e-15);
      expect(Math.abs(json.S.dS[i] + Math.sqrt(1.5) * Math.sin(theta))).toBeLessThan(1e-15);
    });
  });

  test('prints a readable summary without --json', async () => {
    const result = await run('spheroidal', '--spin', '-1', '--l', '1', '--m', '0', '--c', '2');
    expect(result.code).toBe(0);
    expect(result.stdout).toMatch(/^A\s+-?\d/m);
  });

  test('bad input exits with code 2 and one line: spin 3/2, l < |s|, both --c and --a, missing --omega', async () => {
    for (const argv of [
      ['--spin', '3/2', '--l', '2', '--m', '0', '--c', '1'],
      ['--spin', '-2', '--l', '1', '--m', '0', '--c', '1'],
      ['--spin', '0', '--l', '1', '--m', '0', '--c', '1', '--a', '0.5', '--omega', '1'],
      ['--spin', '0', '--l', '1', '--m', '0', '--a', '0.5'],
    ]) {
      const result = await run('spheroidal', ...argv);
      expect(result.code).toBe(2);
      expect(result.stdout).toBe('');
      expect(result.stderr.trim().split('\n')).toHaveLength(1);
    }
  });
});
