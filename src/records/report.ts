// A printable visit record: a standalone HTML document (for print, share or download) built from escaped
// text only, plus the print stylesheet the in-app view uses. Our own plain layout: a record sheet with
// a hand-over summary, readings grouped by phase, and sign-off lines.
import type { ReadingType } from './catalogue';
import { keysInTitle, readingTitle } from './checks';
import { verdictWords } from './judge';
import { visitReasons } from './validate';
import type { InstrumentProfile, Reading, Visit, WalkRecord } from './types';
import { formatNumber } from './numberText';
import { fromBase } from './units';

/** Escape text for HTML element content and double-quoted attributes. */
export function escapeHtml(s: string): string {
  return s.replace(/[&<>"']/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c]!);
}

/** Print rules: black on white, no navigation, tables that do not split a row across pages. */
export const REPORT_PRINT_CSS = `
@page { margin: 15mm; }
@media print {
  body { background: #fff; color: #000; }
  nav, header.app, footer.app, .no-print, button { display: none !important; }
  .visit-report { font-size: 10.5pt; }
  .visit-report a { color: inherit; text-decoration: none; }
}
.visit-report { font-family: system-ui, sans-serif; line-height: 1.35; max-width: 60rem; }
.visit-report h1 { font-size: 1.3em; margin: 0 0 .2em; }
.visit-report h2 { font-size: 1.05em; margin: 1.2em 0 .3em; border-bottom: 1px solid #555; }
.visit-report dl { display: grid; grid-template-columns: max-content 1fr; gap: .15em 1em; margin: 0; }
.visit-report dt { font-weight: 600; }
.visit-report dd { margin: 0; white-space: pre-wrap; }
.visit-report table { border-collapse: collapse; width: 100%; }
.visit-report th, .visit-report td { border: 1px solid #888; padding: .2em .4em; text-align: left; vertical-align: top; }
.visit-report tr { break-inside: avoid; }
.visit-report .num { text-align: right; font-variant-numeric: tabular-nums; }
.visit-report .verdict-fail { font-weight: 700; }
.visit-report .notes { white-space: pre-wrap; }
.visit-report .sign { display: grid; grid-template-columns: 1fr 1fr; gap: 2em; margin-top: 2em; }
.visit-report .sign div { border-top: 1px solid #000; padding-top: .2em; }
`;

export interface ReportInput {
  lab?: string;
  instrument: InstrumentProfile;
  visit: Visit;
  readings: readonly Reading[];
  walks?: readonly WalkRecord[];
  typeOf: (id: string) => ReadingType | undefined;
  generatedAt: Date;
}

/** A value shown in the unit it was typed in, so the record matches what the engineer saw. */
export function shownValue(r: Reading, type: ReadingType | undefined): string {
  if (r.entered.text.trim() !== '') return `${r.entered.text} ${r.entered.unit}`.trim();
  return `${formatNumber(r.value)} ${type?.baseUnit ?? ''}`.trim();
}

/** A reading's earlier versions in words, oldest first, e.g. "2e-5 mbar (✗ fail), recorded 2026-05-19 09:12, replaced 2026-05-19 09:20". */
export function historyLines(r: Reading): string[] {
  const at = (iso: string) => iso.slice(0, 16).replace('T', ' ');
  return (r.history ?? []).map((h) =>
    `${`${h.entered.text} ${h.entered.unit}`.trim()}${h.verdict ? ` (${verdictWords[h.verdict].symbol} ${verdictWords[h.verdict].word})` : ''}` +
    `${h.note ? `, note “${h.note}”` : ''}, recorded ${at(h.recordedAt)}, replaced ${at(h.replacedAt)}`);
}

function historyHtml(r: Reading): string {
  const lines = historyLines(r);
  if (!lines.length) return '';
  return `<br><small>Earlier: ${lines.map(escapeHtml).join('; ')}</small>`;
}

function expectedText(r: Reading, type: ReadingType | undefined): string {
  const e = r.expected;
  if (!e) return 'no expectation';
  const unit = type?.units.find((u) => u.label === r.entered.unit) ?? type?.units.find((u) => u.id === type.defaultUnit);
  const f = (x: number) => (unit ? formatNumber(fromBase(unit, x)) : formatNumber(x));
  const label = unit?.label ?? type?.baseUnit ?? '';
  if (e.value !== undefined) return `${f(e.value)} ${label} (${e.basis})`;
  const lo = e.low !== undefined ? f(e.low) : '…';
  const hi = e.high !== undefined ? f(e.high) : '…';
  return `${lo} to ${hi} ${label} (${e.basis})`;
}

function readingRows(list: readonly Reading[], typeOf: ReportInput['typeOf']): string {
  if (list.length === 0) return '<p>None recorded.</p>';
  const rows = list.map((r) => {
    const t = typeOf(r.typeId);
    const said = keysInTitle(r.typeId, r.context);
    // A walk step is named by its tree and step on screen; its internal code stays in the CSV only.
    const ctx = Object.entries(r.context ?? {}).filter(([k]) => k !== 'convention' && !said.includes(k))
      .map(([k, v]) => (k === 'walkStep' ? 'from a diagnosis walk' : `${k} ${v}`)).join(', ');
    const v = r.verdict ? `${verdictWords[r.verdict].symbol} ${verdictWords[r.verdict].word}` : '— not judged';
    return `<tr><td>${escapeHtml(r.typeId === 'noted-value' ? t?.label ?? r.typeId : readingTitle(r, t))}${ctx ? `<br><small>${escapeHtml(ctx)}</small>` : ''}</td>` +
      `<td class="num">${escapeHtml(shownValue(r, t))}${historyHtml(r)}</td><td>${escapeHtml(expectedText(r, t))}</td>` +
      `<td class="verdict-${r.verdict ?? 'none'}">${escapeHtml(v)}</td><td class="notes">${escapeHtml(r.note)}</td></tr>`;
  });
  return `<table><thead><tr><th>Reading</th><th>Value</th><th>Expected</th><th>Verdict</th><th>Note</th></tr></thead><tbody>${rows.join('')}</tbody></table>`;
}

/** The report body (a <section>), for embedding or for the standalone document. */
export function visitReportSection(inp: ReportInput): string {
  const { instrument: i, visit: v } = inp;
  const byTime = [...inp.readings].sort((a, b) => (a.takenAt < b.takenAt ? -1 : 1));
  const found = byTime.filter((r) => r.phase === 'as-found');
  const left = byTime.filter((r) => r.phase === 'as-left');
  const counts = { pass: 0, borderline: 0, fail: 0, convention: 0 };
  for (const r of byTime) if (r.verdict) counts[r.verdict]++;
  const reason = visitReasons.find((x) => x.value === v.reason)?.label ?? v.reason;
  const walks = (inp.walks ?? []).map((w) => `<li>${escapeHtml(w.treeId)} — ${escapeHtml(w.status)}, started ${escapeHtml(w.startedAt.slice(0, 16).replace('T', ' '))}</li>`);
  const dd = (k: string, val: string) => `<dt>${escapeHtml(k)}</dt><dd>${escapeHtml(val || '—')}</dd>`;
  return `<section class="visit-report">` +
    `<h1>Service visit record — ${escapeHtml(i.name)}</h1>` +
    (inp.lab ? `<p>${escapeHtml(inp.lab)}</p>` : '') +
    `<dl>${dd('Started', v.startedAt.slice(0, 16).replace('T', ' ') + ' UTC')}${dd('Site', v.site)}${dd('Engineer', v.engineer)}` +
    `${dd('Reason', reason)}${dd('Test equipment', v.testEquipment ?? '')}${dd('Parts used', v.partsUsed)}` +
    `${dd('Baseline', v.baseline ? 'Yes: this visit’s as-left readings are the instrument’s baseline' : 'No')}</dl>` +
    `<h2>Summary</h2><p>${byTime.length} readings: ${counts.pass} pass (✓), ${counts.borderline} borderline (△), ${counts.fail} fail (✗)${counts.convention ? `, ${counts.convention} check the convention (⇄)` : ''}.</p>` +
    `<h2>Notes</h2><p class="notes">${escapeHtml(v.notes || '—')}</p>` +
    `<h2>As found</h2>${readingRows(found, inp.typeOf)}` +
    `<h2>As left</h2>${readingRows(left, inp.typeOf)}` +
    (walks.length ? `<h2>Diagnosis walks</h2><ul>${walks.join('')}</ul>` : '') +
    `<div class="sign"><div>Engineer: name, signature, date</div><div>Customer: name, signature, date</div></div>` +
    `<p><small>Made with Rodside on ${escapeHtml(inp.generatedAt.toISOString().slice(0, 16).replace('T', ' '))} UTC. ` +
    `Expected values are guides; the instrument maker’s limits and procedures take precedence.</small></p>` +
    `</section>`;
}

/** A complete, self-contained HTML document: no scripts, inline styles only. */
export function visitReportHtml(inp: ReportInput): string {
  return `<!doctype html><html lang="en"><head><meta charset="utf-8"><meta name="viewport" content="width=device-width, initial-scale=1">` +
    `<title>${escapeHtml(`Visit ${inp.visit.startedAt.slice(0, 10)} — ${inp.instrument.name}`)}</title>` +
    `<style>${REPORT_PRINT_CSS}</style></head><body>${visitReportSection(inp)}</body></html>`;
}
