/** What the two routes return (a failure throws; `attempt` from core turns that into a status). */
import type { RadialDiagnostics } from './diagnostics.js';

/** A complex number { re, im }. */
export interface Complex2 {
  /** real part */
  re: number;
  /** imaginary part */
  im: number;
}

/** The radial function and its r-derivative at one radius. */
export interface RadialSample {
  /** radius */
  r: number;
  /** R(r) */
  R: Complex2;
  /** dR/dr at r */
  dR: Complex2;
}

/** Result of `solveRadial`: the ingoing-at-horizon solution's amplitudes at infinity. */
export interface RadialSolution {
  /** Z_in relative to a horizon amplitude of 1; true value = zIn · e^{logScale} */
  zIn: Complex2;
  /** Z_out, scaled like zIn */
  zOut: Complex2;
  /** natural log of the factor taken out of zIn and zOut to avoid overflow */
  logScale: number;
  /** ln|Z_in| including logScale (safe when |Z| would overflow) */
  logAbsZIn: number;
  /** ln|Z_out| including logScale */
  logAbsZOut: number;
  /** k = ω − mΩ_H */
  k: number;
  /** R and R' at the requested grid radii inside (start, match] */
  samples: RadialSample[];
  /** how the answer was obtained, with its error estimate */
  diagnostics: RadialDiagnostics;
}

/** Result of `solveTwoSided` (s > 0): amplitudes of the +s and −s solutions, each read where it dominates. */
export interface TwoSidedSolution {
  /** ln|Z_in| of the +|s| solution normalised to Δ^{−s} e^{−ikr*} at the horizon */
  logAbsZInPlus: number;
  /** ln|Z_out| of the same solution (loses digits like (ωr)^{2s}; for diagnostics) */
  logAbsZOutPlus: number;
  /** ln|Y_out| of the −|s| solution normalised to Δ^{s} e^{−ikr*} at the horizon (NaN when `reflection` is false) */
  logAbsYOutMinus: number;
  /** ln|Y_in| of the same −|s| solution (subdominant at infinity: loses digits like (ωr)^{2s}; for cross-checks) */
  logAbsYInMinus: number;
  /** R_{+s} and dR_{+s}/dr (normalised to Δ^{−s} e^{−ikr*} at the horizon) at the requested radii */
  samples: RadialSample[];
  /** k = ω − mΩ_H */
  k: number;
  /** radius where the −s solution was mapped to the +s one */
  switchRadius: number;
  /** how the answer was obtained, with its error estimate (of Z_in) */
  diagnostics: RadialDiagnostics;
}
