/**
 * The figure of plot data: which quantity to draw by default for each kind
 * of data, and the dispatch to the figure that draws it.
 */
import { modeFigure } from './modeFigure.js';
import { PlotDataError, type PlotOptions, type PlotQuantity, type PlotResult } from './plotCommon.js';
import type { DataKind, PlotData } from './plotRead.js';
import { crossSectionFigure, spectrumFigure } from './sumFigures.js';
import { harmonicFigure, trackFigure } from './trackFigure.js';

/** The quantities each kind of data can draw, the default first. */
const DRAWS: Record<DataKind, readonly PlotQuantity[]> = {
  modes: ['gamma', 'amplification', 'reflection'],
  crossSection: ['crossSection'],
  spectra: ['spectra', 'energySpectra'],
  track: ['track'],
  harmonic: ['harmonic'],
};

/** Which quantities the data can draw, the default first. */
export function drawableQuantities(data: readonly PlotData[]): PlotQuantity[] {
  return [...new Set(data.flatMap((d) => DRAWS[d.kind]))].filter(
    (q) => q !== 'reflection' || data.some((d) => d.kind === 'modes' && d.rows.some((r) => typeof r.reflection === 'number')),
  );
}

/** The figure of one quantity (default: the first the data can draw); throws PlotDataError when the data lack it. */
export function plotFigure(data: readonly PlotData[], options: PlotOptions = {}): PlotResult {
  const available = drawableQuantities(data);
  const quantity = options.quantity ?? available[0];
  if (!quantity || !available.includes(quantity))
    throw new PlotDataError(
      `the data has no ${quantity ?? 'drawable quantity'}; it can draw ${available.join(', ') || 'nothing'}`,
    );
  const source = data.find((d) => DRAWS[d.kind].includes(quantity))!;
  switch (quantity) {
    case 'gamma':
    case 'amplification':
    case 'reflection':
      return modeFigure(source.rows, quantity, options);
    case 'crossSection':
      return crossSectionFigure(source.rows, options);
    case 'spectra':
    case 'energySpectra':
      return spectrumFigure(source.rows, quantity === 'energySpectra', options, source);
    case 'track':
      return trackFigure(source.rows, options, source.unit);
    case 'harmonic':
      return harmonicFigure(source.rows, options);
  }
}
