/** `droopline sync case.json`: the sync-check verdict, window timing and closing surge of a case. */
import { CAUTION } from '../../../shared-types';
import type { SyncResult } from '../../../shared-types';
import type { CliCommand, CliIO } from '../io';
import { CliInputError } from '../io';
import { readJson } from '../read-json';
import { callEngine } from '../call';
import { fmt, formatTable } from '../table';

function signed(v: number | null, decimals: number): string {
  if (v === null || !Number.isFinite(v)) return '—';
  const s = fmt(Math.abs(v), decimals);
  return Number(s) === 0 ? s : v > 0 ? `+${s}` : `−${s}`;
}

function seconds(v: number | null): string {
  return v === null ? 'never' : `${fmt(v, 3)} s`;
}

function printPresets(
  io: CliIO,
  presets: {
    id: string;
    label: string;
    source: string;
    note: string;
    limits: { slipHz: number; angleDeg: number; voltagePct: number; incomingFaster?: boolean; incomingHigher?: boolean };
  }[],
): void {
  io.out(
    formatTable(
      ['preset', 'slip Hz', 'angle °', 'ΔV %', 'options'],
      presets.map((p) => [
        p.id,
        `±${p.limits.slipHz}`,
        `±${p.limits.angleDeg}`,
        `±${p.limits.voltagePct}`,
        [p.limits.incomingFaster ? 'incoming faster' : '', p.limits.incomingHigher ? 'incoming higher' : ''].filter(Boolean).join(', ') || '—',
      ]),
    ),
  );
  for (const p of presets) io.out(`\n${p.id}: ${p.source}.\n  ${p.note}\n`);
  io.out(`\n${CAUTION}\n`);
}

function printResult(io: CliIO, r: SyncResult, name: string | undefined): void {
  const L = r.limits;
  io.out(
    `${name ? `${name}\n` : ''}Sync-check: ${r.permissive ? 'CLOSE PERMITTED' : 'CLOSE NOT PERMITTED'}${r.deadBusClose ? ' (dead-bus close)' : r.deadLineClose ? ' (dead-line close)' : ''}\n`,
  );
  io.out(`Bus used: ${fmt(r.bus.frequencyHz, 3)} Hz, ${fmt(r.bus.voltageV, 1)} V — ${r.bus.from}.\n`);
  io.out(
    `Limits: slip ±${L.slipHz} Hz, angle ±${L.angleDeg}°, voltage ±${L.voltagePct} %${L.incomingFaster ? ', incoming faster' : ''}${L.incomingHigher ? ', incoming higher' : ''} — ${r.limitsSource}\n\n`,
  );
  io.out(
    formatTable(
      ['check', 'value', 'limit', 'result'],
      r.checks.map((c) => [
        c.id,
        c.value === null ? '—' : `${signed(c.value, c.unit === 'Hz' ? 3 : 2)} ${c.unit}`,
        c.limit === null ? '—' : `${c.id === 'incoming-faster' || c.id === 'incoming-higher' ? '> ' : '±'}${c.limit} ${c.unit}`,
        c.ok === null ? 'n/a' : c.ok ? 'pass' : 'FAIL',
      ]),
    ),
  );
  if (r.reasons.length) io.out(`\nWhy not:\n${r.reasons.map((x) => `  - ${x}`).join('\n')}\n`);
  io.out(
    `\nSlip ${signed(r.slipHz, 3)} Hz, slip period ${seconds(r.slipPeriodS)}; phase angle now ${signed(r.angleNowDeg, 1)}°.\n` +
      `Advance angle ${fmt(r.advanceAngleDeg, 2)}° — issue the close command at ${signed(r.closeCommandAngleDeg, 2)}°, in ${seconds(r.closeCommandInS)}, so the contacts touch at 0°.\n` +
      `Window ±${L.angleDeg}°: open ${seconds(r.windowOpenS)} per slip cycle; ${r.windowOpenNow ? 'open now' : `opens in ${seconds(r.windowOpensInS)}`}, closes in ${seconds(r.windowClosesInS)}.\n` +
      `Voltage difference ${signed(r.voltageDifferencePct, 2)} % (${signed(r.voltageDifferenceV, 1)} V); phasor |ΔV| ${fmt(r.deltaVPU, 4)} pu at ${signed(r.deltaVAngleDeg, 1)}°.\n`,
  );
  const s = r.closeNow;
  io.out(
    `\nIf closed now (contacts touch at ${signed(s.angleAtContactDeg, 2)}°):\n` +
      formatTable(
        ['quantity', 'pu', 'SI'],
        [
          ["surge current I'' (symmetrical)", fmt(s.surgeCurrentPU, 3), `${fmt(s.surgeCurrentA, 0)} A`],
          [`peak current (κ ${fmt(s.peakFactor, 3)}, R/X ${fmt(s.rOverX, 3)})`, fmt(s.peakCurrentPU, 3), `${fmt(s.peakCurrentA, 0)} A`],
          ['synchronizing power step', signed(s.powerStepPU, 3), `${signed(s.powerStepKW, 0)} kW`],
          ['torque step on the incoming shaft (E1 E2 / X) sin θ', signed(s.torqueStepPU, 3), `${signed(s.torqueStepKNm, 2)} kN·m`],
          ['peak air-gap torque, first cycle, with DC offset', signed(s.peakTorquePU, 3), `${signed(s.peakTorqueKNm, 2)} kN·m`],
        ],
      ),
  );
  const b = r.busEquivalent;
  io.out(
    `Bus equivalent (${b.from}${b.setIds.length ? `: ${b.setIds.join(', ')}` : ''}): R ${fmt(b.rPU, 4)} pu, X ${fmt(b.xPU, 4)} pu on the incoming set's ${fmt(r.base.currentA, 1)} A base at ${fmt(r.base.voltageV, 0)} V; torque base ${fmt(r.base.torqueKNm, 3)} kN·m at ${fmt(r.base.ratedSpeedRpm, 0)} rpm.\n`,
  );
  if (r.warnings.length) io.out(`\nNote:\n${r.warnings.map((w) => `  - ${w}`).join('\n')}\n`);
  io.out(`\n${CAUTION}\n`);
}

export const syncCommand: CliCommand = {
  name: 'sync',
  summary: 'sync-check verdict, advance angle and closing surge of a case',
  usage: 'droopline sync case.json [--json] [--preset id] | sync --presets [--json]',
  example: 'renderer/demo/example.sync.json (a sync-check case)',
  valueFlags: ['preset'],
  async run(args, io) {
    if (args.flags.has('presets')) {
      const r = await callEngine(io, 'listSyncPresets', {});
      if (!r.ok) return r.exitCode;
      if (args.flags.has('json')) io.out(JSON.stringify({ presets: r.value, caution: CAUTION }, null, 2) + '\n');
      else printPresets(io, r.value);
      return 0;
    }
    const raw = await readJson(io, args.positional[0], 'sync case');
    let request = raw;
    const preset = args.flags.get('preset');
    if (preset !== undefined) {
      if (raw === null || typeof raw !== 'object' || Array.isArray(raw)) throw new CliInputError('--preset: the case file must hold a JSON object');
      // The preset replaces the file's limits (the schema checks the id).
      const { limits: _limits, ...rest } = raw as Record<string, unknown>;
      request = { ...rest, presetId: preset };
    }
    const r = await callEngine(io, 'evaluateSync', request);
    if (!r.ok) return r.exitCode;
    if (args.flags.has('json')) {
      io.out(JSON.stringify({ ...r.value, caution: CAUTION }, null, 2) + '\n');
      return 0;
    }
    const name = (raw as { name?: unknown }).name;
    printResult(io, r.value, typeof name === 'string' ? name : undefined);
    return 0;
  },
};
