import { radialSeparationConstant, spheroidalHarmonic } from '@penumbra/spheroidal';
import { UsageError, type Command } from '../command.js';
import { limitsHelp } from '../limits.js';
import { formatNumber } from '../format.js';
import { parseFieldSpin, parseModeNumber, parseNumber, parseOptions, parseRange, requireOption } from '../options.js';
import { JSON_OPTION, outputFormat, writeOutput } from '../output.js';

/** `penumbra spheroidal`. */
export const command: Command = {
  name: 'spheroidal',
  summary: 'spin-weighted spheroidal eigenvalue A, E, λ and harmonic S(θ) of one mode',
  usage: `Usage: penumbra spheroidal --spin S --l L --m M (--c C | --a A --omega W) [--theta START:STOP:COUNT] [--json]

Options:
  --spin S       spin weight: 0, ±1/2 (or ±0.5), ±1, ±2
  --l L          multipole, l ≥ |s|, l − s an integer
  --m M          azimuthal number, |m| ≤ l, m − s an integer
  --c C          spheroidicity c = aω (real)
  --a A          the hole's spin parameter a (with --omega, instead of --c);
                 adds λ = A + a²ω² − 2amω
  --omega W      frequency ω (with --a)
  --theta GRID   sample S(θ) and dS/dθ on START:STOP:COUNT (or one angle), 0 ≤ θ ≤ π
  --json         one JSON object with keys spin, l, m, c, A, lambda (with --a/--omega),
                 E, diagnostics, and S = { theta, S, dS } with --theta
  -h, --help     this text

S is normalised to ∫|S|² sinθ dθ = 1 and S/(sin^|m+s|(θ/2) cos^|m−s|(θ/2)) > 0 at θ = 0.

${limitsHelp(['l', 'tol'])}
Examples:
  penumbra spheroidal --spin -2 --l 2 --m 2 --c 1.5 --json
  penumbra spheroidal --spin 1/2 --l 1.5 --m 0.5 --a 0.9 --omega 0.4 --theta 0:3.14159:5
`,
  run(argv, io) {
    const { values } = parseOptions(argv, {
      spin: { type: 'string' },
      l: { type: 'string' },
      m: { type: 'string' },
      c: { type: 'string' },
      a: { type: 'string' },
      omega: { type: 'string' },
      theta: { type: 'string' },
      ...JSON_OPTION,
    });
    const format = outputFormat(values);
    const spin = parseFieldSpin('--spin', requireOption(values.spin, '--spin', 'the spin weight'), { allowNegative: true });
    const l = parseModeNumber('--l', requireOption(values.l, '--l', 'the multipole'));
    const m = parseModeNumber('--m', requireOption(values.m, '--m', 'the azimuthal number'));
    let c: number;
    let hole: { a: number; omega: number } | undefined;
    if (values.c !== undefined) {
      if (values.a !== undefined || values.omega !== undefined)
        throw new UsageError('give either --c or --a with --omega, not both');
      c = parseNumber('--c', values.c);
    } else {
      const a = parseNumber('--a', requireOption(values.a, '--a', "the hole's a; or give --c"));
      const omega = parseNumber('--omega', requireOption(values.omega, '--omega', 'the frequency'));
      hole = { a, omega };
      c = a * omega;
    }
    const thetas = values.theta === undefined ? undefined : parseRange('--theta', values.theta, { min: 0, max: Math.PI }).values;

    const harmonic = spheroidalHarmonic({ s: spin, l, m, c });
    const lambda = hole ? radialSeparationConstant(harmonic.A, hole.a, hole.omega, m) : undefined;
    const samples = thetas ? harmonic.sample(thetas) : undefined;
    const json = () => ({
      spin,
      l,
      m,
      c,
      A: harmonic.A,
      ...(lambda !== undefined ? { lambda } : {}),
      E: harmonic.E,
      diagnostics: harmonic.diagnostics,
      ...(samples && thetas ? { S: { theta: thetas, S: Array.from(samples.S), dS: Array.from(samples.dS) } } : {}),
    });
    const text = () => {
      const lines = [
        `spin weight s   ${spin}`,
        `l, m            ${l}, ${m}`,
        `c = aω          ${formatNumber(c, 15)}`,
        `A               ${formatNumber(harmonic.A, 15)}`,
        ...(lambda !== undefined ? [`λ               ${formatNumber(lambda, 15)}`] : []),
        `E = A + s(s+1)  ${formatNumber(harmonic.E, 15)}`,
        `method          ${harmonic.diagnostics.method} (${harmonic.diagnostics.truncation} terms)`,
      ];
      if (samples && thetas) {
        lines.push('', 'θ                 S(θ)              dS/dθ');
        thetas.forEach((theta, i) => {
          lines.push(
            `${formatNumber(theta, 8).padEnd(18)}${formatNumber(samples.S[i], 12).padEnd(18)}${formatNumber(samples.dS[i], 12)}`,
          );
        });
      }
      return lines.join('\n') + '\n';
    };
    writeOutput(io, format, { json, text });
    return 0;
  },
};
