import type { FieldSpin } from '@penumbra/core';
import { emissionSpectrum, emissionTotals, toPhysicalRates, toPhysicalSpectrum } from '@penumbra/emission';
import type { Command } from '../command.js';
import {
  formatNumber,
  formatTable,
  parseFieldSpin,
  parseMassUnit,
  parseNumber,
  parseOptions,
  parseRange,
  progressReporter,
  requireOption,
  writeJson,
} from '../options.js';

export const command: Command = {
  name: 'emission',
  summary: 'Hawking emission per degree of freedom: number rate, power, torque, and the spectrum on a grid',
  usage: `Usage: penumbra emission --a SPIN --spin S [--mass M --unit g|kg|msun] [--omega START:STOP:COUNT] [--tol T] [--json|--csv]

Totals per degree of freedom (one helicity of one species) in geometric units of
the hole mass M: numberRate ∝ 1/M, power ∝ 1/M², torque dJ/dt ∝ 1/M (ħ = 1).
With --mass they are also given in s⁻¹, W, GeV s⁻¹ and J.

Options:
  --a SPIN      hole spin a/M (|a/M| ≤ 0.9999)
  --spin S      field spin: 0, 1/2, 1, 2
  --mass M      hole mass for physical units (with --unit, default g)
  --unit U      g, kg or msun
  --omega GRID  also print the spectrum d²N/(dt dω), d²E/(dt dω), d²J/(dt dω) at Mω = START:STOP:COUNT
  --tol T       relative accuracy (default 1e-6; 1e-12 … 1e-2)
  --json        one JSON object {totals: {numberRate, power, torque: {value, relError}}, spectrum?}
  --csv         CSV (spectrum rows if --omega is given, else the totals), units in the header
  -h, --help    this text

Example:
  penumbra emission --a 0.7 --spin 1 --mass 1e15 --unit g --json
`,
  run(argv, io) {
    const { values } = parseOptions(argv, {
      a: { type: 'string' },
      spin: { type: 'string' },
      mass: { type: 'string' },
      unit: { type: 'string' },
      omega: { type: 'string' },
      tol: { type: 'string' },
      json: { type: 'boolean' },
      csv: { type: 'boolean' },
    });
    const spin = parseFieldSpin('--spin', requireOption(values.spin, '--spin', 'the field spin'));
    const a = parseNumber('--a', requireOption(values.a, '--a', 'the hole spin a/M'));
    const tol = values.tol === undefined ? 1e-6 : parseNumber('--tol', values.tol);
    const mass = values.mass === undefined ? undefined : parseNumber('--mass', values.mass, { min: 0, exclusive: true });
    const unit = parseMassUnit('--unit', values.unit ?? 'g');
    const grid = values.omega === undefined ? undefined : parseRange('--omega', values.omega, { min: 0, exclusive: true, maxCount: 10_000 });

    let modes = 0;
    const totals = emissionTotals(
      { hole: { a }, field: { spin: spin as FieldSpin } },
      {
        tol,
        onMode: () => {
          if (++modes % 10 === 0) io.stderr(`emission: ${modes} modes integrated\n`);
        },
      },
    );
    const progress = grid ? progressReporter(io, 'emission spectrum: frequencies done', grid.count) : undefined;
    const spectrum = grid ? emissionSpectrum({ hole: { a }, field: { spin: spin as FieldSpin }, grid: grid.values }, { tol, onPoint: (done) => progress?.(done) }) : undefined;
    const pick = (x: { value: number; relError: number }) => ({ value: x.value, relError: x.relError });
    const physical =
      mass === undefined
        ? undefined
        : toPhysicalRates({ numberRate: totals.numberRate.value, power: totals.power.value, torque: totals.torque.value }, mass, unit);
    const rows = spectrum?.points.map((p) => ({
      omega: p.omega,
      number: p.number,
      energy: p.energy,
      torque: p.torque,
      relError: p.relError,
      lMax: p.lMax,
      ...(mass === undefined ? {} : toPhysicalSpectrum(p, mass, unit)),
    }));

    if (values.json) {
      writeJson(io, {
        spin,
        a,
        units: 'geometric, per degree of freedom: numberRate × 1/M, power × 1/M², torque × 1/M (G = c = ħ = 1)',
        numberRate: pick(totals.numberRate),
        power: pick(totals.power),
        torque: pick(totals.torque),
        ...(physical ? { mass, unit, physical } : {}),
        diagnostics: totals.diagnostics,
        ...(rows ? { spectrum: rows } : {}),
      });
    } else if (values.csv) {
      if (rows) {
        const phys = mass !== undefined;
        io.stdout(
          [
            'omega [1/M],d2N/dtdomega [1],d2E/dtdomega [1/M],d2J/dtdomega [1],rel_error [1],l_max' + (phys ? ',E [GeV],d2N/dtdE [GeV^-1 s^-1]' : ''),
            ...rows.map((r) =>
              [r.omega, r.number, r.energy, r.torque, r.relError, r.lMax, ...(phys ? [(r as { energyGeV?: number }).energyGeV, (r as { perGeVPerSecond?: number }).perGeVPerSecond] : [])].join(','),
            ),
          ].join('\n') + '\n',
        );
      } else {
        io.stdout('quantity,value,unit,rel_error\n');
        io.stdout(`numberRate,${totals.numberRate.value},1/M,${totals.numberRate.relError}\n`);
        io.stdout(`power,${totals.power.value},1/M^2,${totals.power.relError}\n`);
        io.stdout(`torque,${totals.torque.value},1/M,${totals.torque.relError}\n`);
        if (physical) {
          io.stdout(`numberRate,${physical.numberRatePerSecond},s^-1,${totals.numberRate.relError}\n`);
          io.stdout(`power,${physical.powerWatts},W,${totals.power.relError}\n`);
          io.stdout(`torque,${physical.torqueJoules},J,${totals.torque.relError}\n`);
        }
      }
    } else {
      io.stdout(`Hawking emission per degree of freedom, s = ${spin}, a = ${a} M (geometric units of M)\n`);
      const t: string[][] = [
        ['quantity', 'value', 'rel. error'],
        ['dN/dt  [1/M]', formatNumber(totals.numberRate.value, 8), totals.numberRate.relError.toExponential(1)],
        ['dE/dt  [1/M²]', formatNumber(totals.power.value, 8), totals.power.relError.toExponential(1)],
        ['dJ/dt  [1/M]', formatNumber(totals.torque.value, 8), totals.torque.relError.toExponential(1)],
      ];
      if (physical) {
        t.push(['dN/dt  [s⁻¹]', formatNumber(physical.numberRatePerSecond, 6), '']);
        t.push(['dE/dt  [W]', formatNumber(physical.powerWatts, 6), '']);
        t.push(['dJ/dt  [J]', formatNumber(physical.torqueJoules, 6), '']);
      }
      io.stdout(formatTable(t));
      if (rows) {
        io.stdout('spectrum:\n');
        io.stdout(formatTable([['Mω', 'd²N/dtdω', 'd²E/dtdω', 'l max'], ...rows.map((r) => [formatNumber(r.omega, 6), formatNumber(r.number, 8), formatNumber(r.energy, 8), String(r.lMax)])]));
      }
    }
    return 0;
  },
};
