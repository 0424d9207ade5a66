// Deleting an instrument with everything it has, and undoing that, also after a reload: the copy of what was
// deleted is kept in the undoCopies store for INSTRUMENT_UNDO_WINDOW_MS or until the next deletion.
import type { Store, StoreContext, DeletedInstrument, VisitBundle } from './api';
import { INSTRUMENT_UNDO_WINDOW_MS } from './api';
import { guard } from './errors';
import { nowIso } from './ids';
import type { UndoCopyRecord } from './schema';
import { deleteVisitIn, putBundle } from './visits';

/** Is a kept copy still within its undo window at `now`? */
function live(copy: UndoCopyRecord, now: Date): boolean {
  const at = Date.parse(copy.deletedAt);
  return Number.isFinite(at) && now.getTime() - at <= INSTRUMENT_UNDO_WINDOW_MS;
}

function offerOf(copy: UndoCopyRecord): DeletedInstrument {
  return {
    profile: copy.profile,
    deletedAt: copy.deletedAt,
    visits: copy.bundles.length,
    readings: copy.bundles.reduce((n, b) => n + b.readings.length, 0),
    walks: copy.bundles.reduce((n, b) => n + b.walks.length, 0),
  };
}

export function undoMethods({ db }: StoreContext): Pick<Store, 'deleteInstrument' | 'restoreInstrument' | 'deletedInstrument'> {
  return {
    deleteInstrument: (id) =>
      guard('delete the instrument profile', async () => {
        // Its visits, readings and walks go with it (a visit without its instrument cannot be restored from a
        // backup). The copy is written in the same transaction; the previous deletion's copy goes now (one undo at a time).
        const tx = db.transaction(['instruments', 'visits', 'readings', 'walks', 'undoCopies'], 'readwrite');
        const existing = await tx.objectStore('instruments').get(id);
        if (existing) {
          const bundles: VisitBundle[] = [];
          for (const v of await tx.objectStore('visits').index('byInstrument').getAll(id)) bundles.push(await deleteVisitIn(tx, v));
          await tx.objectStore('instruments').delete(id);
          await tx.objectStore('undoCopies').clear();
          await tx.objectStore('undoCopies').put({ instrumentId: id, profile: existing, bundles, deletedAt: nowIso() });
        }
        await tx.done;
        return existing;
      }),

    restoreInstrument: (profile) =>
      guard('restore the instrument profile', async () => {
        const tx = db.transaction(['instruments', 'visits', 'readings', 'walks', 'undoCopies'], 'readwrite');
        const copy = await tx.objectStore('undoCopies').get(profile.id);
        await tx.objectStore('instruments').put(profile);
        for (const b of copy?.bundles ?? []) await putBundle(tx, b);
        await tx.objectStore('undoCopies').delete(profile.id);
        await tx.done;
      }),

    deletedInstrument: (now = new Date()) =>
      guard('read the deleted instrument', async () => {
        const tx = db.transaction(['undoCopies', 'instruments'], 'readwrite');
        let found: DeletedInstrument | undefined;
        for (const copy of await tx.objectStore('undoCopies').getAll()) {
          // An instrument of that id made again since (e.g. from a backup) makes the copy moot: never overwrite it.
          const back = live(copy, now) ? await tx.objectStore('instruments').get(copy.instrumentId) : undefined;
          if (!live(copy, now) || back) await tx.objectStore('undoCopies').delete(copy.instrumentId);
          else found = offerOf(copy);
        }
        await tx.done;
        return found;
      }),
  };
}
