// Work that can wait until the browser has nothing better to do: after the first paint, in idle time.
// requestIdleCallback where the browser has it; a short timeout elsewhere (WebKit has no requestIdleCallback).

type IdleWindow = Window & {
  requestIdleCallback?: (cb: () => void, opts?: { timeout: number }) => number;
  cancelIdleCallback?: (id: number) => void;
};

/**
 * Runs `task` in idle time, at the latest after `timeoutMs`. Returns a cancel function.
 * Each call is its own task, so heavy pieces scheduled separately never add up to one long task.
 */
export function whenIdle(task: () => void, timeoutMs = 2000): () => void {
  const w = globalThis as unknown as IdleWindow;
  if (typeof w.requestIdleCallback === 'function') {
    const id = w.requestIdleCallback(task, { timeout: timeoutMs });
    return () => w.cancelIdleCallback?.(id);
  }
  const id = setTimeout(task, Math.min(timeoutMs, 50));
  return () => clearTimeout(id);
}

/** Runs `task` in idle time after the page has loaded (the first paint is done by then). */
export function afterLoad(task: () => void, timeoutMs = 4000): void {
  const start = () => whenIdle(task, timeoutMs);
  if (document.readyState === 'complete') start();
  else window.addEventListener('load', start, { once: true });
}

/** What `settleWatch` needs from the browser: given as functions so a test can drive it without a clock. */
export interface SettleEnv {
  now(): number;
  /** Calls `fn` after `ms`; returns a cancel function. */
  after(fn: () => void, ms: number): () => void;
  /** Calls `fn` with each long task's end time (in `now()` time); returns a stop function. Null: not observable. */
  onLongTask: ((fn: (end: number) => void) => () => void) | null;
  /** Calls `fn` when the page is hidden (the app sent to the background); returns a stop function. */
  onHidden(fn: () => void): () => void;
  /** Runs `fn` in idle time; returns a cancel function. */
  idle(fn: () => void): () => void;
}

export interface SettleOptions {
  /** How long the main thread must go without a long task. */
  quietMs: number;
  /** Run at the latest this long after the watch starts, quiet or not. */
  latestMs: number;
}

/**
 * Runs `task` once, when the start-up has settled: `quietMs` without a long task on the main thread (where the
 * browser reports long tasks; elsewhere `quietMs` after the start), at the latest after `latestMs`, and at once if
 * the page is hidden first. Returns a cancel function.
 */
export function settleWatch(env: SettleEnv, task: () => void, options: SettleOptions): () => void {
  let lastBusy = env.now();
  let done = false;
  const stops: Array<() => void> = [];
  const finish = (how: 'idle' | 'now') => {
    if (done) return;
    done = true;
    stops.forEach((stop) => stop());
    if (how === 'now') task();
    else stops.push(env.idle(task));
  };
  const check = () => {
    if (done) return;
    const quietFor = env.now() - lastBusy;
    if (quietFor >= options.quietMs) finish('idle');
    else stops.push(env.after(check, options.quietMs - quietFor));
  };
  if (env.onLongTask) stops.push(env.onLongTask((end) => { lastBusy = Math.max(lastBusy, end); }));
  stops.push(env.onHidden(() => finish('now')));
  stops.push(env.after(() => finish('idle'), options.latestMs));
  stops.push(env.after(check, options.quietMs));
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
  };
}

/**
 * Runs `task` after the page has loaded and the first screen has settled (its data read, its charts drawn: a
 * second without a long task, at the latest ten seconds after load), or at once when the app goes to the
 * background. For work that competes with the start-up for a phone's few cores but is not needed by it, such as
 * downloading and storing the offline copy of the app.
 */
export function afterStartUp(task: () => void, options: SettleOptions = { quietMs: 1000, latestMs: 10_000 }): void {
  const start = () => void settleWatch(browserSettleEnv(), task, options);
  if (document.readyState === 'complete') start();
  else window.addEventListener('load', start, { once: true });
}
