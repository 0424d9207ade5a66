// @vitest-environment happy-dom
// A chart whose data is still being computed holds its place and builds its frame meanwhile; the data is drawn
// into that frame when it comes, in a task of its own. Checked with a stand-in for uPlot that records each call,
// and a canvas whose 2D context records what is drawn (happy-dom has no canvas drawing).
import { render } from 'preact';
import { act } from 'preact/test-utils';
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { waitFor } from '../waitFor';
import { startUpHeld } from '../../../src/ui/startUp';
import { CHART_DRAWN_MARK } from '../../../src/ui/marks';

const calls: Array<{ kind: string; rows?: number; scale?: string }> = [];

vi.mock('uplot', () => {
  class FakePlot {
    data: unknown[][];
    root = document.createElement('div');
    over = document.createElement('div');
    width: number;
    scales: Record<string, { min: number; max: number }> = { x: { min: 0, max: 10 }, y: { min: 0, max: 1 } };
    hooks: Array<(u: FakePlot) => void>;
    constructor(options: { width: number; hooks?: { draw?: Array<(u: FakePlot) => void> } }, data: unknown[][], target: HTMLElement | ((self: FakePlot, init: () => void) => void)) {
      this.width = options.width;
      this.data = data;
      this.hooks = options.hooks?.draw ?? [];
      this.root.appendChild(this.over);
      // As uPlot: with a function, the caller attaches the root and starts the first drawing when it chooses.
      const init = () => {
        if (!this.root.isConnected) throw new Error('started before the chart was in the page');
        calls.push({ kind: 'build', rows: data[0].length });
        this.drawn();
      };
      if (typeof target === 'function') target(this, init);
      else {
        target.appendChild(this.root);
        init();
      }
    }
    drawn() {
      for (const hook of this.hooks) hook(this);
    }
    setData(data: unknown[][]) {
      this.data = data;
      calls.push({ kind: 'setData', rows: data[0].length });
      this.drawn();
    }
    setScale(scale: string) {
      calls.push({ kind: 'setScale', scale });
    }
    batch(f: () => void) {
      f();
    }
    redraw() {
      calls.push({ kind: 'redraw' });
    }
    setSize() {}
    destroy() {
      calls.push({ kind: 'destroy' });
    }
  }
  return { default: FakePlot };
});

/** What the scratch canvas of the font warm-up was asked to draw. */
const drawnText: Array<{ font: string; text: string }> = [];

beforeEach(() => {
  calls.length = 0;
  drawnText.length = 0;
  vi.spyOn(HTMLCanvasElement.prototype, 'getContext').mockImplementation(function () {
    let font = '';
    return {
      get font() { return font; },
      set font(f: string) {
        font = f;
        calls.push({ kind: 'font' });
      },
      fillText(text: string) { drawnText.push({ font, text }); },
    } as unknown as CanvasRenderingContext2D;
  } as never);
});
afterEach(() => vi.restoreAllMocks());

async function mountChart(props: Record<string, unknown>) {
  const { Chart } = await import('../../../src/ui/components/Chart');
  const root = document.createElement('div');
  document.body.appendChild(root);
  const options = { scales: { x: { time: false } }, series: [{}, { label: 'y' }], axes: [{ label: 'm/z' }, { label: 'Transmission (%)' }] };
  const draw = (extra: Record<string, unknown>) => act(async () => render(<Chart options={options} height={200} label="peak" testId="c" zoomButtons {...props} {...extra} data={(extra.data ?? props.data) as never} />, root));
  await draw({});
  return { root, update: draw, unmount: () => act(async () => render(null, root)) };
}

describe('a chart whose data is still computed', () => {
  it('builds its frame without data, marked busy with its tools disabled, and holds the start-up', async () => {
    const c = await mountChart({ data: null });
    await waitFor(() => calls.some((k) => k.kind === 'build'), 'the frame');
    // The axis numbers' font and the titles' bold one drawn ahead, then the frame without data.
    expect(calls).toEqual([{ kind: 'font' }, { kind: 'font' }, { kind: 'build', rows: 0 }]);
    expect(c.root.querySelector('figure')!.getAttribute('aria-busy')).toBe('true');
    expect([...c.root.querySelectorAll('button')].every((b) => b.disabled)).toBe(true);
    expect(startUpHeld()).toBe(true);
    await c.unmount();
    expect(startUpHeld()).toBe(false);
  });

  it('draws the data into that frame when it comes, then frees the start-up and the tools', async () => {
    performance.clearMarks(CHART_DRAWN_MARK);
    const c = await mountChart({ data: null });
    await waitFor(() => calls.some((k) => k.kind === 'build'), 'the frame');
    expect(performance.getEntriesByName(CHART_DRAWN_MARK)).toHaveLength(0);
    // The frame without axes is hidden: its plot area shrinks when the axes come with the data (a layout shift).
    const frame = c.root.querySelector<HTMLElement>('.chart > div')!;
    expect(frame.style.visibility).toBe('hidden');
    await c.update({ data: [[1, 2, 3], [0.1, 0.5, 0.2]] });
    await waitFor(() => calls.some((k) => k.kind === 'setData'), 'the data drawn');
    expect(frame.style.visibility).toBe('');
    expect(calls.filter((k) => k.kind === 'build')).toHaveLength(1);
    expect(calls.find((k) => k.kind === 'setData')!.rows).toBe(3);
    await waitFor(() => ![...c.root.querySelectorAll('button')].some((b) => b.disabled), 'the tools enabled');
    expect(c.root.querySelector('figure')!.hasAttribute('aria-busy')).toBe(false);
    expect(performance.getEntriesByName(CHART_DRAWN_MARK)).toHaveLength(1);
    expect(startUpHeld()).toBe(false);
    await c.unmount();
  });

  it('with data from the start, still builds the frame first and draws the data in a later step', async () => {
    const c = await mountChart({ data: [[1, 2], [3, 4]] });
    await waitFor(() => calls.some((k) => k.kind === 'setData'), 'the data drawn');
    expect(calls.filter((k) => k.kind !== 'font').slice(0, 2)).toEqual([{ kind: 'build', rows: 0 }, { kind: 'setData', rows: 2 }]);
    await c.unmount();
  });

  it('applies a view asked for before the data once the data is drawn, not to the empty frame', async () => {
    const c = await mountChart({ data: null, view: { key: 1, ranges: { x: [2, 3] } } });
    await waitFor(() => calls.some((k) => k.kind === 'build'), 'the frame');
    expect(calls.some((k) => k.kind === 'setScale')).toBe(false);
    await c.update({ data: [[1, 2, 3], [1, 2, 3]] });
    await waitFor(() => calls.some((k) => k.kind === 'setScale'), 'the view');
    const order = calls.map((k) => k.kind);
    expect(order.indexOf('setData')).toBeLessThan(order.indexOf('setScale'));
    await c.unmount();
  });

  it('runs the caller’s draw hooks only once there is data', async () => {
    const seen: number[] = [];
    const hook = (u: { data: unknown[][] }) => void seen.push(u.data[0].length);
    const { Chart } = await import('../../../src/ui/components/Chart');
    const root = document.createElement('div');
    document.body.appendChild(root);
    const options = { series: [{}, {}], hooks: { draw: [hook] } };
    await act(async () => render(<Chart options={options as never} label="x" data={null} />, root));
    await waitFor(() => calls.some((k) => k.kind === 'build'), 'the frame');
    expect(seen).toEqual([]);
    await act(async () => render(<Chart options={options as never} label="x" data={[[5, 6], [1, 2]]} />, root));
    await waitFor(() => seen.length > 0, 'the hook with data');
    expect(seen).toEqual([2]);
    await act(async () => render(null, root));
  });

  it('draws the axis fonts ahead on a scratch canvas, at the size the chart draws them', async () => {
    const { chartTextFonts, warmCanvasFont, themedOptions, chartPalette, CHART_FONT_FAMILY } = await import('../../../src/ui/components/Chart');
    const options = themedOptions({ series: [{}, {}], axes: [{ label: 'q' }, { label: 'a' }] }, chartPalette());
    const { fonts, characters } = chartTextFonts(options, 1.75);
    // 12 px × 1.75 = 21 px, as uPlot scales its fonts by the pixel ratio; numbers plain, titles bold.
    expect(fonts).toEqual([`21px ${CHART_FONT_FAMILY}`, `bold 21px ${CHART_FONT_FAMILY}`]);
    for (const ch of ['0', '9', '.', '−', 'q', 'a']) expect(characters).toContain(ch);
    expect(new Set(characters).size).toBe(characters.length);
    warmCanvasFont(fonts[1], characters);
    expect(drawnText.map((d) => d.text).join('')).toBe(characters);
    expect(new Set(drawnText.map((d) => d.font))).toEqual(new Set([fonts[1]]));
  });
});
