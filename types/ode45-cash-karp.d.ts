// Minimal typing for the untyped CommonJS integrator ode45-cash-karp 1.1.0, shared by the packages that use it.
declare module 'ode45-cash-karp' {
  type Deriv = (dydt: Float64Array, y: Float64Array, t: number) => void;
  interface Options {
    tol?: number;
    maxIncreaseFactor?: number;
    maxDecreaseFactor?: number;
    dtMinMag?: number;
    dtMaxMag?: number;
    verbose?: boolean;
    errorScaleFunction?: (i: number, dt: number, y: number, dydt: number) => number;
    errorReduceFunction?: (i: number, accumulated: number, estimate: number) => number;
    errorPostFunction?: (accumulated: number) => number;
  }
  interface Integrator {
    y: Float64Array;
    t: number;
    dt: number;
    step(tLimit?: number): boolean;
    steps(n: number, tLimit?: number): boolean | undefined;
  }
  function ode45(y0: Float64Array, deriv: Deriv, t0: number, dt0: number, options?: Options): Integrator;
  export = ode45;
}
