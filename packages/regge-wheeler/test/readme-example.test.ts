import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import * as reggeWheeler from '@penumbra/regge-wheeler';
import { pageLowFrequencyGamma } from './page-formula.js';

const README = fileURLToPath(new URL('../README.md', import.meta.url));

describe('README', () => {
  it('the example under "## Example" runs and prints Γ for the photon and graviton modes (graviton within 1 % of Page 1976)', () => {
    const text = readFileSync(README, 'utf8');
    const section = text.slice(text.indexOf('## Example'));
    const match = /```ts\n([\s\S]*?)```/.exec(section);
    expect(match).not.toBeNull();
    const source = match![1];
    // The example imports by package name; supply the package's exports instead.
    const importLine = /^import \{([^}]*)\} from '@penumbra\/regge-wheeler';\n/m;
    const names = importLine.exec(source)![1].split(',').map((n) => n.trim()).filter(Boolean);
    const body = source.replace(importLine, '');
    const printed: string[] = [];
    const fakeConsole = { log: (...args: unknown[]) => printed.push(args.join(' ')) };
    const run = new Function('console', ...names, body) as (...args: unknown[]) => void;
    run(fakeConsole, ...names.map((n) => (reggeWheeler as Record<string, unknown>)[n]));
    expect(printed).toHaveLength(2);
    expect(printed[0]).toMatch(/^photon l=1: Γ = 0\.\d+/);
    const graviton = /^graviton l=2 at Mω = 1e-3: Γ = (\S+),/.exec(printed[1]);
    expect(graviton).not.toBeNull();
    // Within 1 % of the Page (1976) low-frequency formula (physics.md); the 1 + 2πMω correction is 0.6 %.
    expect(Math.abs(Number(graviton![1]) / pageLowFrequencyGamma(2, 2, 1e-3) - 1)).toBeLessThan(0.01);
  });
});
