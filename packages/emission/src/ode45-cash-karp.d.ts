declare module 'ode45-cash-karp' {
  type Deriv = (dydt: Float64Array | number[], y: Float64Array | number[], t: number) => void;
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
  function ode45(y0: Float64Array | number[], deriv: Deriv, t0: number, dt0: number, options?: Options): Integrator;
  export = ode45;
}
