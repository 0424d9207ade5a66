// Long work in pieces: between two pieces the page gets to run (draw, take a tap). Used by the store's demo
// loading and by screens that compute in steps. No DOM: scheduler.yield where the browser has it, else a
// MessageChannel message (a new task, not a microtask; not a timer, which tests may fake).

/** Resolves in a new task, after whatever the page has queued meanwhile. */
export function nextTask(): Promise<void> {
  const scheduler = (globalThis as { scheduler?: { yield?: () => Promise<void> } }).scheduler;
  if (typeof scheduler?.yield === 'function') return scheduler.yield();
  if (typeof MessageChannel === 'function') {
    return new Promise((resolve) => {
      const channel = new MessageChannel();
      channel.port1.onmessage = () => {
        channel.port1.close();
        resolve();
      };
      channel.port2.postMessage(null);
    });
  }
  return new Promise((resolve) => setTimeout(resolve, 0));
}

/** Runs a stepped computation to its end, one step per task (the first one too), and returns its result. */
export async function runInSteps<T>(steps: Generator<unknown, T, void>): Promise<T> {
  for (;;) {
    await nextTask();
    const r = steps.next();
    if (r.done) return r.value;
  }
}
