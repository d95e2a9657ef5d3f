import { readFileSync } from 'node:fs';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { pageLowFrequencyGamma } from './page-formula.js';

afterEach(() => vi.restoreAllMocks());

describe('README', () => {
  it('the example is examples/schwarzschild.ts verbatim; it runs and prints Γ for the photon, graviton and neutrino modes (graviton within 1 % of Page 1976)', async () => {
    const readme = readFileSync(new URL('../README.md', import.meta.url), 'utf8');
    const section = readme.slice(readme.indexOf('## Example'));
    const block = /```ts\n([\s\S]*?)```/.exec(section)?.[1];
    expect(block).toBe(readFileSync(new URL('../examples/schwarzschild.ts', import.meta.url), 'utf8'));
    const printed: string[] = [];
    vi.spyOn(console, 'log').mockImplementation((line: string) => void printed.push(line));
    await import('../examples/schwarzschild.js');
    expect(printed).toHaveLength(3);
    expect(printed[0]).toMatch(/^photon l=1: Γ = 0\.\d+/);
    const graviton = /^graviton l=2 at Mω = 1e-3: Γ = (\S+),/.exec(printed[1]);
    expect(graviton).not.toBeNull();
    // Within 1 % of the Page (1976) low-frequency formula (physics.md); the 1 + 2πMω correction is 0.6 %.
    expect(Math.abs(Number(graviton![1]) / pageLowFrequencyGamma(2, 2, 1e-3) - 1)).toBeLessThan(0.01);
    expect(printed[2]).toMatch(/^neutrino l=1\/2: Γ = 0\.\d+/);
  });
});
