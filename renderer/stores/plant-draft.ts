/**
 * The plant as the editor holds it (a draft that may be invalid while the user types)
 * and pure edits on it. Every edit returns a new draft and leaves the old one intact,
 * so the undo history can keep old drafts by reference.
 */
import type { GenSet, Load, Plant } from '../../shared-types';
import { SET_DEFAULTS } from '../../shared-types';

/** `T` with every number allowed to be `null` (an emptied field). */
export type Editable<T> = T extends number ? T | null : T extends (infer U)[] ? Editable<U>[] : T extends object ? { [K in keyof T]: Editable<T[K]> } : T;

/** A plant being edited: the plant-file shape, with numbers that may be empty. */
export type PlantDraft = Editable<Plant>;
export type SetDraft = Editable<GenSet>;
export type LoadDraft = Editable<Load>;

/** One step of a field path: a property name or a list index. */
export type PathStep = string | number;

/** Parsed paths: every editor field asks on every edit, so each path is split once. */
const parsed = new Map<string, PathStep[]>();

/**
 * Splits a field path as the engine writes it (`sets[1].governor.droopPct`) into steps.
 * The same string names the field in the editor, so issues map to fields by equality.
 */
export function parsePath(path: string): readonly PathStep[] {
  const known = parsed.get(path);
  if (known) return known;
  const steps: PathStep[] = [];
  for (const m of path.matchAll(/([^.[\]]+)|\[(\d+)\]/g)) {
    if (m[2] !== undefined) steps.push(Number(m[2]));
    else if (m[1] !== undefined) steps.push(m[1]);
  }
  if (parsed.size > 5000) parsed.clear();
  parsed.set(path, steps);
  return steps;
}

/** The value at `path` in `root`, or undefined. */
export function getIn(root: unknown, path: string): unknown {
  let v: unknown = root;
  // By index, not for…of: every field reads its value this way on each keystroke.
  const steps = parsePath(path);
  for (let i = 0; i < steps.length; i++) {
    if (v === null || typeof v !== 'object') return undefined;
    v = (v as Record<PathStep, unknown>)[steps[i]!];
  }
  return v;
}

/** A copy of `root` with `value` at `path`; only the objects along the path are copied. */
export function setIn<T>(root: T, path: string, value: unknown): T {
  const steps = parsePath(path);
  const put = (node: unknown, i: number): unknown => {
    const step = steps[i];
    if (step === undefined) return value;
    if (Array.isArray(node)) {
      const copy = node.slice();
      copy[step as number] = put(node[step as number], i + 1);
      return copy;
    }
    const obj = (node !== null && typeof node === 'object' ? node : {}) as Record<PathStep, unknown>;
    return { ...obj, [step]: put(obj[step], i + 1) };
  };
  return put(root, 0) as T;
}

/** A deep copy of plain data (drafts hold only JSON values). */
export function clonePlain<T>(v: T): T {
  return JSON.parse(JSON.stringify(v)) as T;
}

const hasOwn = (o: object, k: string): boolean => Object.prototype.hasOwnProperty.call(o, k);

/** True when `a` and `b` hold the same JSON values (plain data only: objects, arrays, numbers, strings, booleans, null). */
export function samePlain(a: unknown, b: unknown): boolean {
  if (Object.is(a, b)) return true;
  if (a === null || b === null || typeof a !== 'object' || typeof b !== 'object') return false;
  if (Array.isArray(a)) {
    if (!Array.isArray(b) || a.length !== b.length) return false;
    for (let i = 0; i < a.length; i++) if (!samePlain(a[i], b[i])) return false;
    return true;
  }
  if (Array.isArray(b)) return false;
  // Keys walked with for…in (no key arrays made: this runs on every result an edit brings back).
  const x = a as Record<string, unknown>;
  const y = b as Record<string, unknown>;
  let keys = 0;
  for (const k in x) {
    if (!hasOwn(y, k) || !samePlain(x[k], y[k])) return false;
    keys++;
  }
  for (const k in y) if (hasOwn(y, k)) keys--;
  return keys === 0;
}

/**
 * `next` with every part that holds the same values as the matching part of `old` replaced by that part of `old`, or
 * `old` itself when nothing differs: what did not change keeps its identity, so whatever depends on it (a chart's limit
 * curves, a computed column) is not worked out again. `next` must be fresh plain data of the caller's own (a result
 * just received): its objects and arrays are updated in place.
 */
export function keepSame<T>(old: unknown, next: T): T {
  if (Object.is(old, next) || old === null || next === null || typeof old !== 'object' || typeof next !== 'object') return next;
  if (Array.isArray(old) !== Array.isArray(next)) return next;
  // Numbers and other plain values are compared, never written back (writing them would box every number of a curve).
  if (Array.isArray(old) && Array.isArray(next)) {
    // Arrays by index (for…in would make a string for every index).
    let same = old.length === next.length;
    for (let i = 0; i < next.length; i++) {
      const n: unknown = next[i];
      if (i >= old.length) same = false;
      else if (n !== null && typeof n === 'object') {
        const kept = keepSame(old[i], n);
        if (kept !== n) next[i] = kept;
        if (kept !== old[i]) same = false;
      } else if (!Object.is(n, old[i])) same = false;
    }
    return same ? (old as T) : next;
  }
  const o = old as Record<string, unknown>;
  const x = next as Record<string, unknown>;
  let same = true;
  let keys = 0;
  for (const k in x) {
    keys++;
    const n = x[k];
    if (!hasOwn(o, k)) same = false;
    else if (n !== null && typeof n === 'object') {
      const kept = keepSame(o[k], n);
      if (kept !== n) x[k] = kept;
      if (kept !== o[k]) same = false;
    } else if (!Object.is(n, o[k])) same = false;
  }
  for (const k in o) if (hasOwn(o, k)) keys--;
  return same && keys === 0 ? (old as T) : next;
}

/** The first id `prefix + n` (n = 1, 2, …) not in `used`. */
export function nextId(prefix: string, used: readonly string[]): string {
  for (let n = 1; ; n++) {
    const id = `${prefix}${n}`;
    if (!used.includes(id)) return id;
  }
}

/**
 * A new set. When the plant has sets, a copy of the last one's settings (ratings, governor,
 * regulator, machine, feeder, limits; online), so the new set shares kW and kVAR in
 * proportion at once: the same per-unit droop lines from the same no-load set-points.
 * Otherwise a set with every field given (so the draft equals its validated form): 500 kVA,
 * 0.8 PF, 4 poles, 4 % speed and reactive droop with the plant schema's default
 * no-load setpoints (rated output at rated frequency and voltage), typical machine data
 * for an engine set (typical data of engine-set alternators, from memory; verify with the maker's data).
 */
export function newSet(draft: PlantDraft): SetDraft {
  const f = draft.ratedFrequencyHz ?? 50;
  const v = draft.ratedVoltageV ?? 400;
  const id = nextId(
    'G',
    draft.sets.map((s) => s.id),
  );
  const last = draft.sets[draft.sets.length - 1];
  if (last) return { ...clonePlain(last), id, name: `Set ${id}`, online: true };
  return {
    id,
    name: `Set ${id}`,
    online: true,
    ratedKVA: 500,
    ratedKW: 400,
    ratedPF: 0.8,
    poles: 4,
    minKW: 0,
    reversePowerTripPct: 10,
    reversePowerDelayS: SET_DEFAULTS.reversePowerDelayS,
    overloadPct: SET_DEFAULTS.overloadPct,
    motoringPct: SET_DEFAULTS.motoringPct,
    leadingKVARLimitPct: 30,
    governor: {
      mode: 'droop',
      droopPct: 4,
      noLoadHz: f * 1.04,
      setpointHz: f,
      baseKW: 0,
      loadSharingLink: true,
      actuatorLagS: 0.05,
      engineLagS: 0.3,
      isoResetS: 2,
      isoGainPU: SET_DEFAULTS.isoGainPU,
    },
    regulator: {
      mode: 'reactive-droop',
      droopPct: 4,
      noLoadV: v * 1.04,
      setpointV: v,
      pf: 0.9,
      exciterLagS: 0.1,
      gainPU: 50,
      shuntExcited: false,
      residualPU: 0.03,
      vhzKneeBelowHz: SET_DEFAULTS.vhzKneeBelowHz,
      vhzSlopePctPerHz: SET_DEFAULTS.vhzSlopePctPerHz,
      oelPct: SET_DEFAULTS.oelPct,
      oelDelayS: SET_DEFAULTS.oelDelayS,
      oelResetS: SET_DEFAULTS.oelResetS,
      resetS: SET_DEFAULTS.regulatorResetS,
      pfTrimS: SET_DEFAULTS.pfTrimS,
    },
    machine: { ...TYPICAL_MACHINE, dampingPU: 2, raPU: 0.01, tddopS: SET_DEFAULTS.tddopS },
    feeder: { rOhm: 0, xOhm: 0 },
    protection: { ...SET_DEFAULTS.protection },
  };
}

/**
 * Typical machine data of a 100 kVA – 3 MVA engine set, per unit on its own base
 * (typical data of engine-set alternators, ranges from memory: X d 1.5–3.5, X'd 0.15–0.35, X''d 0.10–0.20,
 * T'd0 1–3 s LV, H 0.5–1.5 s). Mid-range values; typical, verify with the maker's data.
 */
export const TYPICAL_MACHINE = { xdPU: 2.5, xdpPU: 0.25, xddpPU: 0.15, tdopS: 2.5, inertiaS: 1 } as const;

/** The typical ranges shown beside the machine-data fields (same source as `TYPICAL_MACHINE`). */
export const TYPICAL_RANGES: Readonly<Record<string, string>> = {
  'machine.xdPU': '1.5–3.5',
  'machine.xdpPU': '0.15–0.35',
  'machine.xddpPU': '0.10–0.20',
  'machine.tdopS': '1–3 LV, 2–6 MV',
  'machine.inertiaS': '0.5–1.5',
  'governor.droopPct': '3–5 (4 common)',
  'regulator.droopPct': '3–5',
  reversePowerTripPct: '5–15 diesel',
};

/** A new constant-power load of 100 kW, 60 kVAR. */
export function newLoad(draft: PlantDraft): LoadDraft {
  const id = nextId(
    'L',
    draft.loads.map((l) => l.id),
  );
  return { id, name: `Load ${id}`, online: true, kW: 100, kVAR: 60, model: 'constant-power', frequencySensitivity: 0 };
}

type ListKey = 'sets' | 'loads';

/** Appends a new set or load. */
export function addItem(draft: PlantDraft, list: ListKey): PlantDraft {
  return list === 'sets' ? { ...draft, sets: [...draft.sets, newSet(draft)] } : { ...draft, loads: [...draft.loads, newLoad(draft)] };
}

/** Inserts a copy of item `index` right after it, with a fresh id and "(copy)" in its name. */
export function duplicateItem(draft: PlantDraft, list: ListKey, index: number): PlantDraft {
  const items = draft[list] as (SetDraft | LoadDraft)[];
  const item = items[index];
  if (!item) return draft;
  const prefix = list === 'sets' ? 'G' : 'L';
  const copy = {
    ...clonePlain(item),
    id: nextId(
      prefix,
      items.map((i) => i.id),
    ),
    name: `${item.name} (copy)`,
  };
  const next = [...items.slice(0, index + 1), copy, ...items.slice(index + 1)];
  return { ...draft, [list]: next };
}

/** Removes item `index`. */
export function removeItem(draft: PlantDraft, list: ListKey, index: number): PlantDraft {
  const items = draft[list] as unknown[];
  if (index < 0 || index >= items.length) return draft;
  return { ...draft, [list]: items.filter((_, i) => i !== index) };
}

/** Moves item `index` by `by` places (−1 earlier, +1 later), clamped to the list. */
export function moveItem(draft: PlantDraft, list: ListKey, index: number, by: number): PlantDraft {
  const items = (draft[list] as unknown[]).slice();
  const to = Math.min(items.length - 1, Math.max(0, index + by));
  if (to === index || index < 0 || index >= items.length) return draft;
  const [item] = items.splice(index, 1);
  items.splice(to, 0, item);
  return { ...draft, [list]: items };
}

/**
 * Changes the rated frequency and scales every set's frequency setpoints by the same
 * ratio, so a 50 Hz plant switched to 60 Hz keeps its droop settings in per unit
 * (51.2 Hz no-load at 50 Hz becomes 61.44 Hz at 60 Hz).
 */
export function changeRatedFrequency(draft: PlantDraft, hz: 50 | 60): PlantDraft {
  const old = draft.ratedFrequencyHz;
  if (old === hz) return draft;
  const k = old ? hz / old : 1;
  const scale = (v: number | null) => (v === null ? null : Math.round(v * k * 1e6) / 1e6);
  return {
    ...draft,
    ratedFrequencyHz: hz,
    sets: draft.sets.map((s) => ({
      ...s,
      governor: { ...s.governor, noLoadHz: scale(s.governor.noLoadHz), setpointHz: scale(s.governor.setpointHz) },
    })),
  };
}

/** Draft from a valid plant (a deep copy, so later edits never reach the plant). */
export function draftOf(plant: Plant): PlantDraft {
  return clonePlain(plant) as PlantDraft;
}
