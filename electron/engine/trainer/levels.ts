/**
 * Difficulty levels of the synchronizing trainer, and the defaults an exercise starts
 * from when the caller gives no plant data.
 */
import type { SyncLimits, TrainerBus, TrainerLevel, TrainerMachine } from '../../../shared-types';

/** The levels, easiest first. Breaker times are typical of the trade (about 3–5 cycles for a fast vacuum breaker, 15 cycles or more for an old motor-charged one). */
export const TRAINER_LEVELS: readonly TrainerLevel[] = [
  {
    id: 'steady',
    label: '1 · Steady bus, fast breaker',
    description: 'The bus holds its frequency; the breaker closes 80 ms after the command.',
    breakerClosingMs: 80,
    busDriftHz: 0,
    mustSetWindow: false,
  },
  {
    id: 'slow-breaker',
    label: '2 · Slow breaker',
    description: 'The breaker takes 300 ms to close: give the command ahead of the in-phase moment.',
    breakerClosingMs: 300,
    busDriftHz: 0,
    mustSetWindow: false,
  },
  {
    id: 'drifting-bus',
    label: '3 · Drifting bus',
    description: 'The running sets wander by up to ±0.15 Hz as their load changes; the breaker takes 200 ms.',
    breakerClosingMs: 200,
    busDriftHz: 0.15,
    mustSetWindow: false,
  },
  {
    id: 'set-window',
    label: '4 · Set the window first',
    description: 'Set the sync-check window before you may close; the bus drifts and the breaker takes 250 ms.',
    breakerClosingMs: 250,
    busDriftHz: 0.1,
    mustSetWindow: true,
  },
];

/** Looks a level up by id (undefined when unknown). */
export function findLevel(id: string): TrainerLevel | undefined {
  return TRAINER_LEVELS.find((l) => l.id === id);
}

/**
 * The window an exercise grades against unless the caller gives one: ±10°, 0.1 Hz,
 * 5 % — common practice for manual synchronizing of low-voltage sets (a rule of thumb).
 */
export const DEFAULT_TRAINER_WINDOW: SyncLimits = { slipHz: 0.1, angleDeg: 10, voltagePct: 5 };

/**
 * The machine-standard synchronizing limits used to derive a set's surge and torque limits:
 * angle ±10°, voltage 0 to +5 %, slip ±0.067 Hz (IEEE C50.12/C50.13 synchronizing limits,
 * values from memory — verify against the standard you hold).
 */
export const MACHINE_STANDARD_WINDOW = { angleDeg: 10, voltagePct: 5, slipHz: 0.067 } as const;

/** A 500 kVA, 400 V, 50 Hz, 4-pole set with common data (invented for the demo). */
export const DEFAULT_TRAINER_MACHINE: TrainerMachine = {
  label: 'standard 500 kVA set (demo data)',
  ratedKVA: 500,
  ratedKW: 400,
  ratedVoltageV: 400,
  ratedFrequencyHz: 50,
  poles: 4,
  xddpPU: 0.15,
  xdpPU: 0.25,
  tdopS: 2.5,
  inertiaS: 1,
  dampingPU: 2,
  raPU: 0.01,
  droopPct: 4,
  actuatorLagS: 0.05,
  engineLagS: 0.3,
  regulatorGainPU: 50,
  exciterLagS: 0.1,
  ceilingPU: 3,
};

/** A running bus of 2000 kVA of sets with X''d about 0.15 pu (invented for the demo). */
export const DEFAULT_TRAINER_BUS: TrainerBus = { ratedKVA: 2000, xPU: 0.15, inertiaS: 1.2 };

/**
 * How close to rated a set must be to energise a dead bus: voltage within ±5 % and frequency within ±0.5 Hz
 * (1 % of 50 Hz) of rated — common practice for a set closing onto a dead bus (a rule of thumb, not a standard's
 * figure; verify against the plant's own dead-bus closing settings).
 */
export const DEAD_BUS_CLOSE_LIMITS = { voltagePct: 5, frequencyHz: 0.5 } as const;
