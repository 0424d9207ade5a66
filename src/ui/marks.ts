// User-timing marks the app sets for start-up measurements (read by bench/lighthouse.bench.ts). No imports: the
// bench reads these names without loading the app.

/** Set each time a chart is first drawn: a page with a chart is complete only once it is there. */
export const CHART_DRAWN_MARK = 'rodside:chart-drawn';
