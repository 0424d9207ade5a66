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

/** Runs `task` once the page has loaded: at once if it has, else on the load event. */
export function whenLoaded(task: () => void): void {
  if (document.readyState === 'complete') task();
  else window.addEventListener('load', task, { once: true });
}

/** Runs `task` in idle time after the page has loaded (the first paint is done by then). */
export function afterLoad(task: () => void, timeoutMs = 4000): void {
  whenLoaded(() => whenIdle(task, timeoutMs));
}
