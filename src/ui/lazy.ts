// Code loaded on first use: a screen, the chart library, the diagnosis trees. One promise per module, kept once
// it has loaded; a failed load is forgotten, so a later use tries again (offline before the code was kept).

export interface Lazy<T> {
  /** The loaded value, loading it on the first call. */
  get(): Promise<T>;
  /** The value if it has loaded already, else null (to draw at once what is at hand). */
  now(): T | null;
}

export function lazy<T>(load: () => Promise<T>): Lazy<T> {
  let value: T | null = null;
  let pending: Promise<T> | null = null;
  return {
    get: () => (pending ??= load().then((v) => (value = v)).catch((err: unknown) => {
      pending = null;
      throw err;
    })),
    now: () => value,
  };
}
