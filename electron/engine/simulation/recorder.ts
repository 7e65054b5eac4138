/**
 * Keeps what a run produces: a decimated series for plotting (every `stride`-th step,
 * about `outputPoints` points over the run) and a denser frequency/voltage trace for the
 * metrics. Buffers are typed arrays that grow by doubling, so recording allocates only
 * now and then, never per step.
 */
import type { SimulationSeries } from '../../../shared-types';

class Growable {
  data: Float64Array;
  length = 0;
  constructor(capacity: number) {
    // Sized to what the run will keep (the recorder works it out): a short run (a closing-map cell of a few steps)
    // then gets arrays small enough for V8 to keep on its heap, not one allocation outside it per series.
    this.data = new Float64Array(Math.max(2, capacity));
  }
  push(v: number): void {
    if (this.length === this.data.length) {
      const next = new Float64Array(this.data.length * 2);
      next.set(this.data);
      this.data = next;
    }
    this.data[this.length++] = v;
  }
  last(): number {
    return this.data[this.length - 1]!;
  }
  toArray(): number[] {
    // A plain loop: Array.from over a typed array walks an iterator, several times slower.
    const n = this.length;
    const d = this.data;
    const out = new Array<number>(n);
    for (let i = 0; i < n; i++) out[i] = d[i]!;
    return out;
  }
}

/** One recorded instant's per-set values, filled by the simulator. */
export interface SetSample {
  kW: Float64Array;
  kVAR: Float64Array;
  currentA: Float64Array;
  speedHz: Float64Array;
  terminalV: Float64Array;
}

/** Decimated series plus the metrics trace. */
export class Recorder {
  readonly stride: number;
  readonly traceStride: number;
  private readonly t: Growable;
  private readonly f: Growable;
  private readonly v: Growable;
  private readonly sets: { kW: Growable; kVAR: Growable; currentA: Growable; speedHz: Growable; terminalV: Growable }[];
  /** Metrics trace: time, frequency (Hz) and voltage (V). */
  readonly traceT: Growable;
  readonly traceF: Growable;
  readonly traceV: Growable;
  private lastStep = -1;
  private lastTraceStep = -1;

  constructor(
    private readonly setIds: string[],
    totalSteps: number,
    outputPoints: number,
  ) {
    this.stride = Math.max(1, Math.ceil(totalSteps / Math.max(2, outputPoints - 1)));
    this.traceStride = Math.max(1, Math.ceil(totalSteps / 200_000));
    const cap = Math.ceil(totalSteps / this.stride) + 2;
    this.f = new Growable(cap);
    this.v = new Growable(cap);
    this.t = new Growable(cap);
    this.sets = setIds.map(() => ({
      kW: new Growable(cap),
      kVAR: new Growable(cap),
      currentA: new Growable(cap),
      speedHz: new Growable(cap),
      terminalV: new Growable(cap),
    }));
    const tcap = Math.ceil(totalSteps / this.traceStride) + 2;
    this.traceT = new Growable(tcap);
    this.traceF = new Growable(tcap);
    this.traceV = new Growable(tcap);
  }

  /** Whether step `k` is one the series keeps (`force` for the last point). */
  wants(k: number, force = false): boolean {
    return k !== this.lastStep && (force || k % this.stride === 0);
  }

  /** Keeps step `k` in the plotted series. */
  record(k: number, tS: number, frequencyHz: number, voltageV: number, s: SetSample): void {
    this.lastStep = k;
    this.t.push(tS);
    this.f.push(frequencyHz);
    this.v.push(voltageV);
    for (let i = 0; i < this.sets.length; i++) {
      const g = this.sets[i]!;
      g.kW.push(s.kW[i]!);
      g.kVAR.push(s.kVAR[i]!);
      g.currentA.push(s.currentA[i]!);
      g.speedHz.push(s.speedHz[i]!);
      g.terminalV.push(s.terminalV[i]!);
    }
  }

  /** Keeps step `k` in the metrics trace when it falls on the trace stride (or `force`). */
  trace(k: number, tS: number, frequencyHz: number, voltageV: number, force = false): void {
    if (k === this.lastTraceStep || (!force && k % this.traceStride !== 0)) return;
    this.lastTraceStep = k;
    this.traceT.push(tS);
    this.traceF.push(frequencyHz);
    this.traceV.push(voltageV);
  }

  /** The series as plain arrays. */
  series(): SimulationSeries {
    return {
      t: this.t.toArray(),
      frequencyHz: this.f.toArray(),
      voltageV: this.v.toArray(),
      setIds: [...this.setIds],
      setKW: this.sets.map((g) => g.kW.toArray()),
      setKVAR: this.sets.map((g) => g.kVAR.toArray()),
      setCurrentA: this.sets.map((g) => g.currentA.toArray()),
      setSpeedHz: this.sets.map((g) => g.speedHz.toArray()),
      setTerminalV: this.sets.map((g) => g.terminalV.toArray()),
    };
  }
}

export type { Growable };
