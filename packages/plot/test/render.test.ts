import { describe, expect, test } from 'vitest';
import fc from 'fast-check';
import { renderSvg, type Figure } from '@penumbra/plot';
import { vegaLiteSpec } from '../src/internal.js';
import { xmlProblems } from './xml.js';

/** The text content of every <text> element, entities left as written. */
const texts = (svg: string) => [...svg.matchAll(/<text[^>]*>([^<]*)<\/text>/g)].map((m) => m[1]);
const count = (svg: string, pattern: RegExp) => (svg.match(pattern) ?? []).length;

const powerLaws: Figure = {
  title: 'Power laws',
  subtitle: 'two series',
  x: { title: 'ω', unit: '1/M', scale: 'log' },
  y: { title: 'σ_abs', unit: 'M²', scale: 'log', format: '.0e' },
  series: [
    {
      name: 'ω²',
      points: [
        [0.1, 0.01],
        [1, 1],
        [10, 100],
      ],
    },
    {
      name: 'ω³',
      points: [
        [0.1, 0.001],
        [1, 1],
        [10, 1000],
      ],
    },
  ],
  legend: { title: 'law' },
  markers: true,
};

describe('renderSvg', () => {
  test('draws a one-chart figure as one well-formed SVG document with its title, subtitle, axis titles with units and every series in the legend', async () => {
    const svg = await renderSvg(powerLaws);
    expect(xmlProblems(svg)).toEqual([]);
    expect(svg.startsWith('<svg')).toBe(true);
    const labels = texts(svg);
    for (const text of ['Power laws', 'two series', 'ω [1/M]', 'σ_abs [M²]', 'law', 'ω²', 'ω³']) expect(labels).toContain(text);
    // markers: one symbol per point
    expect(count(svg, /aria-roledescription="point"/g)).toBe(6);
    // log axes labelled in the requested format
    expect(labels).toContain('1e+3');
    expect(labels).toContain('1e-3');
  });

  test('escapes markup in names and titles, so any text gives well-formed XML (property, 15 random figures)', async () => {
    const label = fc.string({
      unit: fc.constantFrom('a', 'Γ', ' ', '&', '<', '>', '"', "'", 'ω', '²'),
      minLength: 1,
      maxLength: 8,
    });
    await fc.assert(
      fc.asyncProperty(label, label, label, async (title, name, axis) => {
        const svg = await renderSvg({
          title,
          x: { title: axis },
          y: { title: 'y' },
          series: [
            {
              name,
              points: [
                [0, 1],
                [1, 2],
              ],
            },
          ],
        });
        expect(xmlProblems(svg)).toEqual([]);
      }),
      { numRuns: 15 },
    );
  });

  test('gives equal bytes for equal figures, whatever was drawn before (clip ids renumbered per figure)', async () => {
    const clipped: Figure = { ...powerLaws, clip: true };
    const first = await renderSvg(clipped);
    await renderSvg({ ...clipped, title: 'another figure in between' });
    expect(await renderSvg(clipped)).toBe(first);
    expect(first).toContain('clip-path="url(#clip1)"');
  });

  test('labels a symmetric-log axis with signed powers of ten, zero and the rounded-out ends, across the data', async () => {
    const svg = await renderSvg({
      x: { title: 'ω' },
      y: { title: 'Γ', scale: 'symlog', format: '.0e' },
      series: [
        {
          name: 'Γ',
          points: [
            [0, -0.002],
            [1, 0.3],
            [2, 1],
          ],
        },
      ],
    });
    expect(xmlProblems(svg)).toEqual([]);
    const labels = texts(svg);
    // the data run from −0.002 to 1: the domain is [−0.002, 1], the linear width 0.002
    for (const tick of ['−2e-3', '0e+0', '1e-2', '1e-1', '1e+0']) expect(labels).toContain(tick);
  });

  test('labels log and symmetric-log ticks with superscript powers of ten and a true minus sign when no format is given', async () => {
    const svg = await renderSvg({
      x: { title: 'ω' },
      y: { title: 'Γ', scale: 'symlog' },
      series: [
        {
          name: 'Γ',
          points: [
            [0, -0.555],
            [1, -1e-6],
            [2, 1],
          ],
        },
      ],
    });
    const labels = texts(svg);
    for (const tick of ['−0.6', '−0.1', '−0.01', '−0.001', '−10⁻⁴', '−10⁻⁵', '0', '1']) expect(labels).toContain(tick);
  });

  test('draws dash groups with a legend of their own, in the order asked for', async () => {
    const figure: Figure = {
      x: { title: 'x' },
      y: { title: 'y' },
      series: [
        {
          name: 'l = 1',
          dash: 'm = −l',
          points: [
            [0, 1],
            [1, 2],
          ],
        },
        {
          name: 'l = 1',
          dash: 'm = +l',
          points: [
            [0, 2],
            [1, 3],
          ],
        },
      ],
      legend: { dashes: ['m = +l', 'm = −l'] },
    };
    const spec = vegaLiteSpec(figure) as { encoding: { strokeDash: { sort: string[] } } };
    expect(spec.encoding.strokeDash.sort).toEqual(['m = +l', 'm = −l']);
    const svg = await renderSvg(figure);
    expect(xmlProblems(svg)).toEqual([]);
    expect(svg).toContain('Symbol legend for strokeDash with 2 values: m = +l, m = −l');
  });

  test('joins points by x unless asked to keep their order', () => {
    const lines: Figure = {
      x: { title: 'x' },
      y: { title: 'y' },
      series: [
        {
          name: 's',
          points: [
            [2, 1],
            [1, 2],
            [3, 3],
          ],
        },
      ],
    };
    const byX = vegaLiteSpec(lines) as { encoding: Record<string, unknown> };
    const given = vegaLiteSpec({ ...lines, join: 'given' }) as {
      encoding: Record<string, unknown>;
      data: { values: { order: number }[] };
    };
    expect(byX.encoding.order).toBeUndefined();
    expect(given.encoding.order).toEqual({ field: 'order', type: 'quantitative' });
    expect(given.data.values.map((v) => v.order)).toEqual([0, 1, 2]);
  });

  test('draws a band, a guide and labelled rules as layers under and over the lines', async () => {
    const figure: Figure = {
      x: { title: 'x', scale: 'log' },
      y: { title: 'y', scale: 'log' },
      series: [
        {
          name: 's',
          points: [
            [1e-3, 2e-3],
            [1e-1, 5e-2],
          ],
        },
      ],
      band: [1e-2, 1e-1],
      guide: [
        [1e-3, 1e-3],
        [1e-1, 1e-1],
      ],
      rules: [{ y: 0.03, label: 'a reference level' }],
    };
    const spec = vegaLiteSpec(figure) as { layer: { mark?: { type: string } }[] };
    expect(spec.layer.map((l) => l.mark?.type ?? 'layers')).toEqual(['layers', 'line', 'line', 'layers']);
    const svg = await renderSvg(figure);
    expect(xmlProblems(svg)).toEqual([]);
    expect(svg).toContain('fill="#fbe3b8"');
    expect(texts(svg)).toContain('a reference level');
  });

  test('draws panels that differ only in their series as one facet (panel titles as headers), and panels with their own y range as separate charts', async () => {
    const panels = [
      {
        title: 'a = 0',
        series: [
          {
            name: 's',
            points: [
              [0, 1],
              [1, 2],
            ] as [number, number][],
          },
        ],
      },
      {
        title: 'a = 0.99',
        series: [
          {
            name: 's',
            points: [
              [0, 3],
              [1, 1],
            ] as [number, number][],
          },
        ],
      },
    ];
    const shared: Figure = { title: 'Panels', x: { title: 'Mω' }, y: { title: 'Γ' }, panels, width: 200, height: 150 };
    expect(Object.keys(vegaLiteSpec(shared))).toContain('facet');
    const own: Figure = { ...shared, panels: panels.map((p, i) => ({ ...p, yDomain: [0, 4 + i] as [number, number] })) };
    const concat = vegaLiteSpec(own) as { hconcat: unknown[]; resolve: unknown };
    expect(concat.hconcat).toHaveLength(2);
    expect(concat.resolve).toEqual({ scale: { y: 'independent' } });
    for (const figure of [shared, own]) {
      const svg = await renderSvg(figure);
      expect(xmlProblems(svg)).toEqual([]);
      const labels = texts(svg);
      expect(labels).toContain('a = 0');
      expect(labels).toContain('a = 0.99');
      // the facet draws the y axis title once; separate charts once each
      expect(labels.filter((t) => t === 'Γ')).toHaveLength(figure === shared ? 1 : 2);
    }
  });

  test("the 'report' style sets the report's font; the 'plain' style has penumbra's own (DejaVu Sans first)", async () => {
    const plain = await renderSvg(powerLaws);
    const report = await renderSvg({ ...powerLaws, style: 'report' });
    expect(report).toContain('font-family="Helvetica, Arial, sans-serif"');
    expect(plain).toContain('font-family="DejaVu Sans, Helvetica, Arial, sans-serif"');
  });
});

describe('xmlProblems (the well-formedness check the tests above rely on)', () => {
  test('accepts a small well-formed document and rejects broken nesting, bare ampersands, duplicate attributes and a second root', () => {
    expect(xmlProblems('<svg a="1"><g><text>x &amp; y</text></g><path d="M0"/></svg>')).toEqual([]);
    expect(xmlProblems('<svg><g></svg></g>')).not.toEqual([]);
    expect(xmlProblems('<svg><text>x & y</text></svg>')).not.toEqual([]);
    expect(xmlProblems('<svg a="1" a="2"></svg>')).not.toEqual([]);
    expect(xmlProblems('<svg></svg><svg></svg>')).not.toEqual([]);
    expect(xmlProblems('<svg a=1></svg>')).not.toEqual([]);
    expect(xmlProblems('<svg>')).not.toEqual([]);
  });
});
