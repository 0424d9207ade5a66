// Readings: judged and saved with their visit touched in ONE transaction; listed, changed, deleted, put back.
import {
  allTypes, assess, expectationOf, judgeWithLimit, limitFor, withConventionCheck, withHistory, pickBaselineVisit, readingProblems, type EngineFunctions, type Reading, type ReadingType,
} from '../records';
import type { NewReading, Store, StoreContext } from './api';
import { guard, StoreError } from './errors';
import { newId, nowIso } from './ids';
import { makerLimitsIn, ownTypesIn } from './marks';
import type { ReadTx, WriteTx } from './visits';

type JudgeStores = 'visits' | 'instruments' | 'readings' | 'ownTypes' | 'makerLimits';

/** Everything needed to judge a reading of `typeId` on `visitId`, read inside the caller's transaction. */
export async function judgingContext(tx: ReadTx, visitId: string, typeId: string, context: Record<string, string | number> = {}) {
  const visit = await tx.objectStore('visits').get(visitId);
  if (!visit) throw new StoreError('Could not save the reading: its visit no longer exists.');
  const instrument = await tx.objectStore('instruments').get(visit.instrumentId);
  const type = allTypes(await ownTypesIn(tx)).find((t) => t.id === typeId);
  if (!type) throw new StoreError(`Could not save the reading: the reading type ${typeId} is not known here.`);
  const baselineVisit = pickBaselineVisit(await tx.objectStore('visits').index('byInstrument').getAll(visit.instrumentId));
  const baseline = baselineVisit
    ? { visit: baselineVisit, readings: (await tx.objectStore('readings').index('byVisit').getAll(baselineVisit.id)).filter((r) => r.typeId === typeId) }
    : undefined;
  const limit = limitFor(await makerLimitsIn(tx, visit.instrumentId), typeId, context);
  return { visit, instrument, type, baseline, limit };
}

function checkReading(r: Reading, type: ReadingType): void {
  const problems = readingProblems('reading', r);
  if (!(r.value >= type.plausible.min && r.value <= type.plausible.max)) problems.push(`value ${r.value} ${type.baseUnit} is outside ${type.plausible.min} to ${type.plausible.max}`);
  if (problems.length) throw new StoreError(`Could not save the reading: ${problems.join('; ')}.`);
}

/** Judge and save a new reading and touch its visit, inside the caller's transaction; returns both. */
export async function addReadingIn(tx: WriteTx, input: NewReading, engine: EngineFunctions | undefined) {
  const ctx = await judgingContext(tx, input.visitId, input.typeId, input.context ?? {});
  const now = nowIso();
  const judged = assess(ctx.type, ctx.instrument, input.visitId, input.value, input.context ?? {}, ctx.baseline, engine, ctx.limit);
  const reading: Reading = {
    id: newId('rdg'),
    visitId: input.visitId,
    instrumentId: ctx.visit.instrumentId,
    typeId: input.typeId,
    phase: input.phase,
    value: input.value,
    entered: input.entered,
    ...(input.context && Object.keys(input.context).length ? { context: input.context } : {}),
    ...judged,
    note: input.note ?? '',
    takenAt: input.takenAt ?? now,
    origin: input.origin ?? 'entered',
    ...(ctx.visit.demo ? { demo: true } : {}),
  };
  checkReading(reading, ctx.type);
  const visit = { ...ctx.visit, updatedAt: now };
  await tx.objectStore('readings').put(reading);
  await tx.objectStore('visits').put(visit);
  return { reading, visit };
}

type ReadingMethods = 'listReadings' | 'listInstrumentReadings' | 'previewReading' | 'addReading' | 'updateReading' | 'deleteReading' | 'restoreReading';
const judgeStores: JudgeStores[] = ['visits', 'instruments', 'readings', 'ownTypes', 'makerLimits'];

export function readingMethods({ db, engine }: StoreContext): Pick<Store, ReadingMethods> {
  return {
    listReadings: (visitId) =>
      guard('read the readings', async () => {
        const list = await db.getAllFromIndex('readings', 'byVisit', visitId);
        return list.sort((a, b) => (a.takenAt < b.takenAt ? -1 : a.takenAt > b.takenAt ? 1 : 0));
      }),

    listInstrumentReadings: (instrumentId, typeId) =>
      guard('read the readings', async () => {
        if (typeId) return db.getAllFromIndex('readings', 'byInstrumentType', [instrumentId, typeId]);
        return db.getAllFromIndex('readings', 'byInstrumentType', IDBKeyRange.bound([instrumentId, ''], [instrumentId, '\uffff']));
      }),

    previewReading: (visitId, typeId, value, context) =>
      guard('work out the expected value', async () => {
        const tx = db.transaction(judgeStores, 'readonly');
        const ctx = await judgingContext(tx, visitId, typeId, context);
        await tx.done;
        const expectation = expectationOf(ctx.type, ctx.instrument, visitId, context, ctx.baseline, engine);
        const convention = typeof context?.convention === 'string' ? context.convention : undefined;
        return withConventionCheck(ctx.type, convention, value, judgeWithLimit(value, ctx.type.baseUnit, expectation, ctx.limit)) ?? {};
      }),

    addReading: (input) =>
      guard('save the reading', async () => {
        const tx = db.transaction(judgeStores, 'readwrite');
        const { reading } = await addReadingIn(tx, input, engine);
        await tx.done;
        return reading;
      }),

    updateReading: (id, changes) =>
      guard('save the reading', async () => {
        const tx = db.transaction(judgeStores, 'readwrite');
        const was = await tx.objectStore('readings').get(id);
        if (!was) throw new StoreError(`Could not save: the reading ${id} no longer exists.`);
        const now = nowIso();
        const next: Reading = { ...was, ...changes, updatedAt: now };
        // The version replaced stays visible in the reading's history (audit trail).
        const history = withHistory(was, next, now);
        if (history) next.history = history;
        if (changes.context && Object.keys(changes.context).length === 0) delete next.context;
        const ctx = await judgingContext(tx, was.visitId, was.typeId, next.context ?? {});
        delete next.expected;
        delete next.verdict;
        Object.assign(next, assess(ctx.type, ctx.instrument, was.visitId, next.value, next.context ?? {}, ctx.baseline, engine, ctx.limit));
        checkReading(next, ctx.type);
        await tx.objectStore('readings').put(next);
        await tx.objectStore('visits').put({ ...ctx.visit, updatedAt: now });
        await tx.done;
        return next;
      }),

    deleteReading: (id) =>
      guard('delete the reading', async () => {
        const tx = db.transaction(['readings', 'visits'], 'readwrite');
        const was = await tx.objectStore('readings').get(id);
        if (was) {
          await tx.objectStore('readings').delete(id);
          const v = await tx.objectStore('visits').get(was.visitId);
          if (v) await tx.objectStore('visits').put({ ...v, updatedAt: nowIso() });
        }
        await tx.done;
        return was;
      }),

    restoreReading: (reading) =>
      guard('restore the reading', async () => {
        const tx = db.transaction(['readings', 'visits'], 'readwrite');
        const v = await tx.objectStore('visits').get(reading.visitId);
        if (!v) throw new StoreError('Could not restore the reading: its visit no longer exists.');
        await tx.objectStore('readings').put(reading);
        await tx.objectStore('visits').put({ ...v, updatedAt: nowIso() });
        await tx.done;
      }),
  };
}
