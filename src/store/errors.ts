/** A storage failure, with a sentence fit to show the user. The original error is kept for the console. */
export class StoreError extends Error {
  readonly userMessage: string;
  override readonly cause: unknown;
  constructor(userMessage: string, cause?: unknown) {
    super(userMessage);
    this.name = 'StoreError';
    this.userMessage = userMessage;
    this.cause = cause;
  }
}

/** Turn whatever IndexedDB threw into a plain message. Input on screen is never cleared by the caller. */
export function describeStorageError(action: string, err: unknown): StoreError {
  if (err instanceof StoreError) return err;
  const name = (err as { name?: string } | null)?.name ?? '';
  if (name === 'QuotaExceededError') {
    return new StoreError(
      `Could not ${action}: this device has no storage space left for Rodside. Free some space or export a backup and remove old visits, then try again. What you typed is still here.`,
      err,
    );
  }
  if (name === 'InvalidStateError' || name === 'TransactionInactiveError') {
    return new StoreError(`Could not ${action}: the database was closed, probably because Rodside was updated in another tab. Reload this tab; what you typed is kept as a draft.`, err);
  }
  if (name === 'VersionError') {
    return new StoreError(`Could not ${action}: this tab runs an older version of Rodside than the data on this device. Reload to get the newer version.`, err);
  }
  const detail = err instanceof Error ? err.message : String(err);
  return new StoreError(`Could not ${action}: the device refused to save (${detail || name || 'unknown error'}). What you typed is still here; try again.`, err);
}

/** Run a storage action; whatever it throws reaches the caller as a StoreError with a sentence for the user. */
export async function guard<T>(action: string, fn: () => Promise<T>): Promise<T> {
  try {
    return await fn();
  } catch (err) {
    throw describeStorageError(action, err);
  }
}

/**
 * Abort a transaction that may already be finished; its `done` then rejects with the abort, which is expected.
 * The promise settles when the roll-back has finished (await it before reporting the error that caused it).
 */
export function abortQuietly(tx: { abort(): void; done: Promise<void> }): Promise<void> {
  const settled = tx.done.then(
    () => undefined,
    (e: unknown) => {
      if ((e as { name?: string } | null)?.name !== 'AbortError') console.error('Rodside: a transaction failed while being aborted', e);
    },
  );
  try {
    tx.abort();
  } catch {
    // Already committed or aborted: there is nothing left to undo.
  }
  return settled;
}
