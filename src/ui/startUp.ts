// The start-up: what the first screen still waits for, and work that waits until it has everything.
import { whenIdle, whenLoaded } from './idle';

/** What the first screen is still waiting for (the database, a chart's data, a chart being drawn). */
const holds = new Set<symbol>();

/**
 * Marks something the screen on view is waiting for; call the returned function when it has arrived (or failed).
 * Work scheduled with `afterStartUp` waits until nothing is held.
 */
export function holdStartUp(what: string): () => void {
  const token = Symbol(what);
  holds.add(token);
  return () => void holds.delete(token);
}

/** True while anything is held. */
export function startUpHeld(): boolean {
  return holds.size > 0;
}

/** What `settleWatch` needs from the browser: given as functions so a test can drive it without a clock. */
export interface SettleEnv {
  now(): number;
  /** Calls `fn` after `ms` (later if the main thread is busy then); returns a cancel function. */
  after(fn: () => void, ms: number): () => void;
  /** Calls `fn` with each long task's end time (in `now()` time); returns a stop function. Null: not observable. */
  onLongTask: ((fn: (end: number) => void) => () => void) | null;
  /** Calls `fn` when the page is hidden (the app sent to the background); returns a stop function. */
  onHidden(fn: () => void): () => void;
  /** Runs `fn` in idle time; returns a cancel function. */
  idle(fn: () => void): () => void;
  /** True while the first screen still waits for something (its data, a chart): counts as busy. */
  held(): boolean;
}

export interface SettleOptions {
  /** How long nothing may be held and the main thread must run no task over about 10 ms. */
  quietMs: number;
  /** Run at the latest this long after the watch starts, quiet or not. */
  latestMs: number;
}

/** How often the watch looks at the clock, and how late a look may be before the main thread counts as busy. */
const PROBE_MS = 50;
const LATE_MS = 10;

/**
 * Runs `task` once, when the start-up has settled: `quietMs` in which nothing was held (see `holdStartUp`) and the
 * main thread ran no task longer than about 10 ms, at the latest after `latestMs`, and at once if the page is
 * hidden first. Busy time shows as a look at the clock (every 50 ms) that comes late, and as the browser's
 * long-task reports where it makes them (tasks over 50 ms). Returns a cancel function.
 */
export function settleWatch(env: SettleEnv, task: () => void, options: SettleOptions): () => void {
  let lastBusy = env.now();
  let done = false;
  let cancelProbe = () => {};
  const stops: Array<() => void> = [() => cancelProbe()];
  const finish = (how: 'idle' | 'now') => {
    if (done) return;
    done = true;
    stops.forEach((stop) => stop());
    stops.length = 0;
    if (how === 'now') task();
    else stops.push(env.idle(task));
  };
  const probe = (due: number) => {
    if (done) return;
    const at = env.now();
    if (at - due > LATE_MS || env.held()) lastBusy = at;
    if (at - lastBusy >= options.quietMs) finish('idle');
    else cancelProbe = env.after(() => probe(at + PROBE_MS), PROBE_MS);
  };
  if (env.onLongTask) stops.push(env.onLongTask((end) => { lastBusy = Math.max(lastBusy, end); }));
  stops.push(env.onHidden(() => finish('now')));
  stops.push(env.after(() => finish('idle'), options.latestMs));
  const first = env.now() + PROBE_MS;
  cancelProbe = env.after(() => probe(first), PROBE_MS);
  return () => {
    done = true;
    stops.forEach((stop) => stop());
  };
}

function browserSettleEnv(): SettleEnv {
  const longTasks = typeof PerformanceObserver !== 'undefined' && (PerformanceObserver.supportedEntryTypes ?? []).includes('longtask');
  return {
    now: () => performance.now(),
    after: (fn, ms) => {
      const id = setTimeout(fn, ms);
      return () => clearTimeout(id);
    },
    onLongTask: longTasks
      ? (fn) => {
          const observer = new PerformanceObserver((list) => list.getEntries().forEach((e) => fn(e.startTime + e.duration)));
          observer.observe({ type: 'longtask' });
          return () => observer.disconnect();
        }
      : null,
    onHidden: (fn) => {
      const onChange = () => document.visibilityState === 'hidden' && fn();
      document.addEventListener('visibilitychange', onChange);
      return () => document.removeEventListener('visibilitychange', onChange);
    },
    idle: (fn) => whenIdle(fn, 2000),
    held: startUpHeld,
  };
}

/**
 * Runs `task` after the page has loaded and the first screen has settled (its data read and its charts drawn,
 * then a second in which the main thread ran no task over about 10 ms; at the latest ten seconds after load), or
 * at once when the app goes to the background. For work that competes with the start-up for a phone's few cores
 * but is not needed by it, such as downloading and storing the offline copy of the app.
 */
export function afterStartUp(task: () => void, options: SettleOptions = { quietMs: 1000, latestMs: 10_000 }): void {
  whenLoaded(() => void settleWatch(browserSettleEnv(), task, options));
}
