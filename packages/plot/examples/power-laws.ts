import { autoScale, renderSvg, type Figure } from '@penumbra/plot';

// Two power laws over three decades of ω (geometric units, M = 1).
const omegas = [0.01, 0.03, 0.1, 0.3, 1, 3, 10];
const figure: Figure = {
  title: 'Power laws',
  x: { title: 'ω', unit: '1/M', scale: autoScale(omegas) },
  y: { title: 'σ', unit: 'M²', scale: 'log', format: '.0e' },
  series: [
    { name: 'σ ∝ ω²', points: omegas.map((w) => [w, w ** 2]) },
    { name: 'σ ∝ ω⁴', points: omegas.map((w) => [w, w ** 4]) },
  ],
  legend: { title: 'law' },
  markers: true,
};

// SVG text; writing it to a file is up to the caller.
const svg = await renderSvg(figure);
console.log(`x axis: ${figure.x.scale}; ${figure.series?.length} series`);
console.log(svg.startsWith('<svg'), svg.includes('ω [1/M]'), svg.includes('σ ∝ ω⁴'));
