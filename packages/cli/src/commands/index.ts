/**
 * The registry of penumbra commands: name, summary and a loader. Nothing here
 * imports a command module, so `penumbra --help`, `--version` and each
 * command load only what they use (a test checks each summary against its
 * command's own).
 */
import type { CommandEntry } from '../command.js';

/** Every command of the penumbra executable, in the order `penumbra --help` lists them. */
export const commands: readonly CommandEntry[] = [
  {
    name: 'demo',
    summary: 'greybody factors of every field for a built-in demo hole (a = 0.7 M)',
    load: () => import('./demo.js'),
  },
  {
    name: 'kerr',
    summary: 'background quantities of a Kerr hole (horizons, Ω_H, κ, T_H, area, entropy)',
    load: () => import('./kerr.js'),
  },
  {
    name: 'greybody',
    summary: 'greybody factor Γ_slm(ω), reflection and diagnostics for one mode, at one frequency or a range',
    load: () => import('./greybody.js'),
  },
  {
    name: 'cross-section',
    summary: 'absorption cross-section σ(ω) = (π/ω²) Σ Γ_slm, with its l-truncation bound',
    load: () => import('./crossSection.js'),
  },
  {
    name: 'near-region',
    summary: 'two-temperature (near-region) form of Γ for one mode: T_L, T_R, c_L, c_R, weights, and its ratio to the exact Γ',
    load: () => import('./nearRegion.js'),
  },
  {
    name: 'table',
    summary: 'compute a grid of Γ, reflection, cross-sections or spectra on every core; sharded and resumable',
    load: () => import('./table.js'),
  },
  {
    name: 'merge',
    summary: "combine the output directories of 'penumbra table --shard' runs into one table",
    load: () => import('./merge.js'),
  },
  {
    name: 'plot',
    summary: 'draw what a penumbra command wrote (CSV, JSON or a table) as an SVG figure',
    load: () => import('./plot.js'),
  },
  {
    name: 'spheroidal',
    summary: 'spin-weighted spheroidal eigenvalue A, E, λ and harmonic S(θ) of one mode',
    load: () => import('./spheroidal.js'),
  },
  {
    name: 'emission',
    summary: 'Hawking emission per degree of freedom or over species (--content): number rate, power, torque, spectra',
    load: () => import('./emission.js'),
  },
  {
    name: 'explore',
    summary: 'an explorer page in the browser: Γ(ω), σ(ω), emission spectra and evaporation, computed in the page',
    load: () => import('./explore.js'),
  },
  {
    name: 'evolve',
    summary: 'evaporation history of a hole: lifetime, the track of M, a*, T_H, the final burst, per species',
    load: () => import('./evolve.js'),
  },
];
