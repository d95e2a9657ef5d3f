/**
 * An allocation-free Gragg–Bulirsch–Stoer extrapolation loop for a
 * 4-component real state: the algorithm of Hairer & Wanner's ODEX (as the
 * npm `odex` package runs it here: step-number sequence 2, 4, 6, …, at most 9
 * columns, no dense output, pure relative tolerance), with its step-size and
 * order control kept operation for operation, so that it takes the same steps
 * and returns the same doubles as the 'odex' integrator. What changes is the
 * calling convention: the state lives in preallocated Float64Arrays and the
 * right-hand side writes into one, where the generic package copies arrays on
 * every evaluation and every step (measured: that copying and its garbage
 * were about 60 % of a greybody solve; docs/method.md, section 7).
 */
import type { AdvanceResult, Stepper } from './integrators.js';
import type { Rhs } from './rhs.js';

/** Columns of the extrapolation tableau (ODEX's default KM). */
const KM = 9;
/** Dimension of the state. */
const N = 4;
/** ODEX's rounding unit (its WORK(1) default). */
const U_ROUND = 2.3e-16;
/** ODEX's step-size controls (WORK(3)…WORK(9) defaults). */
const REDUCTION = 0.5,
  FAC1 = 0.02,
  FAC2 = 4.0,
  FAC3 = 0.8,
  FAC4 = 0.9,
  SAFE1 = 0.65,
  SAFE2 = 0.94;

/** Step numbers n_j = 2j (1-based; index KM + 1 is read by the convergence monitor). */
const NJ = new Float64Array(KM + 2);
for (let i = 1; i <= KM + 1; i++) NJ[i] = 2 * i;
/** Work per column, for the order selection: A[j] = 1 + n_1 + … + n_j. */
const WORK = new Float64Array(KM + 2).fill(Number.NaN);
WORK[1] = 1 + NJ[1];
for (let i = 2; i <= KM; i++) WORK[i] = WORK[i - 1] + NJ[i];
/** Aitken–Neville denominators (n_j/n_{l−1})² − 1, at [j·(KM+1) + l], computed as ODEX computes them. */
const NEVILLE = new Float64Array((KM + 2) * (KM + 1));
for (let j = 2; j <= KM; j++) for (let l = j; l > 1; l--) NEVILLE[j * (KM + 1) + l] = (NJ[j] / NJ[l - 1]) ** 2 - 1;
/** Per column: the exponent 1/(2j − 1) and the smallest step factor 0.02^exponent. */
const EXPONENT = new Float64Array(KM + 1);
const FAC_MIN = new Float64Array(KM + 1);
for (let j = 1; j <= KM; j++) {
  EXPONENT[j] = 1 / (2 * j - 1);
  FAC_MIN[j] = FAC1 ** EXPONENT[j];
}

/**
 * The extrapolation stepper for `rhs` at local relative tolerance `tol`.
 * Each `advance` call is one integration from r to rEnd with fresh step and
 * order control, as one `odex` solve is.
 */
export function gbsStepper(rhs: Rhs, tol: number, maxSteps: number): Stepper {
  const y = new Float64Array(N);
  const dz = new Float64Array(N);
  const dy = new Float64Array(N);
  const yh1 = new Float64Array(N);
  const yh2 = new Float64Array(N);
  const scal = new Float64Array(N);
  /** tableau rows t[j] at [j·N + i], j = 1…KM */
  const t = new Float64Array((KM + 1) * N);
  const hh = new Float64Array(KM + 2);
  const w = new Float64Array(KM + 2);
  // ODEX's first order guess from the tolerance.
  const kStart = Math.max(2, Math.min(KM - 1, Math.floor(-(Math.log(tol + 1e-40) / Math.LN10) * 0.6 + 1.5)));

  return {
    advance(state, x0, xEnd, h0, overflow): AdvanceResult {
      for (let i = 0; i < N; i++) {
        y[i] = state[i];
        scal[i] = tol + Math.abs(y[i]);
      }
      hh.fill(Number.NaN);
      w.fill(Number.NaN);
      w[1] = 0;
      const hMax = Math.abs(xEnd - x0);
      const posneg = xEnd - x0 >= 0 ? 1 : -1;
      let x = x0;
      let k = kStart;
      let h = Math.max(Math.abs(h0), 1e-4);
      h = posneg * Math.min(h, hMax, Math.abs(xEnd - x) / 2);
      let hLast = h0;
      let nStep = 0;
      // The state at the start is reported first, as ODEX's first output call does.
      if (Math.abs(y[0]) + Math.abs(y[1]) > overflow) return { r: x, steps: 0, h: hLast };
      let err = 0;
      let errOld = 1e10;
      const hoptde = posneg * hMax;
      let reject = false;
      let last = false;
      let atov = false;
      let kc = 0;

      /** Line j of the tableau by the explicit midpoint rule, extrapolated; sets err and the optimal step hh[j]. */
      const midex = (j: number): void => {
        const nj = NJ[j];
        const hj = h / nj;
        for (let i = 0; i < N; i++) {
          yh1[i] = y[i];
          yh2[i] = y[i] + hj * dz[i];
        }
        const m = nj - 1;
        for (let mm = 1; mm <= m; mm++) {
          rhs(dy, yh2, x + hj * mm);
          for (let i = 0; i < N; i++) {
            const ys = yh1[i];
            yh1[i] = yh2[i];
            yh2[i] = ys + 2 * hj * dy[i];
          }
          if (mm <= 1 && j <= 2) {
            // stability check
            let del1 = 0;
            for (let i = 0; i < N; i++) del1 += (dz[i] / scal[i]) ** 2;
            let del2 = 0;
            for (let i = 0; i < N; i++) del2 += ((dy[i] - dz[i]) / scal[i]) ** 2;
            const quot = del2 / Math.max(U_ROUND, del1);
            if (quot > 4) {
              atov = true;
              h *= REDUCTION;
              reject = true;
              return;
            }
          }
        }
        // final smoothing step
        rhs(dy, yh2, x + h);
        const tj = j * N;
        for (let i = 0; i < N; i++) t[tj + i] = (yh1[i] + yh2[i] + hj * dy[i]) / 2;
        if (j === 1) return;
        // polynomial extrapolation
        const row = j * (KM + 1);
        for (let l = j; l > 1; l--) {
          const fac = NEVILLE[row + l];
          const a = l * N;
          const b = (l - 1) * N;
          for (let i = 0; i < N; i++) t[b + i] = t[a + i] + (t[a + i] - t[b + i]) / fac;
        }
        err = 0;
        for (let i = 0; i < N; i++) {
          const t1i = Math.max(Math.abs(y[i]), Math.abs(t[N + i]));
          scal[i] = 0 + tol * t1i;
          err += ((t[N + i] - t[2 * N + i]) / scal[i]) ** 2;
        }
        err = Math.sqrt(err / N);
        if (err * U_ROUND >= 1 || (j > 2 && err >= errOld)) {
          atov = true;
          h *= REDUCTION;
          reject = true;
          return;
        }
        errOld = Math.max(4 * err, 1);
        // optimal step for this column
        const exp0 = EXPONENT[j];
        const facMin = FAC_MIN[j];
        let fac = Math.min(FAC2 / facMin, Math.max(facMin, (err / SAFE1) ** exp0 / SAFE2));
        fac = 1 / fac;
        hh[j] = Math.min(Math.abs(h) * fac, hMax);
        w[j] = WORK[j] / hh[j];
      };

      /** Accept the step; false when the caller must stop (the state passed `overflow`). */
      const accept = (): boolean => {
        const xOld = x;
        x += h;
        for (let i = 0; i < N; i++) y[i] = t[N + i];
        if (x > xOld) hLast = x - xOld;
        if (Math.abs(y[0]) + Math.abs(y[1]) > overflow) return false;
        // optimal order
        let kopt: number;
        if (kc === 2) {
          kopt = Math.min(3, KM - 1);
          if (reject) kopt = 2;
        } else if (kc <= k) {
          kopt = kc;
          if (w[kc - 1] < w[kc] * FAC3) kopt = kc - 1;
          if (w[kc] < w[kc - 1] * FAC4) kopt = Math.min(kc + 1, KM - 1);
        } else {
          kopt = kc - 1;
          if (kc > 3 && w[kc - 2] < w[kc - 1] * FAC3) kopt = kc - 2;
          if (w[kc] < w[kopt] * FAC4) kopt = Math.min(kc, KM - 1);
        }
        if (reject) {
          // after a rejected step
          k = Math.min(kopt, kc);
          h = posneg * Math.min(Math.abs(h), Math.abs(hh[k]));
          reject = false;
          return true;
        }
        if (kopt <= kc) {
          h = hh[kopt];
        } else if (kc < k && w[kc] < w[kc - 1] * FAC4) {
          h = (hh[kc] * WORK[kopt + 1]) / WORK[kc];
        } else {
          h = (hh[kc] * WORK[kopt]) / WORK[kc];
        }
        k = kopt;
        h = posneg * Math.abs(h);
        return true;
      };

      const finish = (stopped: boolean): AdvanceResult => {
        for (let i = 0; i < N; i++) state[i] = y[i];
        return { r: stopped ? x : xEnd, steps: nStep, h: hLast };
      };

      // The states of ODEX's core loop (labels of the Fortran code in the comments).
      const START = 0,
        BASIC = 1,
        CONVERGENCE = 2,
        HOPE = 3,
        ACCEPT = 4,
        REJECT = 5;
      let phase = START;
      for (;;) {
        switch (phase) {
          case START: {
            atov = false;
            // Is xEnd reached in the next step?
            if (0.1 * Math.abs(xEnd - x) <= Math.abs(x) * U_ROUND) return finish(false);
            h = posneg * Math.min(Math.abs(h), Math.abs(xEnd - x), hMax, Math.abs(hoptde));
            if ((x + 1.01 * h - xEnd) * posneg > 0) {
              h = xEnd - x;
              last = true;
            }
            rhs(dz, y, x);
            if (nStep === 0 || last) {
              // the first and last step
              ++nStep;
              phase = HOPE;
              for (let j = 1; j <= k; j++) {
                kc = j;
                midex(j);
                if (atov) {
                  phase = START;
                  break;
                }
                if (j > 1 && err <= 1) {
                  phase = ACCEPT;
                  break;
                }
              }
              continue;
            }
            phase = BASIC;
            continue;
          }
          case BASIC: {
            ++nStep;
            if (nStep >= maxSteps) throw new Error(`gbs exceeded its step limit of ${maxSteps} steps at argument ${x}`);
            kc = k - 1;
            phase = -1;
            for (let j = 1; j <= kc; j++) {
              midex(j);
              if (atov) {
                phase = START;
                break;
              }
            }
            if (phase === START) continue;
            // convergence monitor
            if (k === 2 || reject) phase = CONVERGENCE;
            else if (err <= 1) phase = ACCEPT;
            else if (err > ((NJ[k + 1] * NJ[k]) / 4) ** 2) phase = REJECT;
            else phase = CONVERGENCE;
            continue;
          }
          case CONVERGENCE: {
            midex(k);
            if (atov) {
              phase = START;
              continue;
            }
            kc = k;
            phase = err <= 1 ? ACCEPT : HOPE;
            continue;
          }
          case HOPE: {
            // hope for convergence in line k + 1
            if (err > (NJ[k + 1] / 2) ** 2) {
              phase = REJECT;
              continue;
            }
            kc = k + 1;
            midex(kc);
            if (atov) phase = START;
            else phase = err > 1 ? REJECT : ACCEPT;
            continue;
          }
          case ACCEPT: {
            if (!accept()) return finish(true);
            phase = START;
            continue;
          }
          default: {
            // REJECT
            k = Math.min(k, kc, KM - 1);
            if (k > 2 && w[k - 1] < w[k] * FAC3) k -= 1;
            h = posneg * hh[k];
            reject = true;
            phase = BASIC;
          }
        }
      }
    },
  };
}
