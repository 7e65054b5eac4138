/**
 * Fixed-step classical Runge–Kutta (RK4). The right-hand side writes its derivatives
 * into a caller-supplied array; the stage arrays are allocated once, so a step
 * allocates nothing.
 */

/** Right-hand side dy/dt = f(t, y), written into `dy`. */
export type Rhs = (t: number, y: Float64Array, dy: Float64Array) => void;

/** Work arrays of one RK4 integrator. */
export interface Rk4 {
  readonly k1: Float64Array;
  readonly k2: Float64Array;
  readonly k3: Float64Array;
  readonly k4: Float64Array;
  readonly tmp: Float64Array;
}

/** Allocates the work arrays for a state of `size` entries. */
export function createRk4(size: number): Rk4 {
  return { k1: new Float64Array(size), k2: new Float64Array(size), k3: new Float64Array(size), k4: new Float64Array(size), tmp: new Float64Array(size) };
}

/**
 * Advances `y` in place from `t` to `t + h`. `w.k1` must already hold f(t, y): the
 * caller evaluates it to read the outputs at `t` (see `Simulation`), so it is not
 * computed twice.
 */
export function rk4StepFromK1(f: Rhs, t: number, h: number, y: Float64Array, w: Rk4): void {
  const { k1, k2, k3, k4, tmp } = w;
  const n = y.length;
  const h2 = 0.5 * h;
  for (let j = 0; j < n; j++) tmp[j] = y[j]! + h2 * k1[j]!;
  f(t + h2, tmp, k2);
  for (let j = 0; j < n; j++) tmp[j] = y[j]! + h2 * k2[j]!;
  f(t + h2, tmp, k3);
  for (let j = 0; j < n; j++) tmp[j] = y[j]! + h * k3[j]!;
  f(t + h, tmp, k4);
  const h6 = h / 6;
  for (let j = 0; j < n; j++) y[j] = y[j]! + h6 * (k1[j]! + 2 * k2[j]! + 2 * k3[j]! + k4[j]!);
}
