/**
 * The commissioning record of one set: the settings to dial in (governor, regulator, sync-check,
 * reverse power, protection), the figures measured in the load-bank test beside the model's,
 * the fitted parameters. A plain engineering record of our own layout, as rows (for the screen);
 * its CSV and HTML (with the sign-off and the caution) are written by `electron/report/commissioning-record.ts`.
 */
import type { ClassCheck, CommissioningRecordRequest, CommissioningRow, PerformanceClass, RecordVerdict } from '../../../shared-types';
import { SET_DEFAULTS, advanceAngleDeg, fitParameterLabel, formatNumber, isoClassName } from '../../../shared-types';
import { InvalidInput } from '../errors';
import { fieldCeiling } from '../simulation/excitation';

const f = formatNumber;

/** The best class whose every judged row passes, or "none". */
function classMet(classes: ClassCheck[]): string {
  const order: PerformanceClass[] = ['G3', 'G2', 'G1'];
  for (const c of order) if (classes.every((r) => r.pass[c] !== false)) return isoClassName(c);
  return 'none';
}

function verdictRows(m: RecordVerdict | undefined, model: RecordVerdict | undefined, fr: number, vr: number): CommissioningRow[] {
  if (!m || !model) return [];
  const s = 'Load-bank test';
  const row = (item: string, unit: string, mod: string, meas: string): CommissioningRow => ({ section: s, item, unit, model: mod, measured: meas });
  const dipPct = (x: number, x0: number, r: number) => f(((x - x0) / r) * 100, 2);
  const rec = (x: number | null) => (x === null ? 'not settled' : f(x, 2));
  return [
    row('frequency before the step', 'Hz', f(model.initialFrequencyHz, 3), f(m.initialFrequencyHz, 3)),
    row('frequency nadir', 'Hz', f(model.frequencyNadirHz, 3), f(m.frequencyNadirHz, 3)),
    row('frequency peak', 'Hz', f(model.frequencyPeakHz, 3), f(m.frequencyPeakHz, 3)),
    row(
      'transient frequency deviation',
      '% of rated',
      dipPct(model.frequencyNadirHz, model.initialFrequencyHz, fr),
      dipPct(m.frequencyNadirHz, m.initialFrequencyHz, fr),
    ),
    row('frequency settled after the step', 'Hz', f(model.settledFrequencyHz, 3), f(m.settledFrequencyHz, 3)),
    row(`frequency recovery (${isoClassName('G2')} band)`, 's', rec(model.frequencyRecoveryS), rec(m.frequencyRecoveryS)),
    row('voltage before the step', 'V', f(model.initialVoltageV, 1), f(m.initialVoltageV, 1)),
    row('voltage lowest', 'V', f(model.voltageMinV, 1), f(m.voltageMinV, 1)),
    row('transient voltage deviation', '% of rated', dipPct(model.voltageMinV, model.initialVoltageV, vr), dipPct(m.voltageMinV, m.initialVoltageV, vr)),
    row('voltage settled after the step', 'V', f(model.settledVoltageV, 1), f(m.settledVoltageV, 1)),
    row(`voltage recovery (${isoClassName('G2')} band)`, 's', rec(model.voltageRecoveryS), rec(m.voltageRecoveryS)),
    row('ISO 8528-5 class met (every judged row)', '', classMet(model.classes), classMet(m.classes)),
  ];
}

/** The record's data: its rows and the set it is of (the CSV and HTML are the report renderer's). */
export interface CommissioningRecordData {
  rows: CommissioningRow[];
  setId: string;
  /** The set's name, or its id when it has none. */
  setName: string;
  ratedKVA: number;
  ratedKW: number;
}

/** The record's rows, from the plant, the fit and the test. */
export function commissioningRecordData(req: CommissioningRecordRequest): CommissioningRecordData {
  const plant = req.plant;
  const set = plant.sets.find((s) => s.id === req.setId);
  if (!set) throw new InvalidInput(`setId: there is no set "${req.setId}" in the plant`);
  if (req.fit && req.fit.setId !== set.id) throw new InvalidInput(`fit.setId: the fit is of set "${req.fit.setId}", not "${set.id}"`);
  const fr = plant.ratedFrequencyHz;
  const vr = plant.ratedVoltageV;
  const g = set.governor;
  const r = set.regulator;
  const m = set.machine;
  const p = set.protection ?? SET_DEFAULTS.protection;
  const rows: CommissioningRow[] = [];
  const add = (section: string, item: string, unit: string, model: string, measured = '') => rows.push({ section, item, unit, model, measured });

  let sec = 'Speed governor';
  add(sec, 'mode', '', g.mode);
  if (g.mode === 'droop') {
    add(sec, 'speed droop', '%', f(g.droopPct, 2));
    add(sec, 'no-load frequency', 'Hz', f(g.noLoadHz, 2));
  } else if (g.mode === 'isochronous') add(sec, 'setpoint frequency', 'Hz', f(g.setpointHz, 2));
  else add(sec, 'base load', 'kW', f(g.baseKW, 0));
  add(sec, 'actuator lag', 's', f(g.actuatorLagS, 3));
  add(sec, 'engine lag', 's', f(g.engineLagS, 3));
  add(sec, 'isochronous reset time', 's', f(g.isoResetS, 2));
  add(sec, 'inertia constant H', 's', f(m.inertiaS, 2));

  sec = 'Voltage regulator';
  add(sec, 'mode', '', r.mode);
  if (r.mode === 'reactive-droop') {
    add(sec, 'reactive droop', '%', f(r.droopPct, 2));
    add(sec, 'no-load voltage', 'V', f(r.noLoadV, 1));
  } else if (r.mode === 'power-factor') add(sec, 'power factor', '', f(r.pf, 2));
  else add(sec, 'setpoint voltage', 'V', f(r.setpointV, 1));
  add(sec, 'regulator gain', 'pu', f(r.gainPU, 1));
  add(sec, 'exciter lag', 's', f(r.exciterLagS, 3));
  add(sec, "open-circuit time constant T'd0", 's', f(m.tdopS, 2));
  add(sec, 'exciter ceiling', 'pu', f(r.ceilingPU ?? fieldCeiling(set).ceilingPU, 2), r.ceilingPU === undefined ? 'derived from the machine data' : '');
  add(sec, 'V/Hz knee below rated', 'Hz', f(r.vhzKneeBelowHz ?? SET_DEFAULTS.vhzKneeBelowHz, 2));

  sec = 'Sync-check (device 25)';
  if (req.syncCheck) {
    const l = req.syncCheck.limits;
    add(sec, 'slip window', '± Hz', f(l.slipHz, 3));
    add(sec, 'phase-angle window', '± °', f(l.angleDeg, 1));
    add(sec, 'voltage-difference window', '± %', f(l.voltagePct, 1));
    add(sec, 'breaker closing time', 'ms', f(req.syncCheck.breakerClosingMs, 0));
    // Advance angle = 360° × slip × closing time (closed form: the phase the incoming set gains while the breaker travels).
    add(sec, 'close-command advance at the slip limit', '°', f(advanceAngleDeg(l.slipHz, req.syncCheck.breakerClosingMs), 1));
  } else add(sec, 'sync-check window', '', 'not given');

  sec = 'Reverse power (device 32)';
  add(sec, 'pickup', '% of rated kW', f(set.reversePowerTripPct, 1));
  add(sec, 'pickup', 'kW', f((set.reversePowerTripPct / 100) * set.ratedKW, 0));
  add(sec, 'delay', 's', f(set.reversePowerDelayS, 1));

  sec = 'Protection';
  const prot = (item: string, pct: number, delay: number, base: number, unit: string, digits: number) => {
    if (pct === 0) add(sec, item, '', 'off');
    else {
      add(sec, `${item} pickup`, `% (${unit})`, `${f(pct, 1)} (${f((pct / 100) * base, digits)})`);
      add(sec, `${item} delay`, 's', f(delay, 1));
    }
  };
  prot('81U under-frequency', p.underFrequencyPct, p.underFrequencyDelayS, fr, 'Hz', 2);
  prot('81O over-frequency', p.overFrequencyPct, p.overFrequencyDelayS, fr, 'Hz', 2);
  prot('27 undervoltage', p.underVoltagePct, p.underVoltageDelayS, vr, 'V', 0);
  prot('59 overvoltage', p.overVoltagePct, p.overVoltageDelayS, vr, 'V', 0);

  if (req.fit && req.test) {
    const t = req.test;
    sec = 'Load-bank test';
    add(sec, 'sets on line', '', t.onlineSetIds.join(' + '));
    add(sec, 'load before the step', 'kW / kVAR', `${f(t.startKW, 0)} / ${f(t.startKVAR, 0)}`);
    add(sec, 'step', 'kW / kVAR', `${f(t.stepKW, 0)} / ${f(t.stepKVAR, 0)}`);
    add(sec, 'step at', 's', f(t.stepAtS, 2));
    rows.push(...verdictRows(req.fit.measuredVerdict, req.fit.modelVerdict, fr, vr));
    sec = 'Fitted parameters';
    for (const q of req.fit.parameters) add(sec, fitParameterLabel(q.key), q.unit, `${formatSig(q.value)} (was ${formatSig(q.start)})`, `fit: ${q.confidence}`);
    add(sec, 'RMS error frequency / voltage', '% of rated', `${f(req.fit.residual.frequencyPct, 3)} / ${f(req.fit.residual.voltagePct, 3)}`);
  }

  return { rows, setId: set.id, setName: set.name || set.id, ratedKVA: set.ratedKVA, ratedKW: set.ratedKW };
}

/** Four significant figures, never NaN. */
function formatSig(x: number): string {
  return Number.isFinite(x) ? String(Number(x.toPrecision(4))) : '—';
}
