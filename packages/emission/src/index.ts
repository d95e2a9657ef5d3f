/**
 * @penumbra/emission: Hawking emission of Kerr holes per degree of freedom
 * (spectra, number rate, power, torque), totals over a particle content,
 * Page's f(a*) and g(a*), and the evaporation history. Every solve takes a
 * problem in the shared vocabulary of @penumbra/core ({ hole, field, … }) and
 * validated options, and returns a solution whose diagnostics extend core's
 * Diagnostics. Internals for tests and benchmarks: '@penumbra/emission/internal'.
 */
export {
  emissionSpectrum,
  type SpectrumProblem,
  type SpectrumOptions,
  type SpectrumDiagnostics,
  type EmissionSpectrum,
} from './spectrum.js';
export type { SpectrumPoint } from './spectrumPoint.js';
export type { EmittedField } from './massiveField.js';
export { MASSIVE_VECTOR_KERR_APPROXIMATION } from './massiveModes.js';
export {
  emissionTotals,
  type TotalsProblem,
  type TotalsOptions,
  type TotalsDiagnostics,
  type EmissionTotals,
  type EstimatedValue,
} from './totals.js';
export type { ModeTotal, Triple } from './modeIntegral.js';
export {
  contentTotals,
  type ContentProblem,
  type ContentOptions,
  type ContentDiagnostics,
  type ContentTotals,
  type SpeciesTotals,
  type SpeciesStatus,
  type PhysicalMass,
  DEFAULT_CONFINEMENT_SCALE_GEV,
} from './content.js';
export {
  KNOWN_SPECIES,
  DEFAULT_CONTENT,
  PAGE_1976_CONTENT,
  STANDARD_MODEL_CONTENT,
  resolveContent,
  type Species,
  type SpeciesSpec,
  type QcdRole,
} from './species.js';
export {
  contentSpectra,
  type ContentSpectraProblem,
  type ContentSpectraOptions,
  type ContentSpectra,
  type SpeciesSpectrum,
} from './contentSpectra.js';
export { toPhysicalRates, toPhysicalSpectrum, type PhysicalRates } from './units.js';
export {
  pageTable,
  bundledPageTable,
  type PageTable,
  type PageTableSpin,
  type PageTableProblem,
  type PageTableOptions,
  type PageTableDiagnostics,
  type PageTableSolution,
} from './pageTable.js';
export { pageFunctions, type PageFunctionsProblem, type PageFunctions } from './pageFunctions.js';
export {
  evolveHole,
  evolutionTimeUnitSeconds,
  type EvolutionProblem,
  type EvolutionOptions,
  type EvolutionDiagnostics,
  type Evolution,
  type TrackPoint,
} from './evolution.js';
export {
  massiveRateTable,
  bundledMassiveRateTable,
  DEFAULT_FIELD_MASSES,
  type MassiveRateTable,
  type MassiveRateRow,
  type MassiveRateTableProblem,
  type MassiveRateTableOptions,
  type MassiveRateTableDiagnostics,
  type MassiveRateTableSolution,
} from './massiveRateTable.js';
export {
  massLossRates,
  FIELD_MASS_PER_GRAM_GEV,
  type EmittedSpecies,
  type MassLossProblem,
  type MassLossPoint,
  type MassLossValues,
  type MassLossRates,
  type RateErrors,
} from './massLoss.js';
export {
  evaporateHole,
  massForLifetime,
  AGE_OF_UNIVERSE_SECONDS,
  type EvaporationProblem,
  type EvaporationOptions,
  type EvaporationPoint,
  type Evaporation,
  type EvaporationDiagnostics,
  type FinalStage,
  type SpeciesEnergy,
  type MassForLifetime,
  type MassForLifetimeProblem,
  type MassForLifetimeOptions,
} from './evaporation.js';
export {
  burstSpectrum,
  type BurstSpectrumProblem,
  type BurstSpectrumOptions,
  type BurstSpectrumDiagnostics,
  type BurstSpectrum,
} from './burstSpectrum.js';
export {
  massLossAt,
  type MassLossAtProblem,
  type MassLossAtOptions,
  type MassLossAtDiagnostics,
  type MassLossAt,
} from './massLossDirect.js';
