import { describe, expect, test } from 'vitest';
import { run } from './helpers.js';

describe('penumbra near-region', () => {
  test('--json gives TL, TR, cL, cR, gammaNearRegion, gamma, ratio; T_L = (r+ + r−)/(4πa) to 1e-15 (Castro, Maloney & Strominger 2010) and ratio within 1 % of one at Mω = 1e-3', async () => {
    const result = await run(
      'near-region',
      '--spin',
      '0',
      '--l',
      '1',
      '--m',
      '1',
      '--a',
      '0.5',
      '--omega',
      '1e-3',
      '--tol',
      '1e-6',
      '--json',
    );
    expect(result.code).toBe(0);
    const out = JSON.parse(result.stdout);
    for (const key of ['TL', 'TR', 'cL', 'cR', 'gammaNearRegion', 'gamma', 'ratio', 'hL', 'hR', 'omegaL', 'omegaR'])
      expect(out).toHaveProperty(key);
    const rPlus = 1 + Math.sqrt(0.75);
    expect(Math.abs(out.TL / ((rPlus + 0.25 / rPlus) / (2 * Math.PI)) - 1)).toBeLessThan(1e-15);
    expect(out.cL).toBe(6);
    expect([out.hL, out.hR]).toEqual([2, 2]);
    expect(Math.abs(out.ratio - 1)).toBeLessThan(0.01);
  });

  test('text output carries the temperatures, weights and the ratio; --csv has units in the header', async () => {
    const text = await run(
      'near-region',
      '--spin',
      '1/2',
      '--l',
      '1/2',
      '--m',
      '1/2',
      '--a',
      '0.9',
      '--omega',
      '1e-3',
      '--tol',
      '1e-4',
    );
    expect(text.code).toBe(0);
    expect(text.stdout).toMatch(/T_L = 0\.17683\d+, T_R = 0\.07708\d+/);
    expect(text.stdout).toContain('(h_L, h_R) = (1, 1.5); Boltzmann factor through cosh');
    expect(text.stdout).toContain('Γ_near/Γ');
    const csv = await run(
      'near-region',
      '--spin',
      '2',
      '--l',
      '2',
      '--m',
      '2',
      '--a',
      '0.9',
      '--omega',
      '1e-3:1e-2:2',
      '--tol',
      '1e-4',
      '--csv',
    );
    expect(csv.code).toBe(0);
    const lines = csv.stdout.trim().split('\n');
    expect(lines[0]).toMatch(/^spin \[1\],l \[1\],m \[1\],a \[M\],omega \[1\/M\],TL \[1\],TR \[1\],/);
    expect(lines).toHaveLength(3);
  });

  test('a = 0 and a < 0 exit 2 with one line naming hole.a; a missing --omega names the option', async () => {
    for (const a of ['0', '-0.5']) {
      const result = await run('near-region', '--spin', '0', '--l', '0', '--m', '0', '--a', a, '--omega', '0.01');
      expect(result.code).toBe(2);
      expect(result.stderr).toMatch(/^penumbra: invalid hole\.a = [^\n]*\n$/);
    }
    const missing = await run('near-region', '--spin', '0', '--l', '0', '--m', '0', '--a', '0.5');
    expect(missing.code).toBe(2);
    expect(missing.stderr).toContain('--omega');
  });
});
