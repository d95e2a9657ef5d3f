// Minimal typing for the untyped CommonJS integrator (ode45-cash-karp 1.1.0).
declare module 'ode45-cash-karp' {
  interface CashKarpOptions {
    tol?: number;
    maxIncreaseFactor?: number;
    maxDecreaseFactor?: number;
    dtMinMag?: number;
    dtMaxMag?: number;
    verbose?: boolean;
    errorScaleFunction?: (component: number, dt: number, y: number, dydt: number) => number;
    errorReduceFunction?: (component: number, accumulated: number, estimate: number) => number;
    errorPostFunction?: (accumulated: number) => number;
  }
  interface CashKarpIntegrator {
    y: Float64Array;
    t: number;
    dt: number;
    /** One adaptive step; returns false once t has reached tLimit. */
    step(tLimit?: number): boolean;
  }
  function createIntegrator(
    y0: Float64Array,
    deriv: (dydt: Float64Array, y: Float64Array, t: number) => void,
    t0: number,
    dt0: number,
    options?: CashKarpOptions,
  ): CashKarpIntegrator;
  export = createIntegrator;
}
