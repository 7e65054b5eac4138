/**
 * Checks a transient scenario before it runs, so the editor can name the field and the rule
 * beside it (`events[2].kW: must be a number`). The simulator's schema checks again on the
 * engine side; these rules catch what a user types before a run is asked for.
 */
import type { FieldIssue, Plant, ProjectScenario, ScenarioEvent, ScenarioEventType } from '../../shared-types';

/** Longest scenario the editor accepts, s (a minute or two shows every ISO 8528-5 recovery). */
export const MAX_DURATION_S = 600;
/** Coarsest integration step the editor accepts, ms. */
export const MAX_STEP_MS = 20;

/** Event types in the order the editor offers them, with their labels. */
export const EVENT_TYPES: readonly { type: ScenarioEventType; label: string }[] = [
  { type: 'load-step', label: 'Load step' },
  { type: 'trip', label: 'Set trip' },
  { type: 'close', label: 'Breaker close' },
  { type: 'motor-start', label: 'Motor start' },
  { type: 'setpoint', label: 'Setpoint change' },
  { type: 'ramp', label: 'Ramp (soft load)' },
];

const finite = (v: unknown): v is number => typeof v === 'number' && Number.isFinite(v);

/** A new event of `type` at `atS`, with values that make sense on `plant`. */
export function newEvent(type: ScenarioEventType, atS: number, plant: Plant | null): ScenarioEvent {
  const sets = plant?.sets ?? [];
  const online = sets.find((s) => s.online) ?? sets[0];
  const offline = sets.find((s) => !s.online) ?? sets[sets.length - 1];
  const onlineKW = sets.filter((s) => s.online).reduce((a, s) => a + s.ratedKW, 0);
  const kW = Math.round(onlineKW * 0.2);
  switch (type) {
    case 'load-step':
      return { atS, type, kW, kVAR: Math.round(kW * 0.75) };
    case 'trip':
      return { atS, type, setId: online?.id ?? '' };
    case 'close':
      return { atS, type, setId: offline?.id ?? '', angleDeg: 5 };
    case 'setpoint':
      return { atS, type, setId: online?.id ?? '', frequencyHz: online?.governor.noLoadHz ?? plant?.ratedFrequencyHz ?? 50 };
    case 'ramp':
      return { atS, type, setId: online?.id ?? '', toKW: Math.round((online?.ratedKW ?? 100) * 0.5), durationS: 5 };
    case 'motor-start':
      return { atS, type, kVA: Math.round(onlineKW * 0.15), pf: 0.3, durationS: 2 };
  }
}

/** Every field problem of `scenario` on `plant`; empty when it can run. */
export function scenarioIssues(scenario: ProjectScenario, plant: Plant | null): FieldIssue[] {
  const issues: FieldIssue[] = [];
  const add = (path: string, message: string) => issues.push({ path, message });
  if (!scenario.name.trim()) add('name', 'must not be empty');
  if (!finite(scenario.durationS)) add('durationS', 'must be a number');
  else if (scenario.durationS <= 0) add('durationS', 'must be greater than 0');
  else if (scenario.durationS > MAX_DURATION_S) add('durationS', `must be at most ${MAX_DURATION_S} s`);
  if (!finite(scenario.stepMs)) add('stepMs', 'must be a number');
  else if (scenario.stepMs <= 0) add('stepMs', 'must be greater than 0');
  else if (scenario.stepMs > MAX_STEP_MS) add('stepMs', `must be at most ${MAX_STEP_MS} ms`);
  const ids = new Set(plant?.sets.map((s) => s.id) ?? []);
  scenario.events.forEach((e, i) => {
    const at = (field: string) => `events[${i}].${field}`;
    const num = (field: string, value: unknown, rule?: { gt?: number; ge?: number; le?: number; optional?: boolean }) => {
      if (value === undefined && rule?.optional) return;
      if (!finite(value)) return add(at(field), 'must be a number');
      if (rule?.gt !== undefined && !(value > rule.gt)) return add(at(field), `must be greater than ${rule.gt}`);
      if (rule?.ge !== undefined && !(value >= rule.ge)) return add(at(field), `must be ${rule.ge} or more`);
      if (rule?.le !== undefined && !(value <= rule.le)) return add(at(field), `must be at most ${rule.le}`);
    };
    num('atS', e.atS, { ge: 0 });
    if (finite(e.atS) && finite(scenario.durationS) && e.atS >= scenario.durationS)
      add(at('atS'), `must be before the end of the run (${scenario.durationS} s)`);
    const set = (id: string) => {
      if (!id) add(at('setId'), 'must name a set');
      else if (!ids.has(id)) add(at('setId'), `"${id}" is not a set of the plant`);
    };
    switch (e.type) {
      case 'load-step':
        if (e.loadId !== undefined) {
          if (!plant?.loads.some((l) => l.id === e.loadId)) add(at('loadId'), `"${e.loadId}" is not a load of the plant`);
        } else {
          num('kW', e.kW);
          num('kVAR', e.kVAR);
          if (finite(e.kW) && finite(e.kVAR) && e.kW === 0 && e.kVAR === 0) add(at('kW'), 'a load step of 0 kW and 0 kVAR does nothing');
        }
        break;
      case 'trip':
        set(e.setId);
        break;
      case 'close':
        set(e.setId);
        num('frequencyHz', e.frequencyHz, { gt: 0, optional: true });
        num('voltageV', e.voltageV, { ge: 0, optional: true });
        num('angleDeg', e.angleDeg, { ge: -180, le: 180, optional: true });
        break;
      case 'setpoint':
        set(e.setId);
        if (e.frequencyHz === undefined && e.voltageV === undefined && e.kW === undefined) add(at('frequencyHz'), 'give a new frequency, voltage or kW');
        num('frequencyHz', e.frequencyHz, { gt: 0, optional: true });
        num('voltageV', e.voltageV, { gt: 0, optional: true });
        num('kW', e.kW, { optional: true });
        break;
      case 'ramp':
        set(e.setId);
        num('toKW', e.toKW);
        num('durationS', e.durationS, { gt: 0 });
        break;
      case 'motor-start':
        num('kVA', e.kVA, { gt: 0 });
        num('pf', e.pf, { gt: 0, le: 1 });
        num('durationS', e.durationS, { gt: 0 });
        break;
    }
  });
  return issues;
}

/** The report's and the editor's starter scenarios for a plant (our own examples). */
export function starterScenarios(plant: Plant | null): ProjectScenario[] {
  const sets = plant?.sets ?? [];
  const last = sets.filter((s) => s.online).slice(-1)[0];
  const step = newEvent('load-step', 1, plant);
  const list: ProjectScenario[] = [{ id: 'block-load', name: 'Block load step', durationS: 12, stepMs: 1, events: [step] }];
  if (last && sets.filter((s) => s.online).length > 1) {
    list.push({ id: 'set-trip', name: `Trip of ${last.id}`, durationS: 12, stepMs: 1, events: [{ atS: 1, type: 'trip', setId: last.id }] });
  }
  return list;
}
