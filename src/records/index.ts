/** Public face of the records layer: pure rules for instruments, visits and readings (no idb, no DOM). */
export * from './types';
export * from './numberText';
export * from './units';
export * from './conventions';
export * from './profile';
export * from './catalogue';
export * from './judge';
export * from './checks';
export * from './visits';
export * from './validate';
export * from './trends';
export * from './reminder';
export * from './noteRules';
export { csvCell, toCsv, readingsCsv, CSV_BOM } from './csv';
export { escapeHtml, REPORT_PRINT_CSS, visitReportHtml, visitReportSection, shownValue, historyLines } from './report';
export * from './numberEntry';
export { nextTask, runInSteps } from './nextTask';
