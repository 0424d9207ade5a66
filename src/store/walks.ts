// Diagnosis walks: kept as they go, attached to a visit (the one given, the one they had, or the open one).
import { walkProblems, type WalkRecord } from '../records';
import type { Store, StoreContext } from './api';
import { guard, StoreError } from './errors';
import { newId, nowIso } from './ids';
import { currentVisitIn } from './visits';

export function walkMethods({ db }: StoreContext): Pick<Store, 'saveWalk' | 'getWalk' | 'listWalks' | 'latestInProgressWalk'> {
  return {
    saveWalk: (walk) =>
      guard('keep the diagnosis walk', async () => {
        const tx = db.transaction(['walks', 'visits', 'currentVisits'], 'readwrite');
        const was = walk.id ? await tx.objectStore('walks').get(walk.id) : undefined;
        const now = nowIso();
        let visitId = walk.visitId ?? was?.visitId;
        if (!visitId && walk.instrumentId) visitId = (await currentVisitIn(tx, walk.instrumentId))?.id;
        const record: WalkRecord = {
          ...walk,
          id: walk.id ?? newId('walk'),
          ...(visitId ? { visitId } : {}),
          startedAt: was?.startedAt ?? walk.startedAt ?? now,
          updatedAt: now,
        };
        if (record.visitId === undefined) delete record.visitId;
        const problems = walkProblems('walk', record);
        if (problems.length) throw new StoreError(`Could not keep the diagnosis walk: ${problems.join('; ')}.`);
        await tx.objectStore('walks').put(record);
        await tx.done;
        return record;
      }),

    getWalk: (id) => guard('read the diagnosis walk', () => db.get('walks', id)),

    listWalks: (visitId) =>
      guard('read the diagnosis walks', async () =>
        (await db.getAllFromIndex('walks', 'byVisit', visitId)).sort((a, b) => (a.startedAt < b.startedAt ? -1 : 1))),

    latestInProgressWalk: (filter = {}) =>
      guard('read the diagnosis walks', async () => {
        const all = filter.visitId ? await db.getAllFromIndex('walks', 'byVisit', filter.visitId) : await db.getAll('walks');
        let best: WalkRecord | undefined;
        for (const w of all) {
          if (w.status !== 'in-progress') continue;
          if (filter.instrumentId && w.instrumentId !== filter.instrumentId) continue;
          if (!best || w.updatedAt > best.updatedAt) best = w;
        }
        return best;
      }),
  };
}
