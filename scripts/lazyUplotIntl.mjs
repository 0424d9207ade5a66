// Build step: uPlot builds an Intl.NumberFormat and an Intl.DateTimeFormat when its module is evaluated. That is
// the browser's first use of its locale data, a long task on a phone (30–80 ms measured on a desktop core), paid
// the moment a chart loads. This transform makes both lazy: built on first use. Our charts format their own axis
// numbers (Chart.tsx) and set no time zone, so on our pages neither is ever built. If uPlot's text changes, the
// build fails here rather than silently shipping the slow start.

/** @type {ReadonlyArray<[string, string]>} [before, after] */
const edits = [
  [
    "const numFormatter = new Intl.NumberFormat(domEnv ? nav.language : 'en-US');\nconst fmtNum = val => numFormatter.format(val);",
    "let numFormatter = null;\nconst fmtNum = val => (numFormatter ??= new Intl.NumberFormat(domEnv ? nav.language : 'en-US')).format(val);",
  ],
  [
    'const localTz = new Intl.DateTimeFormat().resolvedOptions().timeZone;',
    'let localTzName = null;\nconst localTz = () => (localTzName ??= new Intl.DateTimeFormat().resolvedOptions().timeZone);',
  ],
  ['else if (tz == localTz)', 'else if (tz == localTz())'],
];

export const UPLOT_MODULE = /[\\/]uplot[\\/]dist[\\/]uPlot\.esm\.js$/;

/**
 * uPlot's module text with its Intl formatters built on first use. Throws when an expected line is missing.
 * @param {string} code
 * @returns {string}
 */
export function lazyIntl(code) {
  let out = code.replace(/\r\n/g, '\n');
  for (const [before, after] of edits) {
    const at = out.indexOf(before);
    if (at < 0 || out.indexOf(before, at + 1) >= 0) {
      throw new Error(`lazyUplotIntl: uPlot's module no longer has exactly one "${before.split('\n')[0]}"; update scripts/lazyUplotIntl.mjs for this uPlot version.`);
    }
    out = out.slice(0, at) + after + out.slice(at + before.length);
  }
  return out;
}

/** @returns {import('vite').Plugin} */
export function lazyUplotIntl() {
  return {
    name: 'rodside-lazy-uplot-intl',
    transform(code, id) {
      if (!UPLOT_MODULE.test(id.split('?')[0])) return null;
      return { code: lazyIntl(code), map: null };
    },
  };
}
