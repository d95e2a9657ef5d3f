import {
  AGE_OF_UNIVERSE_SECONDS,
  burstSpectrum,
  bundledPageTable,
  DEFAULT_CONTENT,
  evaporateHole,
  KNOWN_SPECIES,
  massForLifetime,
  massLossRates,
  pageTable,
  resolveContent,
  type EmittedSpecies,
  type PageTable,
} from '@penumbra/emission';
import { parseContentList } from '../contentOption.js';
import { TOLERANCE_RANGE, type Column } from '@penumbra/core';
import type { Command } from '../command.js';
import { UsageError } from '../command.js';
import { INACCURATE_COLUMN, isInaccurate, warnInaccurate } from '../accuracy.js';
import { formatError, formatNumber, formatTable } from '../format.js';
import { parseMassOption, parseNumber, parseNumberList, parseOptions, parseRange } from '../options.js';
import { OUTPUT_OPTIONS, outputFormat, writeOutput } from '../output.js';

/** CSV columns of the track: the keys of the JSON track points (the mass in the unit of --unit). */
const trackColumns = (unit: string): Column[] => [
  { name: 'timeSeconds', unit: 's', description: 'time since formation' },
  { name: 'mass', unit, description: 'mass of the hole' },
  { name: 'aStar', unit: '1', description: "the hole's a/M" },
  { name: 'temperatureGeV', unit: 'GeV', description: 'Hawking temperature k_B T_H' },
  { name: 'fRelError', unit: '1', description: 'local relative error of f(M, a*) from the rate tables at this point' },
  { ...INACCURATE_COLUMN, description: 'true when the lifetime (and so the times) has an estimated relative error above 1e-3' },
];

/** CSV columns of the burst spectrum (long form: one row per energy and species). */
const SPECTRUM_COLUMNS: Column[] = [
  { name: 'energyGeV', unit: 'GeV', description: 'energy of the emitted particle' },
  { name: 'species', unit: '', description: 'species name' },
  { name: 'perGeV', unit: 'GeV^-1', description: 'dN/dE integrated over the final stage' },
];

const GRAMS_PER_UNIT: Record<string, number> = { g: 1, kg: 1e3, msun: 1.988409870698051e33 };

/** The species of --content: names of the registry, 'standard-model', or NAME:SPIN:DOF[:MASS_GEV]. */
function parseContent(text: string | undefined): EmittedSpecies[] {
  if (text === undefined) return resolveContent();
  // the default content first, so that the list in a message starts with what most runs use
  const known = [...new Set([...DEFAULT_CONTENT, ...Object.keys(KNOWN_SPECIES), 'standard-model'])];
  return resolveContent(parseContentList('--content', text, known));
}

/** `penumbra evolve`. */
export const command: Command = {
  name: 'evolve',
  summary: 'evaporation history of a hole: lifetime, the track of M, a*, T_H, the final burst, per species',
  usage: `Usage: penumbra evolve [--a A] [--mass M --unit g|kg|msun] [--content LIST] [--final T1,T2,…] [--below A1,A2,…] [--table-points N] [--json|--csv]

Integrates dM/dt = −f(M, a*)/M², dJ/dt = −g(M, a*) a*/M (Page 1976, with the
thresholds of massive species) from formation to the end. f and g come from
the tables shipped with @penumbra/emission: massless per-dof rates over a*
(50 nodes, a* ≤ 0.99) and massive/massless ratios over Mμ and a*;
--table-points N recomputes the massless table with N nodes (slow: minutes).

Options:
  --a A             the hole's formation a/M (0 … 0.99 with the shipped tables; default 0, non-rotating)
  --mass M          formation mass (default 1 g), always with --unit g, kg or msun
  --content LIST    species: standard-model, or names from the registry (photon, gluon, graviton,
                    neutrino-e/-mu/-tau, electron, muon, tau, up, down, strange, charm, bottom,
                    top, w-boson, z-boson, higgs, pion-neutral, pion-charged, scalar), or user
                    species NAME:SPIN:DOF[:MASS_GEV], comma-separated (default: photons,
                    gravitons, three neutrino species)
  --confinement-scale GEV  T_H above which quarks and gluons, at or below which pions are
                    emitted (default 0.3; common practice, no source)
  --final LIST      durations τ in seconds of the final stages reported: mass and
                    energy released in the last τ, per species (default 1)
  --below LIST      report when a* first falls below these values, each in (0, 1);
                    values at or above the starting a* are reported as reached
                    at the start (default 0.5,0.1, those below the starting a*)
  --spectrum E1:E2:N  the time-integrated spectrum dN/dE [GeV⁻¹] per species over the first
                    final stage, at N energies from E1 to E2 GeV (log spaced; or a list);
                    a* held at its value at the start of the stage, massive species with the
                    massless shape above threshold (seconds to a minute)
  --table-points N  compute a fresh massless f, g table with N nodes instead of the shipped one
  --points N        track points printed (default 40)
  --tol T           relative accuracy asked of the lifetime and of the age-of-universe mass
                    (1e-12 … 1e-2, as every --tol): either one whose estimated error exceeds
                    it fails with exit code 3 instead of printing a warning (default: none,
                    the estimates are printed and flagged above 1e-3)
  --json            JSON {lifetimeSeconds, lifetimeOverMassCubed, relError, inaccurate,
                    track: [{timeSeconds, mass, aStar, temperatureGeV, fRelError}], crossings,
                    finalStages (with relError, aStarError), species, energyBalance, massForAgeOfUniverse, diagnostics}
  --csv             the track as CSV (columns timeSeconds, mass, aStar, temperatureGeV, fRelError, inaccurate;
                    units in the header);
                    with --spectrum, the spectrum instead (columns energyGeV, species, perGeV)

Also printed: the formation mass whose lifetime is the age of the universe
(13.787 Gyr, Planck 2018) for a* = 0 and this content.
Errors: f and g carry a local error from the table cells each point uses
(fRelError on the track); the lifetime's relative error is the ODE bound (the
change when the ODE tolerance is halved, plus 10 × that tolerance) plus f's
local error averaged over the track with the weight dt (and the a* error it
causes); the age-of-universe mass carries a third of it plus the bisection's;
a final stage's mass carries (∫ ε dt over the stage)·f/M³. A lifetime or final-stage mass whose estimated
relative error exceeds 1e-3 prints a warning on stderr; the lifetime's sets
inaccurate: true.
  -h, --help        this text

Limits:
  0 ≤ a* ≤ 0.99 with the shipped tables; --table-points from 5 to 2000;
  masses 1e-90 … 1e100 kg (see 'penumbra kerr --help'); --tol from 1e-12 to 1e-2

Example:
  penumbra evolve --a 0.5 --mass 1e15 --unit g --json
`,
  run(argv, io) {
    const { values } = parseOptions(argv, {
      a: { type: 'string' },
      mass: { type: 'string' },
      unit: { type: 'string' },
      content: { type: 'string' },
      'confinement-scale': { type: 'string' },
      final: { type: 'string' },
      spectrum: { type: 'string' },
      below: { type: 'string' },
      'table-points': { type: 'string' },
      points: { type: 'string' },
      tol: { type: 'string' },
      ...OUTPUT_OPTIONS,
    });
    const format = outputFormat(values);
    const aStar = values.a === undefined ? 0 : parseNumber('--a', values.a, { min: 0, max: 0.9999 });
    const { mass, unit } = parseMassOption(values) ?? { mass: 1, unit: 'g' };
    const species = parseContent(values.content);
    // the default milestones are those still ahead of the hole; explicit ones are all reported
    const below =
      values.below === undefined
        ? [0.5, 0.1].filter((t) => t < aStar)
        : parseNumberList('--below', values.below, { min: 0, max: 1, exclusive: true });
    const finalSeconds =
      values.final === undefined ? [1] : parseNumberList('--final', values.final, { min: 0, max: 1e300, exclusive: true });
    const energies =
      values.spectrum === undefined
        ? undefined
        : parseRange('--spectrum', values.spectrum, { log: true, min: 1e-30, max: 1e30, maxCount: 2000 }).values;
    const nPrint =
      values.points === undefined ? 40 : parseNumber('--points', values.points, { min: 2, max: 100_000, integer: true });
    let table: PageTable;
    if (values['table-points'] !== undefined) {
      const n = parseNumber('--table-points', values['table-points'], { min: 5, max: 2000, integer: true });
      table = pageTable(
        { points: n, aMax: Math.max(0.99, aStar) },
        { onPoint: (done, total) => io.stderr(`evolve: f, g table ${done}/${total}\n`) },
      );
    } else {
      table = bundledPageTable();
    }
    const confinementScaleGeV =
      values['confinement-scale'] === undefined
        ? undefined
        : parseNumber('--confinement-scale', values['confinement-scale'], { min: 1e-3, max: 1e3 });
    const rates = massLossRates({
      species,
      pageTable: table,
      ...(confinementScaleGeV === undefined ? {} : { confinementScaleGeV }),
    });
    if (aStar > rates.aMax) {
      throw new UsageError(
        `--a ${aStar} is beyond the tables (a* ≤ ${rates.aMax})${values['table-points'] === undefined ? '; the massless table can be recomputed with --table-points N' : ''}`,
      );
    }
    const tol = values.tol === undefined ? undefined : parseNumber('--tol', values.tol, TOLERANCE_RANGE);
    const ev = evaporateHole(
      { rates, mass, unit, aStar0: aStar },
      { aStarThresholds: below, finalSeconds, ...(tol === undefined ? {} : { tol }) },
    );
    const age = massForLifetime({ rates, seconds: AGE_OF_UNIVERSE_SECONDS, aStar0: 0 }, tol === undefined ? {} : { tol });
    const burst =
      energies === undefined || ev.finalStages.length === 0
        ? undefined
        : burstSpectrum(
            { rates, stage: ev.finalStages[0], energiesGeV: energies },
            { onSpin: (spin, done, total) => io.stderr(`evolve: burst spectrum, field spin ${spin} (${done}/${total})\n`) },
          );
    const burstResult =
      burst === undefined
        ? undefined
        : {
            stageSeconds: ev.finalStages[0].seconds,
            energiesGeV: burst.energiesGeV,
            species: burst.species,
            totalPerGeV: burst.totalPerGeV,
            approximation: burst.diagnostics.approximation,
            relError: burst.diagnostics.errorEstimate,
          };
    const perUnit = GRAMS_PER_UNIT[unit];
    // Thin the track to about nPrint points evenly spaced in mass (ODE steps crowd at small M), keeping the ends.
    const m0 = ev.mass0Grams;
    const picked: typeof ev.track = [];
    for (let k = 0, j = 0; k < nPrint - 1; k++) {
      const target = m0 * (1 - k / (nPrint - 1));
      while (j < ev.track.length - 1 && ev.track[j].massGrams > target) j++;
      if (picked[picked.length - 1] !== ev.track[j]) picked.push(ev.track[j]);
    }
    if (picked[picked.length - 1] !== ev.track[ev.track.length - 1]) picked.push(ev.track[ev.track.length - 1]);
    const track = picked.map((p) => ({
      timeSeconds: p.timeSeconds,
      mass: p.massGrams / perUnit,
      aStar: p.aStar,
      temperatureGeV: p.temperatureGeV,
      fRelError: rates.at(p.massGrams, Math.min(p.aStar, rates.aMax)).error.f,
    }));
    const relError = ev.diagnostics.errorEstimate;
    const inaccurate = isInaccurate(relError);
    const start = rates.at(m0, aStar);
    const result = {
      aStar0: aStar,
      mass0: mass,
      unit,
      content: species,
      lifetimeSeconds: ev.lifetimeSeconds,
      lifetimeOverMassCubed: ev.lifetimeOverMassCubed,
      relError,
      inaccurate,
      crossings: ev.crossings,
      f0: start.f,
      g0: start.g,
      finalStages: ev.finalStages,
      species: ev.species,
      energyBalance: ev.energyBalance,
      ...(burstResult ? { burstSpectrum: burstResult } : {}),
      massForAgeOfUniverse: { massGrams: age.massGrams, aStar0: 0, ageSeconds: AGE_OF_UNIVERSE_SECONDS, relError: age.relError },
      track,
      diagnostics: { ...ev.diagnostics, interpolationError: rates.interpolationError, nodeError: rates.nodeError },
    };
    warnInaccurate(io, [
      { what: 'lifetime', relError },
      ...ev.finalStages.map((s) => ({ what: `mass of the final ${formatNumber(s.seconds, 6)} s`, relError: s.relError })),
    ]);
    const g = (x: number) => formatNumber(x, 6);
    const stageText = (s: (typeof ev.finalStages)[number]) =>
      `final ${g(s.seconds)} s${s.wholeLife ? ' (the whole life)' : ''}: M = ${g(s.massGrams)} g (rel. error ${formatError(s.relError)}) released as ${g(s.energyGeV)} GeV ` +
      `(${g(s.energyErg)} erg), a* = ${g(s.aStar)}, T_H = ${g(s.temperatureGeV)} GeV at its start\n` +
      formatTable([['species', 'E [GeV]', 'share'], ...s.species.map((x) => [x.name, g(x.energyGeV), g(x.fraction)])]);
    writeOutput(io, format, {
      json: () => result,
      csv: () =>
        burstResult
          ? {
              columns: SPECTRUM_COLUMNS,
              rows: burstResult.species.flatMap((sp) => burstResult.energiesGeV.map((e, i) => [e, sp.name, sp.perGeV[i]])),
            }
          : {
              columns: trackColumns(unit),
              rows: track.map((p) => [p.timeSeconds, p.mass, p.aStar, p.temperatureGeV, p.fRelError, inaccurate]),
            },
      text: () =>
        `evaporation of a hole of ${g(mass)} ${unit}, a* = ${aStar}; content ${species.map((s) => s.name).join(', ')}\n` +
        `lifetime: ${g(result.lifetimeSeconds)} s  (${formatNumber(ev.lifetimeOverMassCubed, 8)} M₀³ in Planck units; ` +
        `rel. error ${formatError(relError)}${inaccurate ? ', above 1e-3' : ''}: ` +
        `f, g tables ${formatError(ev.diagnostics.tableError)} along the track, ODE ${formatError(ev.diagnostics.odeError)})\n` +
        `f(M₀, a*) = ${g(start.f)}, g(M₀, a*) = ${g(start.g)}; T_H at formation ${g(ev.track[0].temperatureGeV)} GeV\n` +
        result.crossings
          .map((c) =>
            c.atStart
              ? `a* ≤ ${c.aStar} from the start\n`
              : c.reached
                ? `a* < ${c.aStar} after ${g(c.timeSeconds)} s\n`
                : `a* stays at or above ${c.aStar} until the end\n`,
          )
          .join('') +
        `mass whose lifetime is the age of the universe (13.787 Gyr), a* = 0: ${g(age.massGrams)} g (rel. error ${formatError(age.relError)})\n` +
        `energy emitted over the life: ${g(ev.energyBalance.emittedGeV)} GeV = M₀c² to ${formatError(ev.energyBalance.relError)}\n` +
        formatTable([['species', 'E [GeV]', 'share'], ...ev.species.map((x) => [x.name, g(x.energyGeV), g(x.fraction)])]) +
        ev.finalStages.map(stageText).join('') +
        (burstResult
          ? `time-integrated spectrum dN/dE [GeV⁻¹] over the last ${g(burstResult.stageSeconds)} s (${burstResult.approximation})\n` +
            formatTable([
              ['E [GeV]', 'total', ...burstResult.species.map((x) => x.name)],
              ...burstResult.energiesGeV.map((e, i) => [
                g(e),
                g(burstResult.totalPerGeV[i]),
                ...burstResult.species.map((x) => g(x.perGeV[i])),
              ]),
            ])
          : '') +
        'track\n' +
        formatTable([
          ['t [s]', `M [${unit}]`, 'a*', 'T_H [GeV]', 'f rel. error'],
          ...track.map((p) => [g(p.timeSeconds), g(p.mass), g(p.aStar), g(p.temperatureGeV), formatError(p.fRelError)]),
        ]),
    });
    return 0;
  },
};
