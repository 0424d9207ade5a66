// The one uPlot wrapper: create once, setData on change, resize with the container, destroy on unmount.
// uPlot has no touch zoom, so the wrapper offers zoom buttons and reports taps (with a generous hit radius
// left to the caller, which knows its series).
import { useEffect, useRef, useState } from 'preact/hooks';
import uPlot from 'uplot';

export interface ChartProps {
  /** Columnar data: [xs, ys1, ys2, …]; null marks a gap. */
  data: uPlot.AlignedData;
  options: Omit<uPlot.Options, 'width' | 'height'>;
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

export function Chart(props: ChartProps) {
  const host = useRef<HTMLDivElement>(null);
  const plot = useRef<uPlot | null>(null);
  const latest = useRef(props);
  latest.current = props;

  // Canvas can be missing (blocked by a privacy setting, or a DOM without 2D canvas): say so, keep the page.
  const [noCanvas, setNoCanvas] = useState(false);

  useEffect(() => {
    const el = host.current!;
    if (!document.createElement('canvas').getContext('2d')) {
      setNoCanvas(true);
      return;
    }
    const width = Math.max(240, el.clientWidth || 320);
    const u = new uPlot({ ...props.options, width, height: props.height ?? 300 }, props.data, el);
    plot.current = u;
    const onClick = (ev: MouseEvent) => {
      const cb = latest.current.onTap;
      if (!cb) return;
      const rect = u.over.getBoundingClientRect();
      const left = ev.clientX - rect.left;
      const top = ev.clientY - rect.top;
      cb(u.posToVal(left, 'x'), u.posToVal(top, latest.current.yScaleForTap ?? 'y'), u);
    };
    u.over.addEventListener('click', onClick);
    const ro = typeof ResizeObserver !== 'undefined'
      ? new ResizeObserver(() => {
          const w = Math.max(240, el.clientWidth);
          if (w !== u.width) u.setSize({ width: w, height: latest.current.height ?? 300 });
        })
      : null;
    ro?.observe(el);
    return () => {
      ro?.disconnect();
      u.over.removeEventListener('click', onClick);
      u.destroy();
      plot.current = null;
    };
    // Options are read once: a new series layout needs a new key on the component.
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, []);

  useEffect(() => {
    plot.current?.setData(props.data);
  }, [props.data]);

  useEffect(() => {
    const u = plot.current;
    if (!u || !props.view) return;
    u.batch(() => {
      for (const [scale, [min, max]] of Object.entries(props.view!.ranges)) u.setScale(scale, { min, max });
    });
  }, [props.view?.key]);

  useEffect(() => {
    plot.current?.redraw(false);
  }, [props.redrawKey]);

  function zoom(factor: number) {
    const u = plot.current;
    if (!u) return;
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
    if (!u) return;
    u.batch(() => {
      u.setData(latest.current.data, true);
      // Scales with a fixed range are not auto-ranged by setData: put them back explicitly.
      for (const [key, scale] of Object.entries(latest.current.options.scales ?? {})) {
        const range = scale?.range;
        if (Array.isArray(range) && typeof range[0] === 'number' && typeof range[1] === 'number') u.setScale(key, { min: range[0], max: range[1] });
      }
    });
  }

  return (
    <figure class="chart-figure" data-testid={props.testId}>
      {props.zoomButtons && (
        <div class="chart-tools">
          <button type="button" class="btn btn-small" onClick={() => zoom(0.5)}>Zoom in</button>
          <button type="button" class="btn btn-small" onClick={() => zoom(2)}>Zoom out</button>
          <button type="button" class="btn btn-small" onClick={reset}>Reset view</button>
        </div>
      )}
      <div class="chart" ref={host} role="img" aria-label={props.label} />
      {noCanvas && <p class="notice">This browser does not allow drawing on a canvas, so the chart cannot be shown; the values below are complete without it.</p>}
    </figure>
  );
}

export type { uPlot };
