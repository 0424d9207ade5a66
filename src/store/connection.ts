// The open database, with every transaction it starts kept track of until it ends, so that a page going into the
// browser's back/forward cache can let go of them. Seen in WebKit: a page frozen in that cache with a transaction
// still running holds it for good (a read, or the write that marks the visit in use), and every later page of
// Rodside that touches those stores waits forever. A frozen page cannot finish its transactions anyway, so they
// are aborted when it is put away; reads are safe to abort (the page reads again when shown).
import type { IDBPDatabase, IDBPTransaction, StoreNames } from 'idb';
import type { RodsideSchema } from './schema';

type Db = IDBPDatabase<RodsideSchema>;
type AnyTx = IDBPTransaction<RodsideSchema, StoreNames<RodsideSchema>[], IDBTransactionMode>;

/** idb's shortcut methods (db.get, db.getAllFromIndex, db.put, …) open their transaction through `this`. */
const SHORTCUT = /^(get|getKey|getAll|getAllKeys|count|put|add|delete|clear)(FromIndex)?$/;

export interface TrackedDb {
  db: Db;
  /** Abort the running read-only transactions, and with `writes` the read-write ones too; returns how many. */
  abortRunning(writes: boolean): number;
}

export function tracked(raw: Db): TrackedDb {
  const open = new Set<AnyTx>();
  const db = new Proxy(raw, {
    get(target, prop, receiver) {
      if (prop === 'transaction') {
        return (...args: Parameters<Db['transaction']>) => {
          const tx = (target.transaction as (...a: unknown[]) => AnyTx)(...args);
          open.add(tx);
          const end = (): void => void open.delete(tx);
          tx.done.then(end, end);
          return tx;
        };
      }
      const value: unknown = Reflect.get(target, prop);
      if (typeof value !== 'function') return value;
      // Shortcuts run with this proxy as `this`, so their transaction is tracked too; all else on the real one.
      return (...args: unknown[]) => (value as (...a: unknown[]) => unknown).apply(typeof prop === 'string' && SHORTCUT.test(prop) ? receiver : target, args);
    },
  });
  return {
    db,
    abortRunning: (writes) => {
      let n = 0;
      for (const tx of open) {
        if (tx.mode !== 'readonly' && !writes) continue;
        try {
          tx.abort();
          n++;
        } catch {
          // Already finishing: nothing to let go of.
        }
        open.delete(tx);
      }
      return n;
    },
  };
}
