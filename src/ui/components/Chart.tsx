// The one uPlot wrapper: create once, setData on change, resize with the container, destroy on unmount.
// uPlot has no touch zoom, so the wrapper offers zoom buttons and reports taps (with a generous hit radius
// left to the caller, which knows its series).
// uPlot draws on a canvas with its own colours (black axes), which vanish on the dark theme: every chart takes its
// colours from our palette instead, and is drawn again when the device switches between light and dark.
import { useEffect, useRef, useState } from 'preact/hooks';
// Before uPlot loads: it formats numbers with navigator.language as soon as its module is evaluated.
import '../localeGuard';
import { FIELD_MODE_EVENT, fieldModeActive } from '../fieldMode';
import type uPlot from 'uplot';
import { whenIdle } from '../idle';
import { formatTick } from '../format';
import { nextTask } from '../../records';
import { lazy } from '../lazy';
import { CHART_DRAWN_MARK } from '../marks';
import { holdStartUp } from '../startUp';

// uPlot is loaded and evaluated after the screen's first paint, in idle time: its module sets up number and date
// formatting at load, the first use of the browser's locale data, which is a long task on a phone. The chart keeps
// its final height meanwhile, so nothing moves when it is drawn.
const uplotCode = lazy(() => import('uplot').then((m) => m.default)); // a later chart tries again after a failure

export type ChartOptions = Omit<uPlot.Options, 'width' | 'height'>;

/** Our palette as canvas colours, read from the CSS custom properties of the current theme. */
export interface ChartPalette {
  ink: string;
  muted: string;
  grid: string;
  teal: string;
  amber: string;
  ok: string;
  bad: string;
}

const LIGHT_FALLBACK: ChartPalette = { ink: '#1b2423', muted: '#56625f', grid: '#d8d2c4', teal: '#2f6461', amber: '#b36b00', ok: '#2d6a3e', bad: '#a3261b' };

export function chartPalette(): ChartPalette {
  if (typeof getComputedStyle !== 'function' || typeof document === 'undefined') return LIGHT_FALLBACK;
  const style = getComputedStyle(document.documentElement);
  const read = (name: string, fallback: string) => style.getPropertyValue(name).trim() || fallback;
  return {
    ink: read('--ink', LIGHT_FALLBACK.ink),
    muted: read('--muted', LIGHT_FALLBACK.muted),
    grid: read('--line', LIGHT_FALLBACK.grid),
    teal: read('--teal-2', LIGHT_FALLBACK.teal),
    amber: read('--amber', LIGHT_FALLBACK.amber),
    ok: read('--ok', LIGHT_FALLBACK.ok),
    bad: read('--bad', LIGHT_FALLBACK.bad),
  };
}

/** Axes in the palette unless the caller chose otherwise; uPlot's own legend off (it shows "--" until hovered, and
 * there is no hover on a phone): each chart has a legend of its own in the page. */
export function themedOptions(options: ChartOptions, palette: ChartPalette): ChartOptions {
  // uPlot's default axis room (50 px plus 30 px for a title) leaves a 360 px phone a plot half the card wide:
  // tighter titles and x-axis room give the curve the space, callers still set a y size for wide tick labels.
  const field = fieldModeActive();
  const axes = (options.axes ?? [{}, {}]).map((axis, i) => ({
    labelGap: 0,
    // The page's own type (uPlot's default names a longer list of families, each one more font to look up), and
    // fonts known here, so they can be drawn ahead (warmCanvasFont). Field mode: axis numbers and titles big and bold
    // enough to read in glare.
    ...(field
      ? { font: `600 15px ${CHART_FONT_FAMILY}`, labelFont: `700 16px ${CHART_FONT_FAMILY}`, labelSize: 24 }
      : { font: `12px ${CHART_FONT_FAMILY}`, labelFont: `bold 12px ${CHART_FONT_FAMILY}`, labelSize: 20 }),
    ...(i === 0 ? { size: 40 } : {}),
    // Numbers by our own formatter: uPlot's default builds an Intl.NumberFormat, the browser's first use of its
    // locale data (a long task on a phone; the build makes uPlot build it only when asked, see vite.config.ts).
    // A time axis (uPlot's x default) keeps uPlot's date stamps, which do not use Intl.
    ...(i === 0 && options.scales?.x?.time !== false ? {} : { values: tickValues }),
    ...axis,
    ...(field && typeof axis.size === 'number' ? { size: Math.round(axis.size * 1.3) } : {}),
    stroke: axis.stroke ?? palette.ink,
    grid: { stroke: palette.grid, width: 1, ...axis.grid },
    ticks: { stroke: palette.grid, ...axis.ticks },
  }));
  return { ...options, legend: options.legend ?? { show: false }, axes };
}

/** The page's font families (styles.css, body), for everything drawn on a chart's canvas. */
export const CHART_FONT_FAMILY = "system-ui, -apple-system, 'Segoe UI', Roboto, 'Noto Sans', sans-serif";

/** What an axis draws: digits and signs of the tick numbers, and the axis titles. */
const TICK_CHARACTERS = '0123456789.,−-+eE×%';

/** The fonts the axes of `options` draw with, at the size uPlot draws them (CSS px times the pixel ratio), and the
 * characters they draw. */
export function chartTextFonts(options: ChartOptions, ratio: number = globalThis.devicePixelRatio || 1): { fonts: string[]; characters: string } {
  const fonts = new Set<string>();
  let characters = TICK_CHARACTERS;
  for (const axis of options.axes ?? []) {
    for (const font of [axis.font, axis.labelFont]) {
      if (typeof font === 'string') fonts.add(font.replace(/(\d+)px/, (_m, size: string) => `${Math.round(Number(size) * ratio)}px`));
    }
    if (typeof axis.label === 'string') characters += axis.label;
  }
  return { fonts: [...fonts], characters: [...new Set(characters)].join('') };
}

/**
 * Draws `characters` in `font` once on a scratch canvas. A page's first text on a canvas in a font looks the font
 * up and renders its glyphs (5–15 ms measured on the 2-core machine for a chart's two fonts): done ahead, in a
 * short task of its own, that is not part of the chart's first drawing.
 */
export function warmCanvasFont(font: string, characters: string): void {
  const canvas = document.createElement('canvas');
  canvas.width = 48;
  canvas.height = 48;
  const ctx = canvas.getContext('2d');
  if (!ctx) return;
  ctx.font = font;
  // One glyph at a time inside the canvas: text beyond its edge may be skipped rather than rendered.
  for (const ch of characters) ctx.fillText(ch, 4, 36);
}

function tickValues(_u: uPlot, splits: number[]): string[] {
  return splits.map((v) => (v == null || !Number.isFinite(v) ? '' : formatTick(v)));
}

function darkQuery(): MediaQueryList | null {
  return typeof matchMedia === 'function' ? matchMedia('(prefers-color-scheme: dark)') : null;
}

export interface ChartProps {
  /**
   * Columnar data: [xs, ys1, ys2, …]; null marks a gap. Null for data still being computed: the chart holds its
   * place (marked busy, tools disabled) and builds its frame meanwhile, so drawing the data is short.
   */
  data: uPlot.AlignedData | null;
  /** Options, or a function of the palette so series colours follow the theme. */
  options: ChartOptions | ((palette: ChartPalette) => ChartOptions);
  height?: number;
  /** Accessible description of what the chart shows (the canvas itself says nothing to a screen reader). */
  label: string;
  /** A tap or click on the plot area, in data coordinates of the x scale and the given y scale. */
  onTap?: (x: number, y: number, plot: uPlot) => void;
  yScaleForTap?: string;
  /** Show zoom in / zoom out / reset buttons for the x (and optionally y) scale. */
  zoomButtons?: boolean;
  /** Scales the zoom buttons act on (default x only). */
  zoomScales?: readonly string[];
  /** A view set from outside (e.g. "close-up of the apex"); a new `key` applies it again. */
  view?: { key: number; ranges: Record<string, [number, number]> } | null;
  /** Redraw (e.g. for points drawn in a draw hook) when this value changes without new data. */
  redrawKey?: unknown;
  testId?: string;
}

/** A chart's height in CSS px when its caller gives none. */
const CHART_HEIGHT = 300;

/** A view's ranges on the chart's scales. */
function setRanges(u: uPlot, ranges: Record<string, [number, number]>): void {
  for (const [scale, [min, max]] of Object.entries(ranges)) u.setScale(scale, { min, max });
}

/** Empty columns for every series of `options`: a chart built before its data draws its frame only. */
function noData(options: ChartOptions): uPlot.AlignedData {
  return Array.from({ length: Math.max(2, options.series?.length ?? 2) }, () => []) as unknown as uPlot.AlignedData;
}

/** The caller's draw hooks, run only once there is data (without it, scales have no range to place things by). */
function withDataHooks(options: ChartOptions): ChartOptions {
  const draw = options.hooks?.draw;
  if (!draw) return options;
  const hooks = (Array.isArray(draw) ? draw : [draw]).map((hook) => (u: uPlot) => {
    if (hook && u.data[0]?.length) hook(u);
  });
  return { ...options, hooks: { ...options.hooks, draw: hooks } };
}

export function Chart(props: ChartProps) {
  const host = useRef<HTMLDivElement>(null);
  const plot = useRef<uPlot | null>(null);
  const resolved = useRef<ChartOptions | null>(null);
  /** The data the chart on screen shows (null: only its frame, or no chart yet). */
  const drawnData = useRef<uPlot.AlignedData | null>(null);
  /** Ends this chart's hold on the work that waits for the first screen. */
  const releaseHold = useRef<(() => void) | null>(null);
  const latest = useRef(props);
  latest.current = props;

  // Canvas can be missing (blocked by a privacy setting, or a DOM without 2D canvas): say so, keep the page.
  const [noCanvas, setNoCanvas] = useState(false);
  const [loadFailed, setLoadFailed] = useState(false);
  // The zoom tools act once data is drawn.
  const [hasData, setHasData] = useState(false);
  // Light or dark: a change draws the chart again in the other palette.
  const [dark, setDark] = useState(() => darkQuery()?.matches ?? false);
  useEffect(() => {
    const query = darkQuery();
    if (!query) return;
    const onChange = () => setDark(query.matches);
    query.addEventListener?.('change', onChange);
    return () => query.removeEventListener?.('change', onChange);
  }, []);
  // Field mode swaps the palette and the axis type: draw again in it.
  const [fieldMode, setFieldMode] = useState(fieldModeActive);
  useEffect(() => {
    const onChange = () => setFieldMode(fieldModeActive());
    window.addEventListener(FIELD_MODE_EVENT, onChange);
    return () => window.removeEventListener(FIELD_MODE_EVENT, onChange);
  }, []);

  useEffect(() => {
    const el = host.current!;
    let live = true;
    let teardown: (() => void) | null = null;
    // Work that waits for the first screen (the offline copy of the app) waits until this chart shows its data.
    const release = holdStartUp('chart');
    releaseHold.current = release;
    drawnData.current = null;
    // A chart's first drawing is the longest single piece of work on its screen. It is done in steps, each a task
    // of its own, most of them while the data is still computed: the canvas check; the options; each axis font
    // (warmCanvasFont); asking for the library (its module is evaluated in a task of its own); the frame without
    // data, in two steps; then the data.
    const cancelIdle = whenIdle(() => void (async () => {
      // The page's first canvas (here, or the first font's below) sets up the browser's drawing: not in the same
      // task as the screen's effects.
      if (!document.createElement('canvas').getContext('2d')) {
        release();
        if (live) setNoCanvas(true);
        return;
      }
      await nextTask();
      if (!live) return;
      const options = resolveOptions();
      await nextTask();
      const { fonts, characters } = chartTextFonts(options);
      for (const font of fonts) {
        if (!live) return;
        warmCanvasFont(font, characters);
        await nextTask();
      }
      let UPlot: typeof uPlot;
      try {
        UPlot = await uplotCode.get();
      } catch {
        release();
        if (live) setLoadFailed(true);
        return;
      }
      await nextTask();
      if (!live) return;
      // The frame in two steps: the instance (options, elements), then, in the page, its size and first drawing
      // without data (where the canvas gets its memory).
      let init: () => void = () => undefined;
      const frame = new UPlot(frameOptions(options, Math.max(240, el.clientWidth || 320)), noData(options), (_self, start) => {
        init = start as () => void;
      });
      teardown = () => frame.destroy();
      await nextTask();
      if (!live) return;
      // Without data the frame has no axes, so its plot area is the whole chart: hidden until the data comes (then
      // the axes take their room, which would otherwise count as a layout shift).
      frame.root.style.visibility = 'hidden';
      el.appendChild(frame.root);
      init();
      teardown = attach(frame, el);
      await nextTask();
      const u = plot.current;
      const data = latest.current.data;
      if (live && u && data && !drawnData.current) show(u, data);
    })(), 1000);
    return () => {
      live = false;
      release();
      cancelIdle();
      teardown?.();
    };
    // Options are read once per theme and mode: a new series layout needs a new key on the component.
  }, [dark, fieldMode]);

  function resolveOptions(): ChartOptions {
    const given = latest.current.options;
    const palette = chartPalette();
    return themedOptions(typeof given === 'function' ? given(palette) : given, palette);
  }

  /** uPlot's options for the frame: the caller's, at this width and height. */
  function frameOptions(options: ChartOptions, width: number): uPlot.Options {
    resolved.current = options;
    // uPlot reads its date templates as it starts (a few ms on a first run); an x axis that is not time never
    // shows a date.
    const noDates = options.scales?.x?.time === false && !options.fmtDate ? { fmtDate: () => () => '' } : {};
    return { ...withDataHooks(options), ...noDates, width, height: latest.current.height ?? CHART_HEIGHT };
  }

  /** The drawn frame in use: taps, resizing; shown data comes with show(). Returns its teardown. */
  function attach(u: uPlot, el: HTMLDivElement): () => void {
    plot.current = u;
    const onClick = (ev: MouseEvent) => {
      const cb = latest.current.onTap;
      if (!cb || !drawnData.current) return;
      const rect = u.over.getBoundingClientRect();
      const left = ev.clientX - rect.left;
      const top = ev.clientY - rect.top;
      cb(u.posToVal(left, 'x'), u.posToVal(top, latest.current.yScaleForTap ?? 'y'), u);
    };
    u.over.addEventListener('click', onClick);
    const ro = typeof ResizeObserver !== 'undefined'
      ? new ResizeObserver(() => {
          const w = Math.max(240, el.clientWidth);
          if (w !== u.width) u.setSize({ width: w, height: latest.current.height ?? CHART_HEIGHT });
        })
      : null;
    ro?.observe(el);
    return () => {
      ro?.disconnect();
      u.over.removeEventListener('click', onClick);
      u.destroy();
      plot.current = null;
      drawnData.current = null;
    };
  }

  /** Data on the chart; the first time, with a view asked for before it was drawn. */
  function show(u: uPlot, data: uPlot.AlignedData): void {
    // The same data again (the build's last step and a data change can both come to it): nothing to draw.
    if (drawnData.current === data) return;
    const first = !drawnData.current;
    drawnData.current = data;
    const view = first ? latest.current.view : null;
    u.batch(() => {
      u.setData(data);
      if (view) setRanges(u, view.ranges);
    });
    if (!first) return;
    u.root.style.visibility = '';
    // For start-up measurements (npm run bench -- lighthouse): a page with a chart is complete once it is drawn.
    performance.mark?.(CHART_DRAWN_MARK, { detail: latest.current.testId ?? null });
    releaseHold.current?.();
    // The tools' redraw a task later, not with the drawing.
    void nextTask().then(() => setHasData(true));
  }

  useEffect(() => {
    if (!props.data) return;
    let live = true;
    // Drawn in a task of its own, not with every other effect of the redraw that brought the data.
    void nextTask().then(() => {
      const u = plot.current;
      const data = latest.current.data;
      if (live && u && data) show(u, data);
    });
    return () => {
      live = false;
    };
  }, [props.data]);

  useEffect(() => {
    const u = plot.current;
    if (!u || !props.view || !drawnData.current) return;
    const { ranges } = props.view;
    u.batch(() => setRanges(u, ranges));
    // A view is applied when its key changes, not each time the caller builds the same view object again.
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [props.view?.key]);

  useEffect(() => {
    if (drawnData.current) plot.current?.redraw(false);
  }, [props.redrawKey]);

  function zoom(factor: number) {
    const u = plot.current;
    if (!u || !drawnData.current) return;
    u.batch(() => {
      for (const scale of props.zoomScales ?? ['x']) {
        const min = u.scales[scale].min!;
        const max = u.scales[scale].max!;
        const mid = (min + max) / 2;
        const half = ((max - min) / 2) * factor;
        u.setScale(scale, { min: mid - half, max: mid + half });
      }
    });
  }
  function reset() {
    const u = plot.current;
    const data = latest.current.data;
    if (!u || !data || !drawnData.current) return;
    u.batch(() => {
      u.setData(data, true);
      // Scales with a fixed range are not auto-ranged by setData: put them back explicitly.
      for (const [key, scale] of Object.entries(resolved.current?.scales ?? {})) {
        const range = scale?.range;
        if (Array.isArray(range) && typeof range[0] === 'number' && typeof range[1] === 'number') u.setScale(key, { min: range[0], max: range[1] });
      }
    });
  }

  const ready = hasData && props.data !== null;
  const broken = noCanvas || loadFailed;
  return (
    <figure class="chart-figure" data-testid={props.testId} aria-busy={props.data === null ? 'true' : undefined}>
      {props.zoomButtons && <ChartTools zoom={ready ? zoom : undefined} reset={ready ? reset : undefined} />}
      <div class="chart" ref={host} role="img" aria-label={props.label} style={broken ? undefined : { minHeight: `${props.height ?? CHART_HEIGHT}px` }} />
      {loadFailed && <LoadFailed />}
      {noCanvas && <p class="notice">This browser does not allow drawing on a canvas, so the chart cannot be shown; the values below are complete without it.</p>}
    </figure>
  );
}

/** Zoom in, zoom out and reset; disabled (holding their place) when there is no chart to act on yet. */
function ChartTools(props: { zoom?: (factor: number) => void; reset?: () => void }) {
  const { zoom, reset } = props;
  return (
    <div class="chart-tools">
      <button type="button" class="btn btn-small" disabled={!zoom} onClick={() => zoom?.(0.5)}>Zoom in</button>
      <button type="button" class="btn btn-small" disabled={!zoom} onClick={() => zoom?.(2)}>Zoom out</button>
      <button type="button" class="btn btn-small" disabled={!reset} onClick={reset} aria-label="Reset the chart view">Reset</button>
    </div>
  );
}

function LoadFailed() {
  return <p class="notice">The chart could not be loaded on this device yet (open Rodside once with a network so it keeps every part); the values below are complete without it.</p>;
}

export type { uPlot };
