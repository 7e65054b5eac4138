/**
 * The events of a scenario's time line, checked by their type: one rule for a scenario file
 * (`simulate`) and for the scenarios kept in a project, and the checks of events against their
 * run and plant (`checkEvents`).
 */
import { z } from 'zod';
import { flag, id, nonNegative, num, oneOf, positive } from './schema-kit';

const atS = () => nonNegative('s');

/** A load step draws as constant power or constant impedance (ZIP shares belong to plant loads). */
const STEP_MODELS = ['constant-power', 'constant-impedance'] as const;

const loadStep = z
  .object({
    atS: atS(),
    type: z.literal('load-step'),
    loadId: id().optional(),
    online: flag().optional(),
    kW: num('kW').optional(),
    kVAR: num('kVAR').optional(),
    model: oneOf(STEP_MODELS).optional(),
  })
  .strict();

const trip = z
  .object({
    atS: atS(),
    type: z.literal('trip'),
    setId: id(),
    shutdown: flag().optional(),
    openBreaker: flag().optional(),
  })
  .strict();

const close = z
  .object({
    atS: atS(),
    type: z.literal('close'),
    setId: id(),
    frequencyHz: positive('Hz').optional(),
    voltageV: nonNegative('V').optional(),
    angleDeg: num('°').gte(-360, 'must be −360° or more').lte(360, 'must be 360° or less').optional(),
  })
  .strict();

const setpoint = z
  .object({
    atS: atS(),
    type: z.literal('setpoint'),
    setId: id(),
    frequencyHz: positive('Hz').optional(),
    voltageV: positive('V').optional(),
    kW: num('kW').optional(),
  })
  .strict();

const ramp = z.object({ atS: atS(), type: z.literal('ramp'), setId: id(), toKW: num('kW'), durationS: nonNegative('s') }).strict();

const motorStart = z
  .object({
    atS: atS(),
    type: z.literal('motor-start'),
    kVA: positive('kVA'),
    pf: num('').gt(0, 'must be greater than 0').lte(1, 'must be 1 or less'),
    durationS: positive('s'),
    runningKW: num('kW').optional(),
    runningKVAR: num('kVAR').optional(),
  })
  .strict();

const EVENT_TYPES = '"load-step", "trip", "close", "setpoint", "ramp" or "motor-start"';

/** One event of a scenario, checked by its type. */
export const eventSchema = z.discriminatedUnion('type', [loadStep, trip, close, setpoint, ramp, motorStart], {
  error: (iss) => (iss.code === 'invalid_union' ? `must be ${EVENT_TYPES}` : undefined),
});

/**
 * The same rules for an event kept in a project, which also keeps any field this version does
 * not know (a project never loses data on its way through open and save).
 */
export const projectEventSchema = z.discriminatedUnion(
  'type',
  [loadStep.loose(), trip.loose(), close.loose(), setpoint.loose(), ramp.loose(), motorStart.loose()],
  { error: (iss) => (iss.code === 'invalid_union' ? `must be ${EVENT_TYPES}` : undefined) },
);

/** The fields of an event that `checkEvents` reads (any event kind fits). */
interface EventFields {
  atS: number;
  type: string;
  setId?: string;
  loadId?: string;
  kW?: number;
  kVAR?: number;
  voltageV?: number;
  frequencyHz?: number;
  openBreaker?: boolean;
  shutdown?: boolean;
}

/**
 * Checks a scenario's events against its run and its plant: each event within the run, each
 * set and load id in the plant, the fields each kind needs. `add` receives the path below the
 * scenario (`['events', i, field]`). Used by the scenario schema and the project schema alike.
 */
export function checkEvents(
  events: readonly EventFields[],
  durationS: number,
  plant: { sets: readonly { id: string }[]; loads: readonly { id: string }[] },
  add: (path: (string | number)[], message: string) => void,
): void {
  const setIds = new Set(plant.sets.map((x) => x.id));
  const loadIds = new Set(plant.loads.map((x) => x.id));
  events.forEach((e, i) => {
    const at = (field: string, message: string) => add(['events', i, field], message);
    if (e.atS > durationS) at('atS', `must be within the run (0 to ${durationS} s)`);
    if (e.setId !== undefined && !setIds.has(e.setId)) at('setId', `no set "${e.setId}" in the plant`);
    if (e.type === 'load-step') {
      if (e.loadId !== undefined) {
        if (!loadIds.has(e.loadId)) at('loadId', `no load "${e.loadId}" in the plant`);
        if (e.kW !== undefined || e.kVAR !== undefined) at('kW', 'give either loadId or kW/kVAR, not both');
      } else if (e.kW === undefined && e.kVAR === undefined) at('kW', 'is required (or name a plant load with loadId)');
    }
    if (e.type === 'trip' && e.openBreaker === false && e.shutdown === false)
      at('shutdown', 'must be true when openBreaker is false (otherwise nothing trips)');
    if (e.type === 'setpoint' && e.frequencyHz === undefined && e.voltageV === undefined && e.kW === undefined)
      at('frequencyHz', 'give frequencyHz, voltageV or kW');
  });
}
