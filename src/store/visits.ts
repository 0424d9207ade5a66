// Visits: create, change, delete with everything hanging off them (and put back), the baseline mark, and the
// instrument's open visit (the "current visit" mark that "Note this" and the Visits screen use).
import type { IDBPTransaction, StoreNames } from 'idb';
import { pickBaselineVisit, visitProblems, type Visit, type VisitFields } from '../records';
import type { Store, StoreContext, VisitBundle } from './api';
import { guard, StoreError } from './errors';
import { nowIso, stamp } from './ids';
import { currentVisitIdIn, setCurrentVisitIn } from './marks';
import type { RodsideSchema } from './schema';

type Names = StoreNames<RodsideSchema>;
// Transactions are typed over every store: idb's types do not let a transaction over more stores stand in for one
// over fewer, so each helper says in words which stores it needs.
/** A read-write transaction. */
export type WriteTx = IDBPTransaction<RodsideSchema, Names[], 'readwrite'>;
/** Any transaction. */
export type ReadTx = IDBPTransaction<RodsideSchema, Names[], IDBTransactionMode>;

/** Delete a visit with its readings and walks inside the caller's transaction; returns what went, for undo. */
export async function deleteVisitIn(tx: WriteTx, visit: Visit): Promise<VisitBundle> {
  const readings = await tx.objectStore('readings').index('byVisit').getAll(visit.id);
  const walks = await tx.objectStore('walks').index('byVisit').getAll(visit.id);
  for (const r of readings) await tx.objectStore('readings').delete(r.id);
  for (const w of walks) await tx.objectStore('walks').delete(w.id);
  await tx.objectStore('visits').delete(visit.id);
  return { visit, readings, walks };
}

/** Put a visit back with its readings and walks, inside the caller's transaction. */
export async function putBundle(tx: WriteTx, b: VisitBundle): Promise<void> {
  await tx.objectStore('visits').put(b.visit);
  for (const r of b.readings) await tx.objectStore('readings').put(r);
  for (const w of b.walks) await tx.objectStore('walks').put(w);
}

/** Create (no id) or update a visit inside the caller's transaction; the baseline mark and demo flag are kept. */
export async function saveVisitIn(tx: WriteTx, fields: VisitFields, id?: string): Promise<Visit> {
  const existing = id ? await tx.objectStore('visits').get(id) : undefined;
  if (id && !existing) throw new StoreError(`Could not save: the visit ${id} no longer exists.`);
  if (!(await tx.objectStore('instruments').get(fields.instrumentId))) {
    throw new StoreError('Could not save the visit: its instrument profile no longer exists.');
  }
  if (existing && existing.instrumentId !== fields.instrumentId) {
    throw new StoreError('Could not save the visit: a visit cannot move to another instrument (its readings belong to the first).');
  }
  const record: Visit = {
    ...fields,
    ...stamp('visit', existing),
    ...(existing?.baseline ? { baseline: true } : {}),
    ...(existing?.demo ? { demo: true } : {}),
  };
  const problems = visitProblems('visit', record);
  if (problems.length) throw new StoreError(`Could not save the visit: ${problems.join('; ')}.`);
  await tx.objectStore('visits').put(record);
  return record;
}

/** The instrument's open visit, read inside the caller's transaction (a stale or foreign mark gives undefined). */
export async function currentVisitIn(tx: ReadTx, instrumentId: string): Promise<Visit | undefined> {
  const id = await currentVisitIdIn(tx, instrumentId);
  const v = id ? await tx.objectStore('visits').get(id) : undefined;
  return v && v.instrumentId === instrumentId ? v : undefined;
}

/** Set or clear the baseline mark of one visit; one baseline per instrument. */
async function markBaselineIn(tx: WriteTx, visitId: string, on: boolean): Promise<Visit> {
  const store = tx.objectStore('visits');
  const v = await store.get(visitId);
  if (!v) throw new StoreError(`Could not mark the baseline: the visit ${visitId} no longer exists.`);
  const now = nowIso();
  if (on) {
    // Later readings compare with this visit's as-left values: any earlier mark on the instrument goes.
    for (const other of await store.index('byInstrument').getAll(v.instrumentId)) {
      if (other.baseline && other.id !== visitId) {
        const next = { ...other, updatedAt: now };
        delete next.baseline;
        await store.put(next);
      }
    }
  }
  const next: Visit = { ...v, updatedAt: now };
  if (on) next.baseline = true;
  else delete next.baseline;
  await store.put(next);
  return next;
}

type VisitMethods = 'listVisits' | 'getVisit' | 'saveVisit' | 'deleteVisit' | 'restoreVisit' | 'markBaseline' | 'getBaseline' | 'setCurrentVisit' | 'currentVisit';

export function visitMethods({ db }: StoreContext): Pick<Store, VisitMethods> {
  return {
    listVisits: (instrumentId) =>
      guard('read the visits', async () => {
        const list = instrumentId ? await db.getAllFromIndex('visits', 'byInstrument', instrumentId) : await db.getAll('visits');
        return list.sort((a, b) => (a.startedAt < b.startedAt ? 1 : a.startedAt > b.startedAt ? -1 : 0));
      }),
    getVisit: (id) => guard('read the visit', () => db.get('visits', id)),
    saveVisit: (fields, id) =>
      guard('save the visit', async () => {
        const tx = db.transaction(['visits', 'instruments'], 'readwrite');
        const record = await saveVisitIn(tx, fields, id);
        await tx.done;
        return record;
      }),
    deleteVisit: (id) =>
      guard('delete the visit', async () => {
        const tx = db.transaction(['visits', 'readings', 'walks'], 'readwrite');
        const v = await tx.objectStore('visits').get(id);
        const bundle = v ? await deleteVisitIn(tx, v) : undefined;
        await tx.done;
        return bundle;
      }),
    restoreVisit: (bundle) =>
      guard('restore the visit', async () => {
        const tx = db.transaction(['visits', 'readings', 'walks'], 'readwrite');
        await putBundle(tx, bundle);
        await tx.done;
      }),
    markBaseline: (visitId, on = true) =>
      guard('mark the baseline', async () => {
        const tx = db.transaction(['visits'], 'readwrite');
        const next = await markBaselineIn(tx, visitId, on);
        await tx.done;
        return next;
      }),
    getBaseline: (instrumentId) =>
      guard('read the baseline', async () => {
        const tx = db.transaction(['visits', 'readings'], 'readonly');
        const visit = pickBaselineVisit(await tx.objectStore('visits').index('byInstrument').getAll(instrumentId));
        const readings = visit ? (await tx.objectStore('readings').index('byVisit').getAll(visit.id)).filter((r) => r.phase === 'as-left') : [];
        await tx.done;
        return visit ? { visit, readings } : undefined;
      }),
    setCurrentVisit: (instrumentId, visitId) =>
      guard('remember the open visit', async () => {
        const tx = db.transaction(['currentVisits'], 'readwrite');
        await setCurrentVisitIn(tx, instrumentId, visitId);
        await tx.done;
      }),
    currentVisit: (instrumentId) =>
      guard('read the open visit', async () => {
        const tx = db.transaction(['currentVisits', 'visits'], 'readonly');
        const v = await currentVisitIn(tx, instrumentId);
        await tx.done;
        return v;
      }),
  };
}
