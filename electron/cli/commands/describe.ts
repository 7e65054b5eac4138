import { CAUTION } from '../../../shared-types';
import type { CliCommand } from '../io';
import { readJson } from '../read-json';
import { callEngine } from '../call';
import { fmt, formatTable } from '../table';

export const describeCommand: CliCommand = {
  name: 'describe',
  summary: 'rated speed and current of each set, plant totals',
  usage: 'droopline describe plant.json [--json]',
  example: 'renderer/demo/water-works.plant.json (a plant file)',
  async run(args, io) {
    const plant = await readJson(io, args.positional[0], 'plant');
    const r = await callEngine(io, 'describePlant', { plant });
    if (!r.ok) return r.exitCode;
    const d = r.value;
    if (args.flags.has('json')) {
      io.out(JSON.stringify({ ...d, caution: CAUTION }, null, 2) + '\n');
      return 0;
    }
    io.out(`${d.name} — ${d.ratedFrequencyHz} Hz, ${d.ratedVoltageV} V\n\n`);
    io.out(
      formatTable(
        ['set', 'online', 'kW', 'kVA', 'rpm', 'rated A'],
        d.sets.map((s) => [s.id, s.online ? 'yes' : 'no', fmt(s.ratedKW, 0), fmt(s.ratedKVA, 0), fmt(s.ratedSpeedRpm, 0), fmt(s.ratedCurrentA, 0)]),
      ),
    );
    io.out(
      `\nonline ${fmt(d.onlineKW, 0)} kW / ${fmt(d.onlineKVA, 0)} kVA; installed ${fmt(d.installedKW, 0)} kW / ${fmt(d.installedKVA, 0)} kVA; load ${fmt(d.loadKW, 0)} kW, ${fmt(d.loadKVAR, 0)} kVAR\n\n${CAUTION}\n`,
    );
    return 0;
  },
};
