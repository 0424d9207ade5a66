import { describe, expect, it } from 'vitest';
import { lazy } from '../../../src/ui/lazy';

describe('lazy (code loaded on first use)', () => {
  it('loads once for any number of asks, and has the value at hand once loaded', async () => {
    let loads = 0;
    const code = lazy(async () => ++loads);
    expect(code.now()).toBeNull();
    const [a, b] = await Promise.all([code.get(), code.get()]);
    expect([a, b, loads]).toEqual([1, 1, 1]);
    expect(code.now()).toBe(1);
    expect(await code.get()).toBe(1);
    expect(loads).toBe(1);
  });

  it('forgets a failed load, so a later ask tries again', async () => {
    let loads = 0;
    const code = lazy(async () => {
      loads++;
      if (loads === 1) throw new Error('offline');
      return 'trees';
    });
    await expect(code.get()).rejects.toThrow('offline');
    expect(code.now()).toBeNull();
    expect(await code.get()).toBe('trees');
    expect(loads).toBe(2);
  });
});
