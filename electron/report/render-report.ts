/**
 * The printable report page: one self-contained HTML document (inline CSS and SVG, no
 * scripts, no external resources) with print rules so the browser's print and Electron's
 * printToPDF give clean A4 pages.
 */
import { CAUTION_AFTER_LABEL } from '../../shared-types/presentation';
import type { ReportChart, ReportSection, ReportTable } from '../../shared-types';
import { escapeHtml, formatNumber } from './format';
import type { ReportData } from '../engine/report';
import { isSyncPart } from './report-tables';
import { CAUTIONS, DEFINITIONS } from './report-text';

const STYLE = `
:root { color-scheme: light; }
* { box-sizing: border-box; }
body { font-family: system-ui, 'Segoe UI', Roboto, Arial, sans-serif; font-size: 10.5pt; color: #1d2329; background: #fff; margin: 0; }
main { max-width: 1000px; margin: 0 auto; padding: 18px 24px; }
header h1 { font-size: 18pt; margin: 0 0 2px; }
header p { margin: 2px 0; color: #5b6670; }
h2 { font-size: 13pt; border-bottom: 1px solid #d4d9de; padding-bottom: 3px; margin: 22px 0 8px; }
h3 { font-size: 11pt; margin: 14px 0 6px; }
.caution { border: 1px solid #e5cf8a; background: #fff6dd; color: #4d3a00; padding: 8px 12px; margin: 10px 0; }
.caution ul { margin: 4px 0 0 18px; padding: 0; }
table { border-collapse: collapse; margin: 6px 0 10px; font-size: 9pt; }
caption { text-align: left; color: #5b6670; padding: 2px 0 4px; }
th, td { border: 1px solid #d4d9de; padding: 2px 6px; vertical-align: top; }
thead th { background: #eef1f3; text-align: left; }
td.num { text-align: right; font-variant-numeric: tabular-nums; white-space: nowrap; }
.verdict { white-space: nowrap; }
.verdict-fails { font-weight: 700; }
.problem { border-left: 3px solid #b02a2a; padding: 4px 10px; background: #fbeeee; }
.note { color: #5b6670; }
figure { margin: 8px 0 14px; }
figcaption { color: #5b6670; font-size: 9pt; }
svg { max-width: 100%; height: auto; }
dl { margin: 0; }
dt { font-weight: 600; margin-top: 6px; }
dd { margin: 0 0 0 14px; }
nav ol { columns: 2; margin: 4px 0; }
footer { margin-top: 24px; border-top: 1px solid #d4d9de; padding-top: 6px; color: #5b6670; font-size: 9pt; }
@page { size: A4; margin: 14mm 12mm; }
@media print {
  main { max-width: none; padding: 0; }
  nav { display: none; }
  h2 { break-after: avoid; }
  table, figure, .caution, dl > div { break-inside: avoid; }
  .wide { font-size: 8pt; }
}
`;

function cell(v: string | number | null, decimals: number, column: string): string {
  if (typeof v === 'number' || v === null) return `<td class="num">${formatNumber(v, decimals)}</td>`;
  const bad = v === 'fails' || v === 'blocked';
  const good = v === 'meets' || v === 'permissive';
  const cls = bad ? ' class="verdict verdict-fails"' : good || v === 'not judged' ? ' class="verdict"' : '';
  const mark = bad ? '✗ ' : good ? '✓ ' : v === 'not judged' ? '– ' : '';
  return `<td${cls} data-column="${escapeHtml(column)}">${mark}${escapeHtml(v)}</td>`;
}

/** One table as HTML (numbers with the column's decimals, blanks as an em dash). */
export function tableHtml(t: ReportTable): string {
  const head = t.columns.map((c) => `<th scope="col">${escapeHtml(c)}</th>`).join('');
  const body = t.rows.map((r) => `<tr>${r.map((v, i) => cell(v, t.decimals[i] ?? 2, t.columns[i] ?? '')).join('')}</tr>`).join('');
  const wide = t.columns.length > 9 ? ' class="wide"' : '';
  return `<table id="table-${escapeHtml(t.id)}"${wide}><caption>${escapeHtml(t.title)}</caption><thead><tr>${head}</tr></thead><tbody>${body}</tbody></table>`;
}

function figureHtml(c: ReportChart, caption: string): string {
  return `<figure id="chart-${escapeHtml(c.id)}">${c.svg}<figcaption>${escapeHtml(caption)}</figcaption></figure>`;
}

const problemHtml = (text: string) => `<p class="problem"><strong>Not computed:</strong> ${escapeHtml(text)}</p>`;

/** The sections of a report and whether each was built. */
export function reportSections(d: ReportData): ReportSection[] {
  // Any load point without an answer makes the section incomplete (so `report --strict` fails).
  const failedPoints = d.sharing.filter((p) => p.problem);
  const sharingProblem = d.sharing.length === 0 ? 'no load points' : failedPoints.length ? failedPoints.map((p) => `${p.label}: ${p.problem}`).join(' ') : null;
  const syncProblem = isSyncPart(d.sync) ? d.sync.problem : d.sync.problem;
  const failed = d.transients.filter((t) => t.problem);
  const transientProblem =
    d.transients.length === 0 ? 'The project has no transient scenarios.' : failed.length === d.transients.length ? failed[0]!.problem : null;
  return [
    { id: 'plant', title: 'Plant and generating sets', problem: null },
    { id: 'settings', title: 'Governor and regulator settings', problem: null },
    { id: 'sharing', title: 'Load sharing at chosen loads', problem: sharingProblem },
    { id: 'droop-lines', title: 'Droop lines', problem: null },
    { id: 'sync', title: 'Sync-check settings and closing map', problem: syncProblem },
    { id: 'transients', title: 'Transient metrics and ISO 8528-5 classes', problem: transientProblem },
    { id: 'definitions', title: 'Definitions used', problem: null },
    { id: 'cautions', title: 'Cautions', problem: null },
  ];
}

/** Builds the whole page from the data, its tables and its charts. */
export function renderReportHtml(d: ReportData, tables: readonly ReportTable[], charts: readonly ReportChart[]): string {
  const t = (id: string) => tables.find((x) => x.id === id);
  const c = (id: string) => charts.find((x) => x.id === id);
  const sections = reportSections(d);
  const title = sections.find((s) => s.id === 'plant')!;
  const out: string[] = [];
  const tableOut = (id: string) => {
    const tab = t(id);
    if (tab && tab.printed !== false) out.push(tableHtml(tab));
  };
  const p = d.plant;
  out.push(
    `<!doctype html><html lang="en"><head><meta charset="utf-8"><meta name="viewport" content="width=device-width, initial-scale=1">`,
    `<title>${escapeHtml(d.title)} — plant report</title><style>${STYLE}</style></head><body><main>`,
    `<header><h1>${escapeHtml(d.title)}</h1><p>Plant report · ${escapeHtml(p.name)} · ${p.ratedFrequencyHz} Hz, ${p.ratedVoltageV} V line-to-line</p>`,
    `<p>Date: <time datetime="${escapeHtml(d.date)}" data-report-date>${escapeHtml(d.date)}</time> · made with Droopline</p></header>`,
    `<div class="caution" role="note"><strong>Caution:</strong> ${CAUTION_AFTER_LABEL}</div>`,
    `<nav><strong>Contents</strong><ol>${sections.map((s) => `<li><a href="#${s.id}">${escapeHtml(s.title)}</a>${s.problem ? ' (not computed)' : ''}</li>`).join('')}</ol></nav>`,
  );
  out.push(`<section id="plant"><h2>1. ${escapeHtml(title.title)}</h2>`);
  out.push(
    `<p>Online: ${formatNumber(d.description.onlineKW, 0)} kW / ${formatNumber(d.description.onlineKVA, 0)} kVA; installed ${formatNumber(d.description.installedKW, 0)} kW / ${formatNumber(d.description.installedKVA, 0)} kVA; connected load ${formatNumber(d.description.loadKW, 0)} kW, ${formatNumber(d.description.loadKVAR, 0)} kVAR.</p>`,
  );
  tableOut('sets');
  tableOut('loads');
  out.push('</section>');
  out.push('<section id="settings"><h2>2. Governor and regulator settings</h2>');
  tableOut('settings');
  out.push('<p class="note">Blank (—) figures are not used in the set\'s mode.</p></section>');
  out.push('<section id="sharing"><h2>3. Load sharing at chosen loads</h2>');
  for (const pt of d.sharing) if (pt.problem) out.push(problemHtml(`${pt.label}: ${pt.problem}`));
  tableOut('sharing-bus');
  tableOut('sharing-sets');
  out.push('</section>');
  out.push('<section id="droop-lines"><h2>4. Droop lines</h2>');
  for (const id of ['droop-speed', 'droop-reactive']) {
    const ch = c(id);
    if (ch) out.push(figureHtml(ch, `${ch.title}. Lines: each set's setting; markers: where the set runs at each load of the sharing table.`));
  }
  out.push('</section>');
  out.push('<section id="sync"><h2>5. Sync-check settings and closing map</h2>');
  if (isSyncPart(d.sync)) {
    if (d.sync.defaulted)
      out.push(
        '<p class="note">The project has no sync-check settings: the report uses the common-practice limit preset for generating sets, a 60 ms breaker and the first offline set (or the last set) as incoming.</p>',
      );
    if (d.sync.preset?.note) out.push(`<p class="note">Preset note: ${escapeHtml(d.sync.preset.note)}</p>`);
    tableOut('sync-settings');
    if (d.sync.problem) out.push(problemHtml(d.sync.problem));
    const ch = c('closing-map');
    if (ch) out.push(figureHtml(ch, `${ch.title}. Darker is a larger surge; the dashed box is the sync-check window. The full grid is in the CSV export.`));
  } else out.push(problemHtml(d.sync.problem));
  out.push('</section>');
  out.push('<section id="transients"><h2>6. Transient metrics and ISO 8528-5 classes</h2>');
  if (d.transients.some((x) => x.defaulted))
    out.push('<p class="note">The project has no scenarios: the report runs its own block-load step of 25 % of the online rated kW.</p>');
  if (d.transients.length === 0) out.push('<p class="note">The project has no transient scenarios.</p>');
  else tableOut('transient-metrics');
  d.transients.forEach((tr, i) => {
    const n = i + 1;
    out.push(`<h3>6.${n} ${escapeHtml(tr.scenario.name)}</h3>`);
    out.push(
      `<p class="note">${tr.scenario.durationS} s at ${tr.scenario.stepMs} ms steps; events: ${tr.scenario.events.map((e) => `${escapeHtml(e.type)} at ${e.atS} s`).join(', ') || 'none'}.</p>`,
    );
    if (tr.problem) out.push(problemHtml(tr.problem));
    for (const w of tr.result?.warnings ?? []) out.push(`<p class="note">Note: ${escapeHtml(w)}</p>`);
    tableOut(`transient-classes-${n}`);
    for (const id of [`transient-${n}-frequency`, `transient-${n}-voltage`]) {
      const ch = c(id);
      if (ch) out.push(figureHtml(ch, ch.title));
    }
  });
  out.push('</section>');
  out.push(
    `<section id="definitions"><h2>7. Definitions used</h2><dl>${DEFINITIONS.map((x) => `<div><dt>${escapeHtml(x.term)}</dt><dd>${escapeHtml(x.text)}</dd></div>`).join('')}</dl></section>`,
  );
  out.push(
    `<section id="cautions"><h2>8. Cautions</h2><div class="caution"><ul>${CAUTIONS.map((x) => `<li>${escapeHtml(x)}</li>`).join('')}</ul></div></section>`,
  );
  out.push(`<footer>${escapeHtml(d.title)} · ${escapeHtml(d.date)} · Planning and training only.</footer>`);
  out.push('</main></body></html>');
  return out.join('\n');
}
