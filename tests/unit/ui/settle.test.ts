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
  return {
    env,
    /** Moves the clock to `to` with the main thread free: timers fire on time, in order. */
    advance(to: number) {
      for (let t = due(to); t; t = due(to)) {
        clock = Math.max(clock, t.at);
        fire(t);
      }
      clock = to;
      timers = timers.filter((t) => t.live);
    },
    /** The main thread runs a task from `start` for `duration` ms: timers due meanwhile fire at its end. */
    task(start: number, duration: number) {
      this.advance(start);
      clock = start + duration;
      for (let t = due(clock); t; t = due(clock)) fire(t);
      // The browser reports tasks over 50 ms, after they end.
      if (duration > 50) longTaskListeners.forEach((fn) => fn(start + duration));
    },
    hide: () => hiddenListeners.forEach((fn) => fn()),
    hold: (on: boolean) => { held = on; },
    /** The browser becomes idle: queued idle work runs. */
    idle() {
      const q = idleQueue;
      idleQueue = [];
      q.filter((t) => t.live).forEach((t) => t.fn());
    },
    listeners: () => longTaskListeners.size + hiddenListeners.size,
    liveTimers: () => timers.filter((t) => t.live).length,
  };
}

describe('settleWatch (work that waits for the start-up to settle)', () => {
  const options = { quietMs: 1000, latestMs: 10_000 };

  it('runs in idle time once the main thread has gone a second without a task over about 10 ms', () => {
    const b = fakeBrowser();
    let runs = 0;
    settleWatch(b.env, () => runs++, options);
    b.task(300, 80); // the first screen's render: a long task
    b.task(1210, 40); // a chart drawn: not a long task to the browser, but busy; ends at 1250
    b.advance(2200);
    b.idle();
    expect(runs).toBe(0); // under a second since the chart
    b.advance(2300);
    b.idle();
    expect(runs).toBe(1);
    b.advance(20_000);
    b.idle();
    expect(runs).toBe(1);
    expect(b.listeners()).toBe(0);
    expect(b.liveTimers()).toBe(0);
  });

  it('counts a long task the browser reports even when it barely delayed a look at the clock', () => {
    const b = fakeBrowser();
    let runs = 0;
    settleWatch(b.env, () => runs++, options);
    b.task(400, 55); // the look due at 450 comes 5 ms late; the browser reports the task, ending at 455
    b.advance(1400);
    b.idle();
    expect(runs).toBe(0);
    b.advance(1500);
    b.idle();
    expect(runs).toBe(1);
  });

  it('lets short tasks pass (under about 10 ms)', () => {
    const b = fakeBrowser();
    let runs = 0;
    settleWatch(b.env, () => runs++, options);
    for (let t = 20; t < 1000; t += 100) b.task(t + 45, 8);
    b.advance(1100);
    b.idle();
    expect(runs).toBe(1);
  });

  it('runs at the latest after latestMs when the page never goes quiet', () => {
    const b = fakeBrowser();
    let runs = 0;
    settleWatch(b.env, () => runs++, options);
    for (let t = 0; t < 12_000; t += 500) b.task(t + 10, 30);
    b.idle();
    expect(runs).toBe(1);
  });

  it('runs at once when the page is hidden first (the app sent to the background)', () => {
    const b = fakeBrowser();
    let runs = 0;
    settleWatch(b.env, () => runs++, options);
    b.task(100, 200);
    b.hide();
    expect(runs).toBe(1);
    b.hide();
    b.advance(20_000);
    b.idle();
    expect(runs).toBe(1);
  });

  it('still sees busy time where the browser reports no long tasks (WebKit)', () => {
    const b = fakeBrowser(false);
    let runs = 0;
    settleWatch(b.env, () => runs++, options);
    b.task(500, 120);
    b.advance(1500);
    b.idle();
    expect(runs).toBe(0);
    b.advance(1700);
    b.idle();
    expect(runs).toBe(1);
  });

  it('waits while the first screen holds the start-up (its data on the way), then for a quiet second', () => {
    const b = fakeBrowser();
    let runs = 0;
    settleWatch(b.env, () => runs++, options);
    b.hold(true); // the database opening, the main thread idle meanwhile
    b.advance(3000);
    b.idle();
    expect(runs).toBe(0);
    b.hold(false);
    b.advance(3990);
    b.idle();
    expect(runs).toBe(0);
    b.advance(4100);
    b.idle();
    expect(runs).toBe(1);
  });

  it('does nothing once cancelled', () => {
    const b = fakeBrowser();
    let runs = 0;
    const cancel = settleWatch(b.env, () => runs++, options);
    cancel();
    b.hide();
    b.advance(20_000);
    b.idle();
    expect(runs).toBe(0);
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
