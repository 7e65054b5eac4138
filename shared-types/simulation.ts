/** Time-domain simulation: scenarios, events, live snapshots and results (`simulate`). */
import type { LoadModel, Plant } from './plant';

export const SCENARIO_FORMAT = 'droopline.scenario' as const;
/** Current scenario file version. */
export const SCENARIO_VERSION = 1 as const;

/**
 * Switch a load on or off: either one of the plant's loads by `loadId` (with `online`),
 * or a new block of `kW` / `kVAR` (at rated voltage and frequency) added to the bus.
 * A negative block sheds that much of a constant-power load.
 */
export interface LoadStepEvent {
  atS: number;
  type: 'load-step';
  loadId?: string;
  online?: boolean;
  kW?: number;
  kVAR?: number;
  model?: LoadModel;
}

/**
 * A set trips: its breaker opens and, with `shutdown` (default true), the engine stops and
 * the field is removed. With `openBreaker: false` only the engine stops (an engine
 * protection trip): the set then motors on the bus until its reverse-power relay opens it.
 */
export interface TripEvent {
  atS: number;
  type: 'trip';
  setId: string;
  shutdown?: boolean;
  openBreaker?: boolean;
}

/**
 * The breaker of an off-line set closes onto the bus (or a dead bus). The optional
 * fields set the incoming set's state at the instant of closing: its speed (Hz), its
 * open-circuit voltage (V line-to-line) and its phase angle ahead of the bus (degrees).
 * Left out, the set closes as it is running.
 */
export interface CloseEvent {
  atS: number;
  type: 'close';
  setId: string;
  frequencyHz?: number;
  voltageV?: number;
  angleDeg?: number;
}

/**
 * An operator's setpoint change. `frequencyHz` is the speed reference (no-load
 * frequency in droop, the held frequency in isochronous); `voltageV` the voltage
 * reference (no-load voltage in reactive droop, the held voltage otherwise); `kW` the
 * base-load output (and ends a ramp).
 */
export interface SetpointEvent {
  atS: number;
  type: 'setpoint';
  setId: string;
  frequencyHz?: number;
  voltageV?: number;
  kW?: number;
}

/**
 * Soft loading or unloading: the set goes to load control (base load) and its kW
 * reference moves in a straight line from its present output to `toKW` over
 * `durationS`; it then holds `toKW`.
 */
export interface RampEvent {
  atS: number;
  type: 'ramp';
  setId: string;
  toKW: number;
  durationS: number;
}

/**
 * A motor starts direct on line: its locked-rotor impedance (`kVA` at rated voltage,
 * power factor `pf`) sits on the bus for `durationS`, then the running load
 * (`runningKW`, `runningKVAR`, constant power) replaces it. Left out, the running load is
 * `kVA / 6` at 0.85 power factor (locked-rotor kVA about six times running kVA; common
 * practice, values from memory), and the log says so.
 */
export interface MotorStartEvent {
  atS: number;
  type: 'motor-start';
  kVA: number;
  pf: number;
  durationS: number;
  runningKW?: number;
  runningKVAR?: number;
}

/** Events on a scenario's time line. `atS` is seconds from the start. */
export type ScenarioEvent = LoadStepEvent | TripEvent | CloseEvent | SetpointEvent | RampEvent | MotorStartEvent;

/** The event type names. */
export type ScenarioEventType = ScenarioEvent['type'];

/** A scenario file (`droopline.scenario`, `version: 1`). */
export interface Scenario {
  format?: typeof SCENARIO_FORMAT;
  version?: typeof SCENARIO_VERSION;
  name?: string;
  /** The plant, inline. (A file may name `plantFile` instead; the command line resolves it.) */
  plant: Plant;
  /** Path of a plant file relative to the scenario file (command line only). */
  plantFile?: string;
  /** Simulated time, s. */
  durationS: number;
  /** Integration step, ms (default 1). */
  stepMs?: number;
  /** Output points kept for plotting (decimation target, default 2000). */
  outputPoints?: number;
  /**
   * Ids of off-line sets that start with no field flux, only residual magnetism (a
   * fresh start: shows whether a shunt-excited set builds up its voltage).
   */
  startDeExcited?: string[];
  events: ScenarioEvent[];
}

/** ISO 8528-5 performance class. */
export type PerformanceClass = 'G1' | 'G2' | 'G3';

/** One row of the class verdict table. */
export interface ClassCheck {
  quantity: string;
  unit: string;
  measured: number | null;
  /** Where the measurement itself depends on the class (recovery into the class's band), per class. */
  measuredByClass?: Record<PerformanceClass, number | null>;
  /** The class limit (a maximum, or for negative deviations a lowest allowed value). */
  limits: Record<PerformanceClass, number>;
  /** null where the run does not measure the quantity. */
  pass: Record<PerformanceClass, boolean | null>;
  source: string;
  /** Why a row fails or what it shows (e.g. a run ending outside the steady-state band), one sentence. */
  note?: string;
}

/** A protection operation during a run: a set tripped, or a load shed. */
export interface ProtectionTrip {
  atS: number;
  /** Set or load id. */
  id: string;
  kind: 'set' | 'load';
  /** IEEE C37.2 device number of the element that operated. */
  device: '81U' | '81O' | '27' | '59' | '32';
  /** The log line. */
  text: string;
}

/** A breaker close onto a live bus during a run, as it was at contact. */
export interface CloseRecord {
  setId: string;
  atS: number;
  /** Incoming set's phase angle ahead of the bus, degrees (−180..180). */
  angleDeg: number;
  /** Incoming speed minus bus frequency, Hz. */
  slipHz: number;
  /** (V_incoming − V_bus) / V_rated × 100. */
  voltageDifferencePct: number;
  /** Inside the sync-check window the run judges closes against (common practice between sets). */
  insideWindow: boolean;
  /** Why it was outside, one sentence per failed check. */
  reasons: string[];
  /** The close event gave the incoming state (angle, speed or voltage); false: the run's own phase. */
  stateGiven: boolean;
}

/** One set's final operating point. */
export interface FinalSet {
  id: string;
  online: boolean;
  kW: number;
  kVAR: number;
}

/** Figures read off the run (after the first event; from the start if there is none). */
export interface SimulationMetrics {
  /** Frequency and voltage just before the first event. */
  initial: { frequencyHz: number; voltageV: number };
  frequencyNadirHz: number;
  frequencyPeakHz: number;
  /** Larger of the dip and the rise from the initial frequency, signed, % of rated frequency. */
  frequencyDeviationPct: number;
  /**
   * Time from the first event until frequency stays inside ±`frequencyBandPct` of the steady
   * state of the final loads (`steadyState`); null if it never settles there in the run.
   */
  frequencyRecoveryS: number | null;
  /** Band used for `frequencyRecoveryS`, ± % of rated frequency. */
  frequencyBandPct: number;
  /** Largest fall of bus voltage below its initial value, % of rated voltage (≥ 0). */
  voltageDipPct: number;
  /** Largest rise of bus voltage above its initial value, % of rated voltage (≥ 0). */
  voltagePeakPct: number;
  voltageRecoveryS: number | null;
  /** Band used for `voltageRecoveryS`, ± % of rated voltage. */
  voltageBandPct: number;
  final: {
    frequencyHz: number;
    voltageV: number;
    sets: FinalSet[];
  };
  /**
   * The steady state the controls should reach for the final plant (the steady-state solver on
   * the plant as the run leaves it); recovery times are measured into a band around it. null
   * when there is none (`steadyStateNote` says why).
   */
  steadyState: { frequencyHz: number; voltageV: number } | null;
  steadyStateNote: string | null;
  /**
   * Energy of load not served, kWh: constant-power loads while the bus was below the
   * low-voltage break (they then draw as constant impedance), and every load while the bus was
   * dead; 0 when neither happened.
   */
  unservedKWh: number;
  /** Largest load not served at one instant, kW. */
  maxUnservedKW: number;
  /** Breaker closes onto a live bus, with the state at contact and the sync-check verdict. */
  closes: CloseRecord[];
  /** Protection operations (set trips, load shedding), in order. */
  trips: ProtectionTrip[];
  classes: ClassCheck[];
}

/** Decimated time series for plotting. Per-set arrays follow `setIds` (outer index = set). */
export interface SimulationSeries {
  t: number[];
  frequencyHz: number[];
  voltageV: number[];
  setIds: string[];
  setKW: number[][];
  setKVAR: number[][];
  setCurrentA: number[][];
  setSpeedHz: number[][];
  setTerminalV: number[][];
}

/** Something the run did on its own or was told to, with its time. */
export interface SimulationLogEntry {
  atS: number;
  text: string;
}

/** Result of `simulate`. */
export interface SimulationResult {
  metrics: SimulationMetrics;
  series: SimulationSeries;
  /** Events applied and protection operations, in order. */
  log: SimulationLogEntry[];
  warnings: string[];
  steps: number;
}

/** One set at an instant of a running simulation. */
export interface SetSnapshot {
  id: string;
  online: boolean;
  /** Engine stopped (tripped with shutdown). */
  shutdown: boolean;
  speedHz: number;
  /** Terminal voltage's phase angle ahead of the bus voltage, degrees (−180..180); null on a dead bus. */
  phaseAngleDeg: number | null;
  /** Rotor (internal voltage) angle ahead of the bus voltage, degrees (−180..180); null on a dead bus. */
  rotorAngleDeg: number | null;
  kW: number;
  kVAR: number;
  /** Mechanical power from the engine, kW. */
  mechanicalKW: number;
  currentA: number;
  terminalV: number;
  /** Field voltage, pu (1 pu gives rated voltage on open circuit). */
  fieldPU: number;
}

/** A running simulation's state at its present time (for live views such as the trainer). */
export interface SimulationSnapshot {
  timeS: number;
  /** Bus frequency (inertia-weighted mean speed of the on-line sets), Hz; 0 on a dead bus. */
  frequencyHz: number;
  /** Bus voltage, V line-to-line. */
  voltageV: number;
  deadBus: boolean;
  loadKW: number;
  loadKVAR: number;
  sets: SetSnapshot[];
}
