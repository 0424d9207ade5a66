import { describe, expect, it } from 'vitest';
import { settleWatch, type SettleEnv } from '../../../src/ui/idle';

/** A browser whose clock, timers, long tasks, visibility and idle time the test moves by hand. */
function fakeBrowser(longTasks = true) {
  let clock = 0;
  let timers: Array<{ at: number; fn: () => void; live: boolean }> = [];
  const longTaskListeners = new Set<(end: number) => void>();
  const hiddenListeners = new Set<() => void>();
  let idleQueue: Array<{ fn: () => void; live: boolean }> = [];
  const env: SettleEnv = {
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
  return {
    env,
    /** Moves the clock to `to`, firing the timers due on the way in order. */
    advance(to: number) {
      for (;;) {
        const due = timers.filter((t) => t.live && t.at <= to).sort((a, b) => a.at - b.at)[0];
        if (!due) break;
        clock = due.at;
        due.live = false;
        due.fn();
      }
      clock = to;
      timers = timers.filter((t) => t.live);
    },
    longTask(start: number, duration: number) {
      this.advance(start + duration);
      longTaskListeners.forEach((fn) => fn(start + duration));
    },
    hide: () => hiddenListeners.forEach((fn) => fn()),
    /** The browser becomes idle: queued idle work runs. */
    idle() {
      const q = idleQueue;
      idleQueue = [];
      q.filter((t) => t.live).forEach((t) => t.fn());
    },
    listeners: () => longTaskListeners.size + hiddenListeners.size,
  };
}

describe('settleWatch (work that waits for the start-up to settle)', () => {
  const options = { quietMs: 1000, latestMs: 10_000 };

  it('runs in idle time after a quiet second, counted from the last long task', () => {
    const b = fakeBrowser();
    let runs = 0;
    settleWatch(b.env, () => runs++, options);
    b.longTask(300, 80); // the first screen's render
    b.longTask(1200, 60); // a chart drawn, ending at 1260
    b.advance(2200);
    b.idle();
    expect(runs).toBe(0); // only 940 ms quiet
    b.advance(2260);
    expect(runs).toBe(0); // due, but waits for idle time
    b.idle();
    expect(runs).toBe(1);
    b.advance(20_000);
    b.idle();
    expect(runs).toBe(1);
    expect(b.listeners()).toBe(0);
  });

  it('runs at the latest after latestMs when the page never goes quiet', () => {
    const b = fakeBrowser();
    let runs = 0;
    settleWatch(b.env, () => runs++, options);
    for (let t = 0; t < 12_000; t += 500) b.longTask(t, 60);
    b.idle();
    expect(runs).toBe(1);
  });

  it('runs at once when the page is hidden first (the app sent to the background)', () => {
    const b = fakeBrowser();
    let runs = 0;
    settleWatch(b.env, () => runs++, options);
    b.longTask(100, 200);
    b.hide();
    expect(runs).toBe(1);
    b.hide();
    b.advance(20_000);
    b.idle();
    expect(runs).toBe(1);
  });

  it('waits quietMs from the start where long tasks cannot be observed', () => {
    const b = fakeBrowser(false);
    let runs = 0;
    settleWatch(b.env, () => runs++, options);
    b.advance(999);
    b.idle();
    expect(runs).toBe(0);
    b.advance(1000);
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
  });
});
