import { describe, expect, it } from 'vitest';
import { holdStartUp, settleWatch, startUpHeld, type SettleEnv } from '../../../src/ui/startUp';

/**
 * A browser whose clock, main thread, long-task reports, visibility and idle time the test moves by hand. A timer
 * due while the main thread runs a task fires when the task ends, late, as in a browser.
 */
function fakeBrowser(longTasks = true) {
  let clock = 0;
  let timers: Array<{ at: number; fn: () => void; live: boolean }> = [];
  const longTaskListeners = new Set<(end: number) => void>();
  const hiddenListeners = new Set<() => void>();
  let idleQueue: Array<{ fn: () => void; live: boolean }> = [];
  let held = false;
  const env: SettleEnv = {
    held: () => held,
    now: () => clock,
    after: (fn, ms) => {
      const t = { at: clock + ms, fn, live: true };
      timers.push(t);
      return () => { t.live = false; };
    },
    onLongTask: longTasks
      ? (fn) => {
          longTaskListeners.add(fn);
          return () => longTaskListeners.delete(fn);
        }
      : null,
    onHidden: (fn) => {
      hiddenListeners.add(fn);
      return () => hiddenListeners.delete(fn);
    },
    idle: (fn) => {
      const t = { fn, live: true };
      idleQueue.push(t);
      return () => { t.live = false; };
    },
  };
  const due = (to: number) => timers.filter((t) => t.live && t.at <= to).sort((a, b) => a.at - b.at)[0];
  const fire = (t: { fn: () => void; live: boolean }) => {
    t.live = false;
    t.fn();
  };
  /** Moves the clock to `to` with the main thread free: timers fire on time, in order. */
  const advance = (to: number) => {
    for (let t = due(to); t; t = due(to)) {
      clock = Math.max(clock, t.at);
      fire(t);
    }
    clock = to;
    timers = timers.filter((t) => t.live);
  };
  return {
    env,
    advance,
    /** The main thread runs a task from `start` for `duration` ms: timers due meanwhile fire at its end. */
    task(start: number, duration: number) {
      advance(start);
      clock = start + duration;
      for (let t = due(clock); t; t = due(clock)) fire(t);
      // The browser reports tasks over 50 ms, after they end.
      if (duration > 50) longTaskListeners.forEach((fn) => fn(start + duration));
    },
    hide: () => hiddenListeners.forEach((fn) => fn()),
    hold: (on: boolean) => { held = on; },
    /** The browser becomes idle: queued idle work runs. */
    idle: () => {
      const q = idleQueue;
      idleQueue = [];
      q.filter((t) => t.live).forEach((t) => t.fn());
    },
    listeners: () => longTaskListeners.size + hiddenListeners.size,
    liveTimers: () => timers.filter((t) => t.live).length,
  };
}

describe('settleWatch (work that waits for the start-up to settle)', () => {
  /** A fake browser with the watch started on it; `runsBy(t)` moves the clock to t, lets idle work run, and says
   * how many times the task has run by then. */
  function watched(longTasks = true) {
    const b = fakeBrowser(longTasks);
    let runs = 0;
    const cancel = settleWatch(b.env, () => runs++, { quietMs: 1000, latestMs: 10_000 });
    const runsBy = (t: number) => {
      b.advance(t);
      b.idle();
      return runs;
    };
    return { ...b, cancel, runsBy, runs: () => runs };
  }

  it('runs in idle time once the main thread has gone a second without a task over about 10 ms', () => {
    const b = watched();
    b.task(300, 80); // the first screen's render: a long task
    b.task(1210, 40); // a chart drawn: not a long task to the browser, but busy; ends at 1250
    expect(b.runsBy(2200)).toBe(0); // under a second since the chart
    expect(b.runsBy(2300)).toBe(1);
    expect(b.runsBy(20_000)).toBe(1);
    expect(b.listeners()).toBe(0);
    expect(b.liveTimers()).toBe(0);
  });

  it('counts a long task the browser reports even when it barely delayed a look at the clock', () => {
    const b = watched();
    b.task(400, 55); // the look due at 450 comes 5 ms late; the browser reports the task, ending at 455
    expect(b.runsBy(1400)).toBe(0);
    expect(b.runsBy(1500)).toBe(1);
  });

  it('lets short tasks pass (under about 10 ms)', () => {
    const b = watched();
    for (let t = 20; t < 1000; t += 100) b.task(t + 45, 8);
    expect(b.runsBy(1100)).toBe(1);
  });

  it('runs at the latest after latestMs when the page never goes quiet', () => {
    const b = watched();
    for (let t = 0; t < 12_000; t += 500) b.task(t + 10, 30);
    b.idle();
    expect(b.runs()).toBe(1);
  });

  it('runs at once when the page is hidden first (the app sent to the background)', () => {
    const b = watched();
    b.task(100, 200);
    b.hide();
    expect(b.runs()).toBe(1);
    b.hide();
    expect(b.runsBy(20_000)).toBe(1);
  });

  it('still sees busy time where the browser reports no long tasks (WebKit)', () => {
    const b = watched(false);
    b.task(500, 120);
    expect(b.runsBy(1500)).toBe(0);
    expect(b.runsBy(1700)).toBe(1);
  });

  it('waits while the first screen holds the start-up (its data on the way), then for a quiet second', () => {
    const b = watched();
    b.hold(true); // the database opening, the main thread idle meanwhile
    expect(b.runsBy(3000)).toBe(0);
    b.hold(false);
    expect(b.runsBy(3990)).toBe(0);
    expect(b.runsBy(4100)).toBe(1);
  });

  it('does nothing once cancelled', () => {
    const b = watched();
    b.cancel();
    b.hide();
    expect(b.runsBy(20_000)).toBe(0);
    expect(b.listeners()).toBe(0);
    expect(b.liveTimers()).toBe(0);
  });
});

describe('holdStartUp', () => {
  it('holds until every hold is released, each once', () => {
    expect(startUpHeld()).toBe(false);
    const releaseData = holdStartUp('data');
    const releaseChart = holdStartUp('chart');
    expect(startUpHeld()).toBe(true);
    releaseData();
    releaseData();
    expect(startUpHeld()).toBe(true);
    releaseChart();
    expect(startUpHeld()).toBe(false);
  });
});
