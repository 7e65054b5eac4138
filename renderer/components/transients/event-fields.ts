/** The editable fields of each event type: key, label with unit, and what kind of input. */
import type { ScenarioEventType } from '../../../shared-types';

/** One input of an event row. */
export interface EventField {
  key: string;
  label: string;
  unit: string;
  kind: 'number' | 'set' | 'load' | 'on-off';
  /** Optional numbers may be left blank (the engine then uses the set's present state). */
  optional?: boolean;
  step?: number;
  hint?: string;
  /** Shown only when this holds for the event (e.g. kW only for a new block, not a plant load). */
  when?: (event: Record<string, unknown>) => boolean;
}

const newBlock = (e: Record<string, unknown>) => e['loadId'] === undefined;

/** Fields per event type, in the order shown (time is always first and not listed here). */
export const EVENT_FIELDS: Readonly<Record<ScenarioEventType, readonly EventField[]>> = {
  'load-step': [
    { key: 'loadId', label: 'Load', unit: '', kind: 'load', optional: true, hint: "a new block, or one of the plant's loads switched on or off" },
    { key: 'kW', label: 'Active', unit: 'kW', kind: 'number', hint: 'negative sheds load', when: newBlock },
    { key: 'kVAR', label: 'Reactive', unit: 'kVAR', kind: 'number', when: newBlock },
    { key: 'online', label: 'Switch', unit: '', kind: 'on-off', when: (e) => !newBlock(e) },
  ],
  trip: [{ key: 'setId', label: 'Set', unit: '', kind: 'set' }],
  close: [
    { key: 'setId', label: 'Set', unit: '', kind: 'set' },
    { key: 'frequencyHz', label: 'Speed', unit: 'Hz', kind: 'number', optional: true, step: 0.01, hint: 'blank: as running' },
    { key: 'voltageV', label: 'Voltage', unit: 'V', kind: 'number', optional: true },
    { key: 'angleDeg', label: 'Angle', unit: '°', kind: 'number', optional: true, hint: 'incoming ahead of bus' },
  ],
  setpoint: [
    { key: 'setId', label: 'Set', unit: '', kind: 'set' },
    { key: 'frequencyHz', label: 'Speed ref.', unit: 'Hz', kind: 'number', optional: true, step: 0.01 },
    { key: 'voltageV', label: 'Voltage ref.', unit: 'V', kind: 'number', optional: true },
    { key: 'kW', label: 'Base kW', unit: 'kW', kind: 'number', optional: true },
  ],
  ramp: [
    { key: 'setId', label: 'Set', unit: '', kind: 'set' },
    { key: 'toKW', label: 'To', unit: 'kW', kind: 'number' },
    { key: 'durationS', label: 'Over', unit: 's', kind: 'number', step: 0.1 },
  ],
  'motor-start': [
    { key: 'kVA', label: 'Locked-rotor', unit: 'kVA', kind: 'number' },
    { key: 'pf', label: 'PF', unit: '', kind: 'number', step: 0.01 },
    { key: 'durationS', label: 'Start time', unit: 's', kind: 'number', step: 0.1 },
  ],
};

/** One-letter marks on the time line (with the full name as its tooltip). */
export const EVENT_MARKS: Readonly<Record<ScenarioEventType, string>> = {
  'load-step': 'L',
  trip: 'T',
  close: 'C',
  setpoint: 'S',
  ramp: 'R',
  'motor-start': 'M',
};
