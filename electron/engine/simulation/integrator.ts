/**
 * Fixed-step classical Runge–Kutta (RK4). The right-hand side writes its derivatives
 * into a caller-supplied array and reads the time of the stage from a clock object the
 * integrator sets (a number passed to a call that is not inlined is boxed on the heap,
 * four times a step; a field write is not); the stage arrays are allocated once, so a
 * step allocates nothing.
 */

/** Right-hand side dy/dt = f(clock.t, y), written into `dy`. */
export type Rhs = (y: Float64Array, dy: Float64Array) => void;

/** Where the integrator puts the time of each stage for the right-hand side, s. */
export interface Clock {
  t: number;
}

/** Work arrays and step of one RK4 integrator. */
export interface Rk4 {
  readonly k1: Float64Array;
  readonly k2: Float64Array;
  readonly k3: Float64Array;
  readonly k4: Float64Array;
  readonly tmp: Float64Array;
  /** Step, s. */
  readonly h: number;
}

/** Allocates the work arrays for a state of `size` entries and a step of `h` seconds. */
export function createRk4(size: number, h: number): Rk4 {
  return { k1: new Float64Array(size), k2: new Float64Array(size), k3: new Float64Array(size), k4: new Float64Array(size), tmp: new Float64Array(size), h };
}

/**
 * Advances `y` in place from `clock.t` to `clock.t + h` (and leaves `clock.t` at the start
 * time). `w.k1` must already hold f(t, y): the caller evaluates it to read the outputs at
 * `t` (see `Simulation`), so it is not computed twice.
 */
export function rk4StepFromK1(f: Rhs, clock: Clock, y: Float64Array, w: Rk4): void {
  const { k1, k2, k3, k4, tmp, h } = w;
  const t = clock.t;
  const n = y.length;
  const h2 = 0.5 * h;
  axpy(tmp, y, h2, k1, n);
  clock.t = t + h2;
  f(tmp, k2);
  axpy(tmp, y, h2, k2, n);
  f(tmp, k3);
  axpy(tmp, y, h, k3, n);
  clock.t = t + h;
  f(tmp, k4);
  const h6 = h / 6;
  // Four entries a turn, as `axpy`.
  let j = 0;
  for (; j + 3 < n; j += 4) {
    y[j] = y[j]! + h6 * (k1[j]! + 2 * k2[j]! + 2 * k3[j]! + k4[j]!);
    y[j + 1] = y[j + 1]! + h6 * (k1[j + 1]! + 2 * k2[j + 1]! + 2 * k3[j + 1]! + k4[j + 1]!);
    y[j + 2] = y[j + 2]! + h6 * (k1[j + 2]! + 2 * k2[j + 2]! + 2 * k3[j + 2]! + k4[j + 2]!);
    y[j + 3] = y[j + 3]! + h6 * (k1[j + 3]! + 2 * k2[j + 3]! + 2 * k3[j + 3]! + k4[j + 3]!);
  }
  for (; j < n; j++) y[j] = y[j]! + h6 * (k1[j]! + 2 * k2[j]! + 2 * k3[j]! + k4[j]!);
  clock.t = t;
}

/**
 * out = a + c·b over the first `n` entries, four entries a turn of the loop (V8 does not unroll loops; a quarter of
 * the loop's own compare-and-branch work, same arithmetic entry by entry).
 */
function axpy(out: Float64Array, a: Float64Array, c: number, b: Float64Array, n: number): void {
  let j = 0;
  for (; j + 3 < n; j += 4) {
    out[j] = a[j]! + c * b[j]!;
    out[j + 1] = a[j + 1]! + c * b[j + 1]!;
    out[j + 2] = a[j + 2]! + c * b[j + 2]!;
    out[j + 3] = a[j + 3]! + c * b[j + 3]!;
  }
  for (; j < n; j++) out[j] = a[j]! + c * b[j]!;
}
