/**
 * Exports from the app: CSV text of a table and file downloads (a link with `download`,
 * which both Electron and the browser preview honour). Pure except `saveFile`.
 */
import { csvField } from '../../../shared-types';

/** A CSV document (CRLF line ends, RFC 4180) from a header and rows. */
export function toCsv(columns: readonly string[], rows: readonly (readonly (string | number | null | undefined)[])[]): string {
  return [columns, ...rows].map((r) => r.map(csvField).join(',')).join('\r\n') + '\r\n';
}

/** A file-name-safe stem (letters, digits, dashes). */
export function fileStem(text: string): string {
  return (
    text
      .normalize('NFKD')
      .replace(/[^\x20-\x7e]/g, '')
      .toLowerCase()
      .replace(/[^a-z0-9]+/g, '-')
      .replace(/^-+|-+$/g, '')
      .slice(0, 60) || 'droopline'
  );
}

/** Offers `data` as a download named `name` (a Blob, or a data: URL for chart images). */
export function saveFile(name: string, data: Blob | string): void {
  const url = typeof data === 'string' ? data : URL.createObjectURL(data);
  const a = document.createElement('a');
  a.href = url;
  a.download = name;
  a.rel = 'noopener';
  a.style.display = 'none';
  document.body.appendChild(a);
  a.click();
  a.remove();
  if (typeof data !== 'string') setTimeout(() => URL.revokeObjectURL(url), 10_000);
}

/** Downloads a CSV table. A byte-order mark lets spreadsheet programs read the units' symbols (°, Ω). */
export function saveCsv(name: string, columns: readonly string[], rows: readonly (readonly (string | number | null | undefined)[])[]): void {
  saveFile(name.endsWith('.csv') ? name : `${name}.csv`, new Blob(['\ufeff', toCsv(columns, rows)], { type: 'text/csv;charset=utf-8' }));
}

/**
 * Draws an SVG (a report chart) onto a canvas at `scale` and resolves its PNG data URL.
 * Rejects where the browser cannot rasterise it.
 */
export function svgToPng(svg: string, widthPx: number, heightPx: number, scale = 2): Promise<string> {
  return new Promise((resolve, reject) => {
    const img = new Image();
    img.onload = () => {
      const c = document.createElement('canvas');
      c.width = Math.round(widthPx * scale);
      c.height = Math.round(heightPx * scale);
      const g = c.getContext('2d');
      if (!g) return reject(new Error('no 2-D canvas here'));
      g.fillStyle = '#ffffff';
      g.fillRect(0, 0, c.width, c.height);
      g.drawImage(img, 0, 0, c.width, c.height);
      resolve(c.toDataURL('image/png'));
    };
    img.onerror = () => reject(new Error('the chart could not be drawn as an image'));
    img.src = `data:image/svg+xml;charset=utf-8,${encodeURIComponent(svg)}`;
  });
}

/** What an exported chart image says about itself, above and below the chart. */
export interface PngLabel {
  /** The chart's title. */
  title: string;
  /** The plant's name. */
  plant: string;
  /** The scenario or run, where the chart comes from one. */
  scenario?: string;
  /** The date, YYYY-MM-DD. */
  date: string;
}

/** The lines printed above an exported chart: its title, then plant · scenario · date. */
export function pngHeading(label: PngLabel): [string, string] {
  return [label.title, [label.plant, label.scenario, label.date].filter((x) => !!x).join(' · ')];
}

/** Splits `text` into lines no wider than `maxPx` as `measure` gives widths. */
export function wrapWords(text: string, maxPx: number, measure: (s: string) => number): string[] {
  const lines: string[] = [];
  let line = '';
  for (const word of text.split(/\s+/)) {
    const next = line ? `${line} ${word}` : word;
    if (line && measure(next) > maxPx) {
      lines.push(line);
      line = word;
    } else line = next;
  }
  if (line) lines.push(line);
  return lines;
}

/**
 * Frames a chart image (a PNG data URL) with its title, the plant, the scenario, the date above and the
 * caution below, on white, and resolves the new PNG data URL.
 */
export function labelPng(pngUrl: string, label: PngLabel, caution: string): Promise<string> {
  return new Promise((resolve, reject) => {
    const img = new Image();
    img.onload = () => {
      const pad = Math.max(12, Math.round(img.width / 80));
      const big = Math.max(16, Math.round(img.width / 45));
      const small = Math.max(12, Math.round(big * 0.75));
      const c = document.createElement('canvas');
      const g0 = c.getContext('2d');
      if (!g0) return reject(new Error('no 2-D canvas here'));
      g0.font = `${small}px system-ui, sans-serif`;
      const cautionLines = wrapWords(caution, img.width - 2 * pad, (s) => g0.measureText(s).width);
      const head = pad + big + small * 1.6 + pad / 2;
      const foot = pad / 2 + cautionLines.length * small * 1.3 + pad;
      c.width = img.width;
      c.height = Math.round(head + img.height + foot);
      const g = c.getContext('2d')!;
      g.fillStyle = '#ffffff';
      g.fillRect(0, 0, c.width, c.height);
      g.fillStyle = '#1d2329';
      g.textBaseline = 'top';
      const [title, line2] = pngHeading(label);
      g.font = `600 ${big}px system-ui, sans-serif`;
      g.fillText(title, pad, pad);
      g.font = `${small}px system-ui, sans-serif`;
      g.fillStyle = '#4b5560';
      g.fillText(line2, pad, pad + big * 1.25);
      g.drawImage(img, 0, head);
      g.fillStyle = '#4d3a00';
      cautionLines.forEach((l, i) => g.fillText(l, pad, head + img.height + pad / 2 + i * small * 1.3));
      resolve(c.toDataURL('image/png'));
    };
    img.onerror = () => reject(new Error('the chart could not be drawn as an image'));
    img.src = pngUrl;
  });
}
