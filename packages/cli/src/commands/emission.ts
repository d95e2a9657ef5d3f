import { SPIN_COLUMN, type FieldSpin, type Table } from '@penumbra/core';
import {
  DEFAULT_CONFINEMENT_SCALE_GEV,
  KNOWN_SPECIES,
  emissionSpectrum,
  emissionTotals,
  toPhysicalRates,
  toPhysicalSpectrum,
} from '@penumbra/emission';
import { UsageError } from '../command.js';
import { runContentEmission } from '../contentEmission.js';
import { parseContentList } from '../contentOption.js';
import { isInaccurate, warnInaccurate } from '../accuracy.js';
import type { CliIO, Command } from '../command.js';
import type { MassUnit } from '@penumbra/kerr';
import { limitsHelp } from '../limits.js';
import { emissionText, spectrumTable, totalsTable } from '../emissionOutput.js';
import { parseFieldSpin, parseMassOption, parseNumber, parseOptions, parseRange, requireOption } from '../options.js';
import { OUTPUT_OPTIONS, outputFormat, writeOutput } from '../output.js';
import { progressReporter } from '../progress.js';

/** `penumbra emission`. */
export const command: Command = {
  name: 'emission',
  summary: 'Hawking emission per degree of freedom or over species (--content): number rate, power, torque, spectra',
  usage: `Usage: penumbra emission [--a A] --spin S [--mass M --unit g|kg|msun] [--omega START:STOP:COUNT] [--tol T] [--json|--csv]
       penumbra emission [--a A] --content LIST --mass M --unit g|kg|msun [--energy START:STOP:COUNT] [--confinement-scale GEV] [--tol T] [--json|--csv]

Totals per degree of freedom (one helicity of one species) in geometric units of
the hole mass M: numberRate ∝ 1/M, power ∝ 1/M², torque dJ/dt ∝ 1/M (ħ = 1).
With --mass they are also given in s⁻¹, W, GeV s⁻¹ and J.

With --content: totals over species, a row per species (all its degrees of
freedom) and the total, in s⁻¹, GeV s⁻¹ and ħ s⁻¹; massive species emitted only
above E = m (docs/emission.md). Quarks and gluons are emitted only when
T_H > the confinement scale, pions only below it (common practice, no source).

Options:
  --a A         the hole's spin parameter a/M (|a/M| ≤ 0.99999; default 0, non-rotating)
  --spin S      field spin: 0, 1/2, 1, 2 (not with --content), or a comma-separated list
                (e.g. 0,1/2,1,2): each spin in turn in one process (faster than one run per
                spin); --json then gives an array of the per-spin objects, --csv a leading
                spin column
  --content LIST  comma-separated species: ${Object.keys(KNOWN_SPECIES).join(', ')},
                standard-model (all but scalar), or a user species NAME:SPIN:DOF[:MASS_GEV]
                (e.g. dark-scalar:0:1:0.01); needs --mass and --unit
  --energy GRID  with --content: primary spectra d²N/(dt dE) per species [GeV⁻¹ s⁻¹] at
                E [GeV] = START:STOP:COUNT (log-spaced) or a list E1,E2,…
  --confinement-scale GEV  with --content: the temperature scale of the parton/pion rule
                (default ${DEFAULT_CONFINEMENT_SCALE_GEV} GeV)
  --mass M      hole mass for physical units, always with --unit
  --unit U      unit of --mass: g, kg or msun (solar masses)
  --omega GRID  also print the spectrum d²N/(dt dω), d²E/(dt dω), d²J/(dt dω) at Mω = START:STOP:COUNT
                (or a list W1,W2,…)
  --tol T       relative accuracy (default 1e-6; with --content 1e-3; 1e-12 … 1e-2)
  --json        one JSON object {numberRate, power, torque: {value, relError, inaccurate}, spectrum?}
  --csv         CSV (spectrum rows if --omega/--energy is given, else the totals), units in
                the header and the JSON keys as column names
  -h, --help    this text

${limitsHelp(['a', 'omega', 'tol'])}
Examples:
  penumbra emission --a 0.7 --spin 1 --mass 1e15 --unit g --json
  penumbra emission --mass 1e15 --unit g --a 0.5 --content standard-model
  penumbra emission --mass 1e15 --unit g --a 0 --content photon,electron,dark-scalar:0:1:0.01 --energy 0.001:1:20 --csv
`,
  run(argv, io) {
    const { values } = parseOptions(argv, {
      a: { type: 'string' },
      spin: { type: 'string' },
      mass: { type: 'string' },
      unit: { type: 'string' },
      omega: { type: 'string' },
      tol: { type: 'string' },
      content: { type: 'string' },
      energy: { type: 'string' },
      'confinement-scale': { type: 'string' },
      ...OUTPUT_OPTIONS,
    });
    const format = outputFormat(values);
    if (values.content !== undefined) {
      if (values.spin !== undefined)
        throw new UsageError('--content and --spin exclude each other (--spin is one field per degree of freedom)');
      if (values.omega !== undefined) throw new UsageError('with --content the spectra take --energy in GeV, not --omega');
      const given = parseMassOption(values);
      if (given === undefined)
        throw new UsageError('--content needs --mass and --unit (species masses set Mμ through the hole mass)');
      const known = [...Object.keys(KNOWN_SPECIES), 'standard-model'];
      const energy =
        values.energy === undefined
          ? undefined
          : parseRange('--energy', values.energy, { log: true, min: 0, exclusive: true, maxCount: 1000 });
      runContentEmission(
        {
          a: values.a === undefined ? 0 : parseNumber('--a', values.a),
          mass: given.mass,
          unit: given.unit,
          content: parseContentList('--content', values.content, known),
          tol: values.tol === undefined ? 1e-3 : parseNumber('--tol', values.tol),
          ...(values['confinement-scale'] === undefined
            ? {}
            : {
                confinementScaleGeV: parseNumber('--confinement-scale', values['confinement-scale'], { min: 0, exclusive: true }),
              }),
          ...(energy ? { energiesGeV: energy.values } : {}),
        },
        io,
        format,
      );
      return 0;
    }
    if (values.energy !== undefined) throw new UsageError('--energy goes with --content (use --omega for one field)');
    if (values['confinement-scale'] !== undefined) throw new UsageError('--confinement-scale goes with --content');
    const spins = requireOption(values.spin, '--spin', 'the field spin')
      .split(',')
      .map((text) => parseFieldSpin('--spin', text));
    const a = values.a === undefined ? 0 : parseNumber('--a', values.a);
    const tol = values.tol === undefined ? 1e-6 : parseNumber('--tol', values.tol);
    const given = parseMassOption(values);
    const grid =
      values.omega === undefined ? undefined : parseRange('--omega', values.omega, { min: 0, exclusive: true, maxCount: 10_000 });
    // Several spins run in this one process: the solver is compiled once, not once per process.
    const results = spins.map((spin) =>
      emissionOfSpin(io, {
        spin,
        a,
        tol,
        mass: given?.mass,
        unit: given?.unit ?? 'g',
        grid: grid?.values,
        label: spins.length > 1 ? `s = ${spin} ` : '',
      }),
    );
    const several = results.length > 1;
    writeOutput(io, format, {
      json: () => (several ? results.map((r) => r.json()) : results[0].json()),
      csv: () => (several ? withSpinColumn(results.map((r) => ({ spin: r.spin, table: r.csv() }))) : results[0].csv()),
      text: () => results.map((r) => r.text()).join('\n'),
    });
    return 0;
  },
};

interface SpinRun {
  spin: number;
  a: number;
  tol: number;
  mass: number | undefined;
  unit: MassUnit;
  grid: readonly number[] | undefined;
  /** prefix of the accuracy warnings ('' for a single spin) */
  label: string;
}

/** Totals (and the spectrum, with a grid) of one field spin, with its three output forms. */
function emissionOfSpin(io: CliIO, { spin, a, tol, mass, unit, grid, label }: SpinRun) {
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
  const progress = grid ? progressReporter(io, 'emission spectrum: frequencies done', grid.length) : undefined;
  const spectrum = grid
    ? emissionSpectrum({ hole: { a }, field: { spin: spin as FieldSpin }, grid }, { tol, onPoint: (done) => progress?.(done) })
    : undefined;
  const pick = (x: { value: number; relError: number }) => ({
    value: x.value,
    relError: x.relError,
    inaccurate: isInaccurate(x.relError),
  });
  const physical =
    mass === undefined
      ? undefined
      : toPhysicalRates(
          { numberRate: totals.numberRate.value, power: totals.power.value, torque: totals.torque.value },
          mass,
          unit,
        );
  const rows = spectrum?.points.map((p) => ({
    omega: p.omega,
    number: p.number,
    energy: p.energy,
    torque: p.torque,
    relError: p.relError,
    lMax: p.lMax,
    inaccurate: isInaccurate(p.relError),
    ...(mass === undefined ? {} : toPhysicalSpectrum(p, mass, unit)),
  }));

  warnInaccurate(io, [
    { what: `${label}number rate`, relError: totals.numberRate.relError },
    { what: `${label}power`, relError: totals.power.relError },
    { what: `${label}torque`, relError: totals.torque.relError },
    ...(rows ?? []).map((r) => ({ what: `${label}spectrum at Mω = ${r.omega}`, relError: r.relError })),
  ]);
  return {
    spin,
    json: () => ({
      spin,
      a,
      units: 'geometric, per degree of freedom: numberRate × 1/M, power × 1/M², torque × 1/M (G = c = ħ = 1)',
      numberRate: pick(totals.numberRate),
      power: pick(totals.power),
      torque: pick(totals.torque),
      ...(physical ? { mass, unit, physical } : {}),
      diagnostics: totals.diagnostics,
      ...(rows ? { spectrum: rows } : {}),
    }),
    csv: (): Table => (rows ? spectrumTable(rows, mass !== undefined) : totalsTable(totals, physical)),
    text: () =>
      `Hawking emission per degree of freedom, s = ${spin}, a = ${a} M (geometric units of M)\n` +
      emissionText(totals, physical, rows),
  };
}

/** The tables of several spins stacked, each row led by its spin. */
function withSpinColumn(parts: readonly { spin: number; table: Table }[]): Table {
  return {
    columns: [SPIN_COLUMN, ...parts[0].table.columns],
    rows: parts.flatMap(({ spin, table }) => table.rows.map((row) => [spin, ...row])),
  };
}
