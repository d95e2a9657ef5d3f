import { describe, expect, test } from 'vitest';
import { run } from './helpers.js';

const relativeError = (value: number, reference: number) => Math.abs(value - reference) / Math.abs(reference);

describe('penumbra kerr', () => {
  test('--a 0.9 --json prints one JSON object with exactly rPlus, rMinus, omegaH, kappa, temperature, area, entropy, matching the closed forms to 1e-15 relative (Bardeen, Press & Teukolsky, ApJ 178, 347 (1972))', async () => {
    const result = await run('kerr', '--a', '0.9', '--json');
    expect(result.code).toBe(0);
    expect(result.stderr).toBe('');
    const json = JSON.parse(result.stdout) as Record<string, number>;
    expect(Object.keys(json)).toEqual(['rPlus', 'rMinus', 'omegaH', 'kappa', 'temperature', 'area', 'entropy']);
    const root = Math.sqrt(0.19);
    const rPlus = 1 + root;
    expect(relativeError(json.rPlus, rPlus)).toBeLessThan(1e-15);
    expect(relativeError(json.rMinus, 1 - root)).toBeLessThan(1e-15);
    expect(relativeError(json.omegaH, 0.9 / (2 * rPlus))).toBeLessThan(1e-15);
    expect(relativeError(json.kappa, root / (2 * rPlus))).toBeLessThan(1e-15);
    expect(relativeError(json.temperature, root / (4 * Math.PI * rPlus))).toBeLessThan(1e-15);
    expect(relativeError(json.area, 8 * Math.PI * rPlus)).toBeLessThan(1e-15);
    expect(relativeError(json.entropy, 2 * Math.PI * rPlus)).toBeLessThan(1e-15);
  });

  test('--a 0 --mass 1e15 --unit g --json adds "physical" with T_H ≈ 10.6 MeV to 5e-3 relative (well-known figure)', async () => {
    const result = await run('kerr', '--a', '0', '--mass', '1e15', '--unit', 'g', '--json');
    expect(result.code).toBe(0);
    const json = JSON.parse(result.stdout) as { rPlus: number; physical: Record<string, number | string> };
    expect(json.rPlus).toBe(2);
    expect(json.physical.unit).toBe('g');
    expect(json.physical.massGrams).toBe(1e15);
    expect(relativeError(json.physical.temperatureGeV as number, 10.6e-3)).toBeLessThan(5e-3);
  });

  test('--a 0 --mass 1 --unit msun prints T_H ≈ 6.17e-8 K (well-known figure, 3 figures)', async () => {
    const result = await run('kerr', '--a', '0', '--mass', '1', '--unit', 'msun');
    expect(result.code).toBe(0);
    expect(result.stdout).toMatch(/Hawking temperature\s+6\.17\d*e-8\s+K/);
  });

  test('human-readable output by default names each quantity with its value (a = 0.9: r+ = 1 + √0.19)', async () => {
    const result = await run('kerr', '--a', '0.9');
    expect(result.code).toBe(0);
    expect(result.stdout).toContain('Kerr hole with a = 0.9 M');
    expect(result.stdout).toMatch(new RegExp(`outer horizon\\s+r\\+\\s+${(1 + Math.sqrt(0.19)).toPrecision(10)}`));
    for (const label of [
      'inner horizon',
      'horizon angular velocity',
      'surface gravity',
      'Hawking temperature',
      'horizon area',
      'entropy',
    ]) {
      expect(result.stdout).toContain(label);
    }
  });

  test('a negative a is read as a value (--a -0.9 gives Ω_H < 0 and the same r+ as a = 0.9)', async () => {
    const negative = JSON.parse((await run('kerr', '--a', '-0.9', '--json')).stdout) as Record<string, number>;
    const positive = JSON.parse((await run('kerr', '--a=0.9', '--json')).stdout) as Record<string, number>;
    expect(negative.rPlus).toBe(positive.rPlus);
    expect(negative.omegaH).toBe(-positive.omegaH);
  });

  test('--unit geometric takes the geometric mass: --a 0.5 --mass 2 gives r+ = 2(1 + √0.75) to 1e-15 relative', async () => {
    const json = JSON.parse((await run('kerr', '--a', '0.5', '--mass', '2', '--unit', 'geometric', '--json')).stdout) as Record<
      string,
      number
    >;
    expect(relativeError(json.rPlus, 2 * (1 + Math.sqrt(0.75)))).toBeLessThan(1e-15);
  });

  test('--a 1.2 is refused with one line naming the allowed range and the extremal limit, exit code 2', async () => {
    const result = await run('kerr', '--a', '1.2');
    expect(result.code).toBe(2);
    expect(result.stdout).toBe('');
    expect(result.stderr).toMatch(/^penumbra: invalid a = 1\.2: allowed \|a\| < M = 1 \([^\n]*extremal[^\n]*limit[^\n]*\)\n$/);
  });

  test.each([
    [['kerr', '--a', '1'], /invalid a = 1: .*extremal/],
    [['kerr'], /missing --a/],
    [['kerr', '--a', 'abc'], /--a expects a finite number, got 'abc'/],
    [['kerr', '--a', 'NaN'], /--a expects a finite number/],
    [['kerr', '--a', '0.5', '--unit', 'g'], /--unit needs --mass/],
    [['kerr', '--a', '0.5', '--mass', '1', '--unit', 'lb'], /--unit expects one of g, kg, msun, geometric, got 'lb'/],
    [['kerr', '--a', '0.5', '--mass', '-3', '--unit', 'g'], /--mass must be > 0, got -3/],
    [['kerr', '--a', '0.5', '--mass', '0', '--unit', 'geometric'], /--mass must be > 0/],
    [
      ['kerr', '--a', '0.5', '--mass', '2'],
      /^penumbra: --mass needs --unit \(g, kg, msun, geometric\): a mass without its unit is ambiguous/,
    ],
    [
      ['kerr', '--a', '0.5', '--mass', '1e155', '--unit', 'geometric', '--json'],
      /^penumbra: --mass must be in 1e-150 ≤ mass ≤ 1e\+150 \(geometric units\), got 1e155/,
    ],
    [['kerr', '--a', '0.5', '--mass', '1e300', '--unit', 'g', '--json'], /--mass must be in 1e-97 ≤ mass ≤ 1e\+103 g, got 1e300/],
    [['kerr', '--a', '0.5', '--mass', '1e-300', '--unit', 'kg'], /--mass must be in 1e-100 ≤ mass ≤ 1e\+100 kg/],
    [['kerr', '--a', '0.5', '--mass', '1e300', '--unit', 'msun'], /--mass must be in 5\.03e-131 ≤ mass ≤ 5\.03e\+69 msun/],
    [['kerr', '--a', '0.5', '--spin', '2'], /unknown option '--spin'/],
    [['kerr', '--a'], /argument missing/],
    [['kerr', '--a', '0.5', 'extra'], /unexpected argument 'extra'/i],
  ])('%j is refused with one line on stderr and exit code 2', async (argv, pattern) => {
    const result = await run(...argv);
    expect(result.code).toBe(2);
    expect(result.stderr).toMatch(/^penumbra: [^\n]+\n$/);
    expect(result.stderr).toMatch(pattern);
  });
});
