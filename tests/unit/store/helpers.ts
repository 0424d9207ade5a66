// Shared by the store tests: a fresh database name per test, deleted afterwards, and a full dump.
import { afterEach } from 'vitest';
import { eraseStore, type Store } from '../../../src/store';

const names: string[] = [];
let counter = 0;

export function freshName(): string {
  const n = `rodside-test-${Date.now()}-${counter++}-${Math.random().toString(36).slice(2, 8)}`;
  names.push(n);
  return n;
}

export function registerCleanup(): void {
  afterEach(async () => {
    while (names.length) await eraseStore(names.pop()!);
  });
}

/** Every record in every store, sorted by key: two equal dumps mean the database did not change. */
export async function dump(store: Store): Promise<Record<string, unknown[]>> {
  const out: Record<string, unknown[]> = {};
  for (const s of ['instruments', 'visits', 'readings', 'walks', 'settings', 'drafts', 'makerLimits', 'ownTypes', 'currentVisits', 'undoCopies'] as const) {
    out[s] = await store.db.getAll(s);
  }
  return out;
}

/** V zero-to-peak at the apex, 0.072218·M·r0²·f² with r0 in mm and f in MHz (q = 4eV/(m r0²Ω²) at the apex q = 0.706: Dawson, Quadrupole Mass Spectrometry and Its Applications, 1976,
 * CODATA 2018 constants, computed). Stands in for the engine in tests so the store is tested on its own. */
export const testEngine = {
  rfForMass: ({ mz, r0, frequency }: { mz: number; r0: number; frequency: number }) => 0.072218 * mz * (r0 * 1e3) ** 2 * (frequency / 1e6) ** 2,
};
