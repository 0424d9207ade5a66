// Small timing helpers shared by the benchmarks.
import { performance } from 'node:perf_hooks';

/** Median wall time of `fn` in milliseconds over `repeats` runs after `warmup` runs. */
export function medianMs(fn: () => unknown, repeats = 7, warmup = 2): number {
  for (let i = 0; i < warmup; i++) fn();
  const times: number[] = [];
  for (let i = 0; i < repeats; i++) {
    const t0 = performance.now();
    fn();
    times.push(performance.now() - t0);
  }
  times.sort((x, y) => x - y);
  return times[Math.floor(times.length / 2)];
}

export async function medianMsAsync(fn: () => Promise<unknown>, repeats = 5, warmup = 1): Promise<number> {
  for (let i = 0; i < warmup; i++) await fn();
  const times: number[] = [];
  for (let i = 0; i < repeats; i++) {
    const t0 = performance.now();
    await fn();
    times.push(performance.now() - t0);
  }
  times.sort((x, y) => x - y);
  return times[Math.floor(times.length / 2)];
}

export function report(label: string, value: number, unit: string, target?: string): void {
  const shown = value >= 100 ? value.toFixed(0) : value >= 1 ? value.toFixed(2) : value.toPrecision(3);
  console.log(`${label.padEnd(58)} ${shown.padStart(10)} ${unit}${target ? `   (target ${target})` : ''}`);
}
