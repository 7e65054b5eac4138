/** The report's tables as data: the HTML prints them, the app exports each as CSV. */
import { CLOSING_MAP_ANGLE_AXIS_LABEL, formatNumber, PLANT_DEFAULTS, SET_DEFAULTS, zipShares } from '../../shared-types';
import { flagWords, isoClassName } from '../../shared-types/presentation';
import type { ClassCheck, GenSet, PerformanceClass, ReportCell, ReportTable, SimulationMetrics } from '../../shared-types';
import { advanceAngleDeg, slipPeriodS, windowOpenS } from '../engine';
import type { ReportData, SyncPart } from '../engine/report';

/** True when the sync section was built (it may still carry a problem of its own). */
export function isSyncPart(s: ReportData['sync']): s is SyncPart {
  return 'settings' in s;
}

const CLASSES: readonly PerformanceClass[] = ['G1', 'G2', 'G3'];

/** A verdict in words (never colour alone): meets, fails, or not judged. */
export function verdictWord(pass: boolean | null): string {
  return pass === null ? 'not judged' : pass ? 'meets' : 'fails';
}

function setsTable(d: ReportData): ReportTable {
  return {
    id: 'sets',
    title: 'Generating sets',
    columns: [
      'Set',
      'Name',
      'Online',
      'Rated kW',
      'Rated kVA',
      'Rated PF',
      'Poles',
      'Speed (rpm)',
      'Rated current (A)',
      "X''d (pu)",
      "X'd (pu)",
      'Xd (pu)',
      'H (s)',
    ],
    decimals: [0, 0, 0, 0, 0, 2, 0, 0, 0, 3, 3, 2, 2],
    rows: d.plant.sets.map((s, i) => {
      const r = d.description.sets[i]!;
      return [
        s.id,
        s.name,
        s.online ? 'yes' : 'no',
        s.ratedKW,
        s.ratedKVA,
        s.ratedPF,
        s.poles,
        r.ratedSpeedRpm,
        r.ratedCurrentA,
        s.machine.xddpPU,
        s.machine.xdpPU,
        s.machine.xdPU,
        s.machine.inertiaS,
      ];
    }),
  };
}

/** Only the figures the mode uses; the others are blank so nobody reads a setting that does nothing. */
function settingsRow(s: GenSet): ReportCell[] {
  const g = s.governor;
  const r = s.regulator;
  return [
    s.id,
    g.mode,
    g.mode === 'droop' ? g.droopPct : null,
    g.mode === 'droop' ? g.noLoadHz : null,
    g.mode === 'isochronous' ? g.setpointHz : null,
    g.mode === 'baseload' ? g.baseKW : null,
    r.mode,
    r.mode === 'reactive-droop' ? r.droopPct : null,
    r.mode === 'reactive-droop' ? r.noLoadV : null,
    r.mode === 'voltage' || r.mode === 'cross-current' ? r.setpointV : null,
    r.mode === 'power-factor' ? r.pf : null,
    s.reversePowerTripPct,
  ];
}

function settingsTable(d: ReportData): ReportTable {
  return {
    id: 'settings',
    title: 'Governor and voltage regulator settings',
    columns: [
      'Set',
      'Governor mode',
      'Speed droop (%)',
      'No-load frequency (Hz)',
      'Setpoint (Hz)',
      'Base load (kW)',
      'Regulator mode',
      'Reactive droop (%)',
      'No-load voltage (V)',
      'Setpoint (V)',
      'Power factor',
      'Reverse-power trip (% rated kW)',
    ],
    decimals: [0, 0, 2, 2, 2, 0, 0, 2, 1, 1, 2, 1],
    rows: d.plant.sets.map(settingsRow),
  };
}

function loadsTable(d: ReportData): ReportTable {
  const fr = d.plant.ratedFrequencyHz;
  const pct = (x: number) => String(Number((x * 100).toFixed(1)));
  const breakPct = d.plant.powerLoadBreakPct ?? PLANT_DEFAULTS.powerLoadBreakPct;
  return {
    id: 'loads',
    title: `Connected loads (at rated voltage and frequency; in runs the constant-power and constant-current shares draw as impedance below ${breakPct} % voltage)`,
    columns: [
      'Load',
      'Name',
      'Online',
      'kW',
      'kVAR',
      'Model',
      'kW shares Z / I / P (%)',
      'kVAR shares Z / I / P (%)',
      'kW f-sensitivity (%/%)',
      'kVAR f-sensitivity (%/%)',
      'Shed below (Hz)',
      'Shed delay (s)',
    ],
    decimals: [0, 0, 0, 0, 0, 0, 0, 0, 1, 1, 2, 2],
    rows: d.plant.loads.map((l) => {
      const z = zipShares(l);
      const shed = l.shedFrequencyPct !== undefined && l.shedFrequencyPct > 0;
      return [
        l.id,
        l.name,
        l.online ? 'yes' : 'no',
        l.kW,
        l.kVAR,
        l.model,
        `${pct(z.pZ)} / ${pct(z.pI)} / ${pct(z.pP)}`,
        `${pct(z.qZ)} / ${pct(z.qI)} / ${pct(z.qP)}`,
        l.frequencySensitivity,
        l.kVARFrequencySensitivity ?? 0,
        shed ? (l.shedFrequencyPct! / 100) * fr : null,
        shed ? (l.shedDelayS ?? SET_DEFAULTS.shedDelayS) : null,
      ];
    }),
  };
}

function sharingBusTable(d: ReportData): ReportTable {
  return {
    id: 'sharing-bus',
    title: `Bus at each load (load power factor ${formatNumber(d.loadPF, 2)} lagging for the % points)`,
    columns: ['Load', 'Load kW', 'Load kVAR', 'Bus frequency (Hz)', 'Bus voltage (V)', 'Notes'],
    decimals: [0, 0, 0, 3, 1, 0],
    rows: d.sharing.map((p) => [
      p.label,
      p.loadKW,
      p.loadKVAR,
      p.result?.bus.frequencyHz ?? null,
      p.result?.bus.voltageV ?? null,
      p.problem ??
        ([p.note, ...(p.result?.warnings.filter((w) => !p.result?.capped || !w.startsWith('The load asked for')) ?? [])].filter(Boolean).join(' ') || ''),
    ]),
  };
}

function sharingSetsTable(d: ReportData): ReportTable {
  const rows: ReportCell[][] = [];
  for (const p of d.sharing) {
    for (const s of p.result?.sets ?? []) {
      rows.push([
        p.result?.capped ? `${p.label}, at most carried` : p.label,
        s.id,
        s.kW,
        s.kVAR,
        s.loadingPct,
        s.loadingKVAPct,
        s.pf,
        s.pfLagging ? 'lagging' : 'leading',
        s.currentA,
        s.circulatingA,
        s.sharingErrorKWPct,
        s.flags.map((f) => flagWords(f).words).join(', '),
      ]);
    }
  }
  return {
    id: 'sharing-sets',
    title: 'Sharing of kW and kVAR at each load',
    columns: [
      'Load',
      'Set',
      'kW',
      'kVAR',
      'kW (% rated)',
      'kVA (% rated)',
      'Power factor',
      'Sense',
      'Current (A)',
      'Circulating (A)',
      'kW sharing error (% rated)',
      'Conditions',
    ],
    decimals: [0, 0, 1, 1, 1, 1, 3, 0, 0, 0, 2, 0],
    rows,
  };
}

function syncSettingsTable(s: SyncPart): ReportTable {
  const l = s.settings.limits;
  const e = s.edge;
  const yesNo = (b: boolean | undefined) => (b ? 'yes' : 'no');
  const rows: ReportCell[][] = [
    [
      'Limits from',
      s.preset ? s.preset.label : s.defaulted ? 'Droopline default (typical between sets)' : 'custom',
      '',
      s.preset ? s.preset.source : 'common practice; set your own',
    ],
    ['Slip limit', l.slipHz, 'Hz', l.incomingFaster ? 'incoming must run faster than the bus' : ''],
    ['Phase angle limit', l.angleDeg, '°', ''],
    ['Voltage difference limit', l.voltagePct, '% of bus', l.incomingHigher ? 'incoming must be at or above the bus' : ''],
    ['Incoming faster required', yesNo(l.incomingFaster), '', ''],
    ['Incoming higher required', yesNo(l.incomingHigher), '', ''],
    ['Breaker closing time', s.settings.breakerClosingMs, 'ms', ''],
    ['Dead-bus close allowed', yesNo(s.settings.dead.deadBus), '', `live above ${s.settings.dead.livePct} %, dead below ${s.settings.dead.deadPct} % of rated`],
    ['Dead-line close allowed', yesNo(s.settings.dead.deadLine), '', ''],
    ['Incoming set', s.incomingSetId, '', ''],
    // At the slip limit itself (not the edge case's slip just inside it): 0.20 Hz and 100 ms read 5.00 s and 7.20°.
    ['Advance angle at the slip limit', advanceAngleDeg(l.slipHz, s.settings.breakerClosingMs), '°', '360 × slip × breaker time'],
    ['Slip period at the slip limit', slipPeriodS(l.slipHz), 's', '1 / |slip|'],
    ['Window open per slip cycle', windowOpenS(l.angleDeg, l.slipHz), 's', '2 × angle limit / (360 × |slip|)'],
    [
      'Surge closing at the window edge',
      e?.closeNow.surgeCurrentA ?? null,
      'A',
      e ? `${formatNumber(e.closeNow.surgeCurrentPU, 2)} pu; |ΔV| ${formatNumber(e.closeNow.deltaVPU, 3)} pu` : '',
    ],
    ['Peak with DC offset', e?.closeNow.peakCurrentA ?? null, 'A', e ? `IEC 60909 κ = ${formatNumber(e.closeNow.peakFactor, 2)}` : ''],
    [
      'Torque step at the window edge',
      e?.closeNow.torqueStepKNm ?? null,
      'kN·m',
      e ? `${formatNumber(e.closeNow.torqueStepPU, 2)} pu; steady synchronizing torque (E1 E2 / X) sin θ` : '',
    ],
    [
      'Peak air-gap torque at the window edge',
      e?.closeNow.peakTorqueKNm ?? null,
      'kN·m',
      e ? `${formatNumber(e.closeNow.peakTorquePU, 2)} pu; first cycle with the DC offset, (E1 E2 / X)(sin θ + 2 sin(θ/2))` : '',
    ],
    ['Sync-check verdict at the window edge', e ? (e.permissive ? 'permissive' : 'blocked') : null, '', e?.reasons.join('; ') ?? ''],
  ];
  return { id: 'sync-settings', title: 'Sync-check (device 25) settings', columns: ['Setting', 'Value', 'Unit', 'Note'], decimals: [0, 2, 0, 0], rows };
}

function closingMapTable(s: SyncPart): ReportTable | null {
  const m = s.map;
  if (!m) return null;
  const rows: ReportCell[][] = [];
  m.slipsHz.forEach((slip, r) => {
    m.anglesDeg.forEach((angle, c) => {
      const k = r * m.anglesDeg.length + c;
      rows.push([slip, angle, m.surgeCurrentPU[k] ?? null, m.torqueStepPU[k] ?? null, m.peakTorquePU[k] ?? null]);
    });
  });
  const axis = CLOSING_MAP_ANGLE_AXIS_LABEL[m.angleAxis];
  return {
    id: 'closing-map',
    title: `Closing map (${m.method}): surge, torque step and peak torque over slip × ${axis}`,
    columns: ['Slip (Hz)', `${axis[0]!.toUpperCase()}${axis.slice(1)} (°)`, 'Surge current (pu)', 'Torque step (pu)', 'Peak torque, first cycle (pu)'],
    decimals: [3, 1, 3, 3, 3],
    rows,
    printed: false,
  };
}

function metricsTable(d: ReportData): ReportTable {
  return {
    id: 'transient-metrics',
    title: 'Transient metrics of each scenario',
    columns: [
      'Scenario',
      'Frequency nadir (Hz)',
      'Frequency peak (Hz)',
      'Transient frequency deviation (%)',
      'Frequency recovery (s)',
      'Voltage dip (%)',
      'Voltage peak (%)',
      'Voltage recovery (s)',
      'Final frequency (Hz)',
      'Final voltage (V)',
      'Notes',
    ],
    decimals: [0, 3, 3, 2, 2, 2, 2, 2, 3, 1, 0],
    rows: d.transients.map((t) => {
      const m = t.result?.metrics;
      return [
        t.scenario.name,
        m?.frequencyNadirHz ?? null,
        m?.frequencyPeakHz ?? null,
        m?.frequencyDeviationPct ?? null,
        m?.frequencyRecoveryS ?? null,
        m?.voltageDipPct ?? null,
        m?.voltagePeakPct ?? null,
        m?.voltageRecoveryS ?? null,
        m?.final.frequencyHz ?? null,
        m?.final.voltageV ?? null,
        t.problem ?? (m ? transientNotes(m, d.plant.powerLoadBreakPct ?? PLANT_DEFAULTS.powerLoadBreakPct) : ''),
      ];
    }),
  };
}

function transientNotes(m: SimulationMetrics, breakPct: number): string {
  const notes: string[] = [];
  if (m.frequencyRecoveryS === null || m.voltageRecoveryS === null)
    notes.push('did not recover into the band around the steady state of the final load within the run');
  if (m.unservedKWh > 0)
    notes.push(
      `${formatNumber(m.unservedKWh, 2)} kWh of load not served (bus dead, or below ${formatNumber(breakPct, 0)} % voltage where constant-power and constant-current loads draw as impedance)`,
    );
  return notes.join('; ');
}

/** Rows of an ISO 8528-5 class table: limit and verdict word per class, and the limit's source. */
export function classRows(checks: readonly ClassCheck[]): ReportCell[][] {
  return checks.map((c) => [c.quantity, c.unit, c.measured, ...CLASSES.flatMap((k) => [c.limits[k], verdictWord(c.pass[k])]), c.source, c.note ?? '']);
}

function classTables(d: ReportData): ReportTable[] {
  return d.transients.flatMap((t, i) =>
    t.result
      ? [
          {
            id: `transient-classes-${i + 1}`,
            title: `ISO 8528-5 performance classes — ${t.scenario.name}`,
            columns: [
              'Quantity',
              'Unit',
              'Measured',
              ...CLASSES.flatMap((k) => [`${isoClassName(k)} limit`, `${isoClassName(k)} verdict`]),
              'Limit source',
              'Note',
            ],
            decimals: [0, 0, 2, 2, 0, 2, 0, 2, 0, 0, 0],
            rows: classRows(t.result.metrics.classes),
          },
        ]
      : [],
  );
}

/** Every table of the report, in the order printed. */
export function reportTables(d: ReportData): ReportTable[] {
  const tables = [setsTable(d), settingsTable(d), loadsTable(d), sharingBusTable(d), sharingSetsTable(d)];
  if (isSyncPart(d.sync)) {
    const s = d.sync;
    tables.push(syncSettingsTable(s));
    const map = closingMapTable(s);
    if (map) tables.push(map);
  }
  tables.push(metricsTable(d), ...classTables(d));
  return tables;
}
