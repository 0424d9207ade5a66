// The one way unit and component tests wait: for a condition, never for a count of ticks or a fixed sleep.
// The condition is tried again after each turn of the event loop (inside Preact's act(), so renders and effects
// are flushed) until it returns a truthy value without throwing, or the time limit passes. A condition may throw
// (an `expect`): the last error is quoted in the timeout message, so a failure says what was still wrong.
import { act } from 'preact/test-utils';

/** How long a condition may take before the test fails: generous, as the suite also has to pass on a loaded machine. */
export const WAIT_LIMIT_MS = 20_000;

function nextTurn(): Promise<void> {
  // One turn of the event loop, so IndexedDB callbacks (fake-indexeddb queues them with setImmediate) and due
  // timers get to run. setImmediate, not setTimeout: a test that fakes the timers can still wait for the store.
  return new Promise((resolve) => (typeof setImmediate === 'function' ? setImmediate(resolve) : setTimeout(resolve, 0)));
}

/**
 * Wait until `condition()` returns a truthy value (or a promise of one) without throwing, and return that value.
 * `what` names the condition in the timeout message ("the restore offer to disappear").
 * Call it outside act(): inside one, Preact holds every render until that act ends, so the wait could never end.
 */
export async function waitFor<T>(condition: () => T | Promise<T>, what = 'the condition', limitMs = WAIT_LIMIT_MS): Promise<NonNullable<T>> {
  const started = Date.now();
  let lastError: unknown = null;
  let lastValue: unknown;
  for (;;) {
    try {
      const value = await condition();
      if (value) return value as NonNullable<T>;
      lastValue = value;
      lastError = null;
    } catch (err) {
      lastError = err;
    }
    if (Date.now() - started > limitMs) {
      const detail = lastError ? `last error: ${lastError instanceof Error ? lastError.message : String(lastError)}` : `last value: ${String(lastValue)}`;
      throw new Error(`waitFor: timed out after ${limitMs} ms waiting for ${what} (${detail})`);
    }
    await act(async () => {
      await nextTurn();
    });
  }
}
