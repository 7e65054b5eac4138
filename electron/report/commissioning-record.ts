/**
 * The commissioning record's rendering: CSV (caution line first, `#`) and self-contained HTML (no scripts), with the
 * sign-off, from the rows the engine gives (`electron/engine/commissioning/commissioning-record.ts`). Pure string
 * building; no engine calls.
 */
import type { CommissioningRecord, CommissioningRecordRequest } from '../../shared-types';
import { CAUTION, CSV_CAUTION_LINE, csvField } from '../../shared-types/presentation';
import type { CommissioningRecordData } from '../engine/commissioning';
import { escapeHtml, formatNumber } from './format';

const f = formatNumber;

/** The record as rows (for the screen), CSV and HTML. */
export function renderCommissioningRecord(req: CommissioningRecordRequest, data: CommissioningRecordData): CommissioningRecord {
  const plant = req.plant;
  const fr = plant.ratedFrequencyHz;
  const vr = plant.ratedVoltageV;
  const so = req.signOff;
  const title = `Commissioning record — ${data.setName} (${data.setId})`;
  const csvLines = [CSV_CAUTION_LINE, `# ${title}; plant ${plant.name}; ${req.date}`, 'section,item,unit,setting or model,measured'];
  for (const row of data.rows) csvLines.push([row.section, row.item, row.unit, row.model, row.measured].map(csvField).join(','));
  csvLines.push(['Sign-off', 'commissioned by', '', so.by, ''].map(csvField).join(','));
  csvLines.push(['Sign-off', 'date', '', so.date, ''].map(csvField).join(','));
  csvLines.push(['Sign-off', 'remarks', '', so.remarks, ''].map(csvField).join(','));

  const e = escapeHtml;
  let body = '';
  let current = '';
  for (const row of data.rows) {
    if (row.section !== current) {
      if (current) body += '</tbody></table>';
      current = row.section;
      body += `<h2>${e(current)}</h2><table><thead><tr><th>item</th><th>unit</th><th>setting or model</th><th>measured</th></tr></thead><tbody>`;
    }
    body += `<tr><td>${e(row.item)}</td><td>${e(row.unit)}</td><td>${e(row.model)}</td><td>${e(row.measured)}</td></tr>`;
  }
  if (current) body += '</tbody></table>';
  const html = `<!doctype html>
<html lang="en"><head><meta charset="utf-8"><title>${e(title)}</title>
<style>
body{font:13px/1.4 system-ui,sans-serif;color:#111;margin:24px;max-width:900px}
h1{font-size:18px;margin:0 0 4px}h2{font-size:14px;margin:18px 0 4px;border-bottom:1px solid #888}
table{border-collapse:collapse;width:100%}td,th{border:1px solid #bbb;padding:3px 6px;text-align:left;vertical-align:top}
th{background:#eee}.caution{border:2px solid #111;padding:6px 8px;margin:10px 0;font-weight:600}
.sign td{height:28px}@media print{body{margin:10mm}}
</style></head><body>
<h1>${e(title)}</h1>
<p>Plant: ${e(plant.name)} · rated ${f(fr, 0)} Hz, ${f(vr, 0)} V · set ${f(data.ratedKVA, 0)} kVA / ${f(data.ratedKW, 0)} kW · printed ${e(req.date)}</p>
<p class="caution">Caution: ${e(CAUTION)}</p>
${body}
<h2>Sign-off</h2>
<table class="sign"><tbody><tr><th>commissioned by</th><td>${e(so.by)}</td></tr><tr><th>date</th><td>${e(so.date)}</td></tr><tr><th>remarks</th><td>${e(so.remarks).replace(/\n/g, '<br>')}</td></tr><tr><th>signature</th><td></td></tr></tbody></table>
<p class="caution">Caution: ${e(CAUTION)}</p>
</body></html>
`;
  return { rows: data.rows, csv: csvLines.join('\n') + '\n', html };
}
