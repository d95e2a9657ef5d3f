import { describe, expect, test } from 'vitest';
import fc from 'fast-check';
import { InputError, linearGrid, logGrid } from '@penumbra/core';
import { UsageError } from '@penumbra/cli';
import {
  formatError,
  formatNumber,
  formatTable,
  outputFormat,
  parseFieldSpin,
  parseHoleA,
  parseMassUnit,
  parseModeNumber,
  parseNumber,
  parseNumberList,
  parseOptions,
  parseRange,
  requireOption,
} from '@penumbra/cli/internal';

describe('CLI parsing helpers', () => {
  test('parseOptions is strict and reads negative numbers after string options as values', () => {
    const options = { a: { type: 'string' }, omega: { type: 'string', short: 'w' }, json: { type: 'boolean' } } as const;
    const { values } = parseOptions(['--a', '-0.9', '-w', '-.5', '--json'], options);
    expect(values).toEqual({ a: '-0.9', omega: '-.5', json: true });
    expect(() => parseOptions(['--nope'], options)).toThrow(UsageError);
    expect(() => parseOptions(['stray'], options)).toThrow(/unexpected argument 'stray'/i);
    expect(parseOptions(['stray'], options, true).positionals).toEqual(['stray']);
  });

  test('parseNumber and parseFieldSpin accept only decimal numbers: no hex, binary, octal, Infinity, empty or blank text', () => {
    for (const text of ['0x1', '0b1', '0o1', 'Infinity', '-Infinity', '', '   ', '1e', '.', '+', '1_000', '1.2.3', 'e5', 'NaN']) {
      expect(() => parseNumber('--x', text), text).toThrow(UsageError);
      expect(() => parseFieldSpin('--spin', text), text).toThrow(UsageError);
    }
    expect(() => parseFieldSpin('--spin', '0x1')).toThrow('--spin expects a field spin');
    for (const [text, value] of [
      ['1', 1],
      ['-2.5', -2.5],
      ['+.5', 0.5],
      ['3.', 3],
      ['1e-3', 1e-3],
      ['2E+2', 200],
      [' 7 ', 7],
    ] as const)
      expect(parseNumber('--x', text)).toBe(value);
    expect(parseFieldSpin('--spin', '1/2')).toBe(0.5);
    expect(parseFieldSpin('--spin', '-2', { allowNegative: true })).toBe(-2);
  });

  test('parseNumber accepts finite numbers within the constraints and names the option otherwise', () => {
    expect(parseNumber('--x', ' 1e15 ')).toBe(1e15);
    expect(parseNumber('--l', '3', { min: 0, integer: true })).toBe(3);
    expect(() => parseNumber('--x', '')).toThrow("--x expects a finite number, got ''");
    expect(() => parseNumber('--x', 'Infinity')).toThrow(UsageError);
    expect(() => parseNumber('--l', '2.5', { integer: true })).toThrow('--l expects an integer');
    expect(() => parseNumber('--x', '0', { min: 0, exclusive: true })).toThrow('--x must be > 0, got 0');
    expect(() => parseNumber('--x', '5', { min: 0, max: 4 })).toThrow('--x must be ≥ 0 and ≤ 4, got 5');
    expect(parseNumberList('--l', '0,1, 2')).toEqual([0, 1, 2]);
    expect(() => parseNumberList('--l', '0,,2')).toThrow(UsageError);
  });

  test('parseHoleA refuses |a/M| ≥ 1 with the InputError of kerrHole', () => {
    expect(parseHoleA('--a', '-0.99')).toBe(-0.99);
    expect(() => parseHoleA('--a', '1')).toThrow(InputError);
    expect(() => parseHoleA('--a', 'x')).toThrow(UsageError);
  });

  test("parseFieldSpin reads core's field spins 0, 1/2 (or 0.5), 1, 2 (also as 1.0 or 1 / 2) and signs only when allowed; core's InputError becomes a UsageError naming the option", () => {
    expect(parseFieldSpin('--s', '1/2')).toBe(0.5);
    expect(parseFieldSpin('--s', ' 1 / 2 ')).toBe(0.5);
    expect(parseFieldSpin('--s', '0.5')).toBe(0.5);
    expect(parseFieldSpin('--s', '2')).toBe(2);
    expect(parseFieldSpin('--s', '1.0')).toBe(1);
    expect(parseFieldSpin('--s', '-1/2', { allowNegative: true })).toBe(-0.5);
    expect(parseFieldSpin('--s', '+2', { allowNegative: true })).toBe(2);
    expect(Object.is(parseFieldSpin('--s', '-0', { allowNegative: true }), 0)).toBe(true);
    expect(() => parseFieldSpin('--s', '-1')).toThrow("--s expects a field spin {0, 1/2, 1, 2}, got '-1'");
    expect(() => parseFieldSpin('--s', '3/2', { allowNegative: true })).toThrow(
      "--s expects a field spin ±{0, 1/2, 1, 2}, got '3/2'",
    );
    for (const bad of ['', 'x', '3', '1/3', '--1'])
      expect(() => parseFieldSpin('--s', bad, { allowNegative: true })).toThrow(UsageError);
  });

  test('parseModeNumber reads integers and half-integers (3/2, -1/2, 1.5) and refuses quarters', () => {
    expect(parseModeNumber('--m', '-1/2')).toBe(-0.5);
    expect(parseModeNumber('--l', '1.5')).toBe(1.5);
    expect(Object.is(parseModeNumber('--m', '-0'), 0)).toBe(true);
    expect(() => parseModeNumber('--m', '0.25')).toThrow('--m expects an integer or half-integer');
  });

  test('outputFormat: text by default, --json or --csv, and both at once refused with one UsageError line', () => {
    expect(outputFormat({})).toBe('text');
    expect(outputFormat({ json: true })).toBe('json');
    expect(outputFormat({ csv: true, json: false })).toBe('csv');
    expect(() => outputFormat({ json: true, csv: true })).toThrow(new UsageError('choose one of --json and --csv'));
  });

  test("parseRange grids are core's linearGrid and logGrid, bit for bit", () => {
    expect(parseRange('--w', '0.1:0.7:7').values).toEqual(linearGrid(0.1, 0.7, 7));
    expect(parseRange('--w', '0.01:2:40', { log: true }).values).toEqual(logGrid(0.01, 2, 40));
  });

  test('parseRange reads START:STOP:COUNT with both endpoints exact, or a single value', () => {
    expect(parseRange('--w', '0.1:0.5:5').values.map((v) => Number(v.toFixed(12)))).toEqual([0.1, 0.2, 0.3, 0.4, 0.5]);
    expect(parseRange('--w', '0.25')).toEqual({ start: 0.25, stop: 0.25, count: 1, values: [0.25] });
    const log = parseRange('--w', '1e-3:1e1:5', { log: true }).values;
    expect(log[0]).toBe(1e-3);
    expect(log[4]).toBe(10);
    expect(Math.abs(log[2] / 0.1 - 1)).toBeLessThan(1e-14);
    expect(() => parseRange('--w', '1:2')).toThrow('--w expects START:STOP:COUNT or a single value');
    expect(() => parseRange('--w', '1:2:1')).toThrow('COUNT ≥ 2');
    expect(() => parseRange('--w', '1:2:2.5')).toThrow('--w COUNT expects an integer');
    expect(() => parseRange('--w', '0:2:3', { log: true })).toThrow(UsageError);
    expect(() => parseRange('--w', '-1:2:3', { min: 0 })).toThrow('--w must be ≥ 0');
  });

  test('parseRange grids are monotone with the requested count and exact endpoints (property)', () => {
    fc.assert(
      fc.property(
        // −0 prints as "0"; the grid is about values, so fold it into +0
        fc.double({ min: -1e3, max: 1e3, noNaN: true }).map((x) => (x === 0 ? 0 : x)),
        fc.double({ min: -1e3, max: 1e3, noNaN: true }).map((x) => (x === 0 ? 0 : x)),
        fc.integer({ min: 2, max: 200 }),
        (start, stop, count) => {
          const { values } = parseRange('--x', `${start}:${stop}:${count}`);
          expect(values).toHaveLength(count);
          expect(values[0]).toBe(start);
          expect(values[count - 1]).toBe(stop);
          const sign = Math.sign(stop - start);
          for (let i = 1; i < count; i++) expect(Math.sign(values[i] - values[i - 1]) * sign).toBeGreaterThanOrEqual(0);
        },
      ),
    );
  });

  test('parseMassUnit, requireOption, formatNumber, formatError and formatTable', () => {
    expect(parseMassUnit('--unit', 'msun')).toBe('msun');
    expect(() => parseMassUnit('--unit', 'lb')).toThrow(UsageError);
    expect(() => requireOption(undefined, '--a', "the hole's a/M")).toThrow("missing --a (the hole's a/M)");
    expect(formatNumber(1.4358898943540672)).toBe('1.435889894');
    expect(formatNumber(1e15)).toBe('1e15');
    expect(formatNumber(6.419008487e-3, 4)).toBe('0.006419');
    expect(formatNumber(2.4771004309650325e-24, 4)).toBe('2.477e-24');
    expect(formatError(3.24e-9)).toBe('3.2e-9');
    expect(
      formatTable([
        ['a', 'bb'],
        ['ccc', 'd', 'e'],
      ]),
    ).toBe('  a    bb\n  ccc  d   e\n');
  });
});
