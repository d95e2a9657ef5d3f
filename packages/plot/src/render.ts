/**
 * Rendering: figure → Vega-Lite → Vega → SVG text, headless (no browser,
 * no canvas). Writing the file is the caller's business.
 */
import * as vega from 'vega';
import { compile } from 'vega-lite';
import type { Figure } from './figure.js';
import { vegaLiteSpec } from './spec.js';
import { validateFigure } from './validate.js';

/** Draw a figure as standalone SVG text (no trailing newline); throws InputError for a malformed figure. */
export async function renderSvg(figure: Figure): Promise<string> {
  const view = new vega.View(vega.parse(compile(vegaLiteSpec(validateFigure(figure))).spec), { renderer: 'none' });
  try {
    return renumberIds(await view.toSVG());
  } finally {
    view.finalize();
  }
}

/** Vega numbers clip paths with a process-wide counter; renumber per figure so equal inputs give equal bytes. */
function renumberIds(svg: string): string {
  const ids = new Map<string, string>();
  return svg.replace(/\bclip\d+\b/g, (id) => {
    if (!ids.has(id)) ids.set(id, `clip${ids.size + 1}`);
    return ids.get(id)!;
  });
}
