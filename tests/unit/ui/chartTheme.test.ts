// @vitest-environment happy-dom
// Charts draw on a canvas with uPlot's own colours unless told otherwise; black axes vanish on the dark theme.
// These checks pin that every chart's axes, grid and ticks come from our palette (CSS custom properties).
import { afterEach, describe, expect, it } from 'vitest';
import { chartPalette, themedOptions } from '../../../src/ui/components/Chart';

afterEach(() => {
  document.documentElement.removeAttribute('style');
});

describe('chart colours come from the palette', () => {
  it('reads the palette from the CSS custom properties of the page', () => {
    document.documentElement.style.setProperty('--ink', '#e9eeec');
    document.documentElement.style.setProperty('--line', '#33403e');
    document.documentElement.style.setProperty('--teal-2', '#6dbab2');
    const p = chartPalette();
    expect(p.ink).toBe('#e9eeec');
    expect(p.grid).toBe('#33403e');
    expect(p.teal).toBe('#6dbab2');
  });

  it('falls back to the light palette when a property is missing', () => {
    expect(chartPalette().ink).toBe('#1b2423');
  });

  it('axes without colours get ink labels and palette grid and ticks; uPlot legend off', () => {
    const palette = { ink: '#eeeeee', muted: '#aaaaaa', grid: '#333333', teal: '#00ffee', amber: '#ffbb00', ok: '#00ff00', bad: '#ff0000' };
    const out = themedOptions({ series: [{}, {}], axes: [{ label: 'm/z' }, { label: 'a', size: 56 }] }, palette);
    expect(out.legend).toEqual({ show: false });
    for (const axis of out.axes!) {
      expect(axis.stroke).toBe('#eeeeee');
      expect(axis.grid?.stroke).toBe('#333333');
      expect(axis.ticks?.stroke).toBe('#333333');
    }
    expect(out.axes![1].size).toBe(56);
    expect(out.axes![0].label).toBe('m/z');
  });

  it('keeps colours and a legend the caller chose, and themes the default two axes when none are given', () => {
    const palette = { ink: '#eeeeee', muted: '#aaaaaa', grid: '#333333', teal: '#00ffee', amber: '#ffbb00', ok: '#00ff00', bad: '#ff0000' };
    const chosen = themedOptions({ series: [{}], legend: { show: true }, axes: [{ stroke: '#123456', grid: { stroke: '#654321' } }] }, palette);
    expect(chosen.legend).toEqual({ show: true });
    expect(chosen.axes![0].stroke).toBe('#123456');
    expect(chosen.axes![0].grid?.stroke).toBe('#654321');
    const bare = themedOptions({ series: [{}, {}] }, palette);
    expect(bare.axes).toHaveLength(2);
    expect(bare.axes!.every((a) => a.stroke === '#eeeeee')).toBe(true);
  });
});
