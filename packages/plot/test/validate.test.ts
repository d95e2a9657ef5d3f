import { describe, expect, test } from 'vitest';
import { InputError } from '@penumbra/core';
import { renderSvg, validateFigure, type Figure } from '@penumbra/plot';

const line: Figure = {
  x: { title: 'x' },
  y: { title: 'y' },
  series: [
    {
      name: 's',
      points: [
        [1, 1],
        [2, 4],
      ],
    },
  ],
};

/** The parameter an InputError names, or the error itself if something else was thrown. */
function refusal(figure: unknown): unknown {
  try {
    validateFigure(figure);
  } catch (error) {
    return error instanceof InputError ? error.parameter : error;
  }
  return 'accepted';
}

describe('validateFigure', () => {
  test('returns a copy of a good figure', () => {
    const copy = validateFigure(line);
    expect(copy).toEqual(line);
    expect(copy).not.toBe(line);
  });

  test('refuses unknown keys, unknown scale names and missing titles with an InputError naming the key', () => {
    expect(refusal({ ...line, colour: 'red' })).toBe('figure.colour');
    expect(refusal({ ...line, x: { title: 'x', scal: 'log' } })).toBe('figure.x.scal');
    expect(refusal({ ...line, y: { title: 'y', scale: 'logarithmic' } })).toBe('figure.y.scale');
    expect(refusal({ ...line, x: { unit: 'M' } })).toBe('figure.x.title');
    expect(refusal({ ...line, legend: { position: 'left' } })).toBe('figure.legend.position');
    expect(refusal(null)).toBe('figure');
  });

  test('refuses non-finite and malformed points, naming the point', () => {
    expect(
      refusal({
        ...line,
        series: [
          {
            name: 's',
            points: [
              [1, 1],
              [2, NaN],
            ],
          },
        ],
      }),
    ).toBe('figure.series[0].points[1][1]');
    expect(refusal({ ...line, series: [{ name: 's', points: [[1, Infinity]] }] })).toBe('figure.series[0].points[0][1]');
    expect(refusal({ ...line, series: [{ name: 's', points: [[1, 2, 3]] }] })).toBe('figure.series[0].points[0]');
    expect(refusal({ ...line, series: [{ points: [] }] })).toBe('figure.series[0].name');
  });

  test('refuses values a log axis cannot show (zero or negative), including domain ends, band edges and rules', () => {
    const logY: Figure = { ...line, y: { title: 'y', scale: 'log' } };
    expect(refusal(logY)).toBe('accepted');
    expect(
      refusal({
        ...logY,
        series: [
          {
            name: 's',
            points: [
              [1, 1],
              [2, 0],
            ],
          },
        ],
      }),
    ).toBe('figure.series[0].points[1][1]');
    expect(refusal({ ...logY, rules: [{ y: -1, label: 'r' }] })).toBe('figure.rules[0].y');
    expect(refusal({ ...line, x: { title: 'x', scale: 'log', domain: [0, 1] } })).toBe('figure.x.domain[0]');
    expect(refusal({ ...line, x: { title: 'x', scale: 'log' }, band: [-1, 1] })).toBe('figure.band[0]');
    // a symmetric-log axis takes both signs
    expect(
      refusal({
        ...line,
        y: { title: 'y', scale: 'symlog' },
        series: [
          {
            name: 's',
            points: [
              [1, -1],
              [2, 0],
            ],
          },
        ],
      }),
    ).toBe('accepted');
  });

  test('requires exactly one of series and panels, and ranges with from < to', () => {
    expect(refusal({ x: line.x, y: line.y })).toBe('figure.series');
    expect(refusal({ ...line, panels: [{ title: 'p', series: [] }] })).toBe('figure.series');
    expect(refusal({ x: line.x, y: line.y, panels: [] })).toBe('figure.panels');
    expect(refusal({ ...line, x: { title: 'x', domain: [2, 1] } })).toBe('figure.x.domain');
  });

  test('renderSvg refuses a malformed figure before drawing it', async () => {
    await expect(
      renderSvg({ ...line, y: { title: 'y', scale: 'log' }, series: [{ name: 's', points: [[1, -1]] }] }),
    ).rejects.toThrow(InputError);
  });
});
