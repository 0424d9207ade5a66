// "Note this": a value from any screen lands in the instrument's current visit, in ONE transaction. Either the
// visit (found or opened), the current-visit mark and the judged reading are all written, or nothing is.
import { allTypes, notedReading, noteProblem, noteVisitFields, recentVisitForNote } from '../records';
import type { Store, StoreContext } from './api';
import { abortQuietly, guard, StoreError } from './errors';
import { ownTypesIn, setCurrentVisitIn } from './marks';
import { addReadingIn } from './readings';
import { currentVisitIn, saveVisitIn } from './visits';

const noteStores = ['currentVisits', 'visits', 'instruments', 'readings', 'ownTypes', 'makerLimits'] as const;

export function noteMethods({ db, engine }: StoreContext): Pick<Store, 'noteReading'> {
  return {
    noteReading: (instrument, note) =>
      guard('note the value', async () => {
        const problem = noteProblem(note);
        if (problem) throw new StoreError(problem);
        const now = new Date();
        const tx = db.transaction([...noteStores], 'readwrite');
        try {
          let visit = await currentVisitIn(tx, instrument.id);
          visit ??= recentVisitForNote(await tx.objectStore('visits').index('byInstrument').getAll(instrument.id), now);
          visit ??= await saveVisitIn(tx, noteVisitFields(instrument.id, now));
          await setCurrentVisitIn(tx, instrument.id, visit.id);
          const typed = notedReading(note, allTypes(await ownTypesIn(tx)));
          const saved = await addReadingIn(tx, { ...typed, visitId: visit.id }, engine);
          await tx.done;
          return { visitLabel: `the visit of ${visit.startedAt.slice(0, 10)}`, reading: saved.reading, visit: saved.visit };
        } catch (err) {
          // IndexedDB commits what was written once nothing is pending: a failure part-way must abort by hand.
          abortQuietly(tx);
          throw err;
        }
      }),
  };
}
