// CSV export of readings that opens cleanly in spreadsheets: RFC 4180 quoting and CRLF line ends, a UTF-8
// byte-order mark so µ and ° survive, and text cells that a spreadsheet could run as a formula defused.
import type { ReadingType } from './catalogue';
import { visitReasons } from './validate';
import type { InstrumentProfile, Reading, Visit } from './types';

export type CsvValue = string | number | null | undefined;

const formulaStart = /^[=+\-@\t\r]/;

/**
 * One cell. Numbers are written as numbers (a plain number cannot be a formula). Text that starts with
 * = + - @ (or a tab or carriage return) gets a leading apostrophe so a spreadsheet shows it instead of
 * evaluating it (OWASP "CSV injection"). Cells holding a comma, quote or line break are quoted, with
 * quotes doubled (RFC 4180 §2.6–2.7).
 */
export function csvCell(v: CsvValue): string {
  if (v === null || v === undefined) return '';
  let s = typeof v === 'number' ? (Number.isFinite(v) ? String(v) : '') : v;
  if (typeof v === 'string' && formulaStart.test(s)) s = `'${s}`;
  return /[",\r\n]/.test(s) ? `"${s.replace(/"/g, '""')}"` : s;
}

export const CSV_BOM = '\uFEFF';

export function toCsv(rows: readonly (readonly CsvValue[])[]): string {
  return CSV_BOM + rows.map((r) => r.map(csvCell).join(',')).join('\r\n') + '\r\n';
}

export const readingsCsvHeader = [
  'Instrument', 'Visit started', 'Site', 'Engineer', 'Reason', 'Reading', 'Phase', 'Value', 'Base unit',
  'As typed', 'Unit typed', 'Context', 'Expected', 'Expected low', 'Expected high', 'Expected from', 'Verdict',
  'Note', 'Taken at', 'Reading id', 'Visit id',
] as const;

export function readingsCsv(
  instruments: readonly InstrumentProfile[],
  visits: readonly Visit[],
  readings: readonly Reading[],
  typeOf: (id: string) => ReadingType | undefined,
): string {
  const inst = new Map(instruments.map((i) => [i.id, i]));
  const vis = new Map(visits.map((v) => [v.id, v]));
  const sorted = [...readings].sort((a, b) => {
    const va = vis.get(a.visitId)?.startedAt ?? '', vb = vis.get(b.visitId)?.startedAt ?? '';
    return va < vb ? -1 : va > vb ? 1 : a.takenAt < b.takenAt ? -1 : a.takenAt > b.takenAt ? 1 : 0;
  });
  const rows: CsvValue[][] = [[...readingsCsvHeader]];
  for (const r of sorted) {
    const v = vis.get(r.visitId);
    const t = typeOf(r.typeId);
    const context = Object.entries(r.context ?? {}).map(([k, x]) => `${k}=${x}`).join('; ');
    rows.push([
      inst.get(r.instrumentId)?.name ?? r.instrumentId,
      v?.startedAt,
      v?.site,
      v?.engineer,
      visitReasons.find((x) => x.value === v?.reason)?.label ?? v?.reason,
      t?.label ?? r.typeId,
      r.phase,
      r.value,
      t?.baseUnit ?? '',
      r.entered.text,
      r.entered.unit,
      context,
      r.expected?.value,
      r.expected?.low,
      r.expected?.high,
      r.expected ? `${r.expected.basis}${r.expected.source ? `: ${r.expected.source}` : ''}` : '',
      r.verdict ?? 'not judged',
      r.note,
      r.takenAt,
      r.id,
      r.visitId,
    ]);
  }
  return toCsv(rows);
}
