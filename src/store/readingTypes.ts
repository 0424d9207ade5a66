// Reading types (the catalogue plus the user's own), the maker's limits of each instrument, and trends.
import { allTypes, buildTrend, checkMakerLimit, sameLimitSlot, DEFAULT_MULTIPLIER_LIMIT, ownTypeFromDraft, seriesOf, type ReadingType } from '../records';
import type { Store, StoreContext } from './api';
import { guard, StoreError } from './errors';
import { makerLimitsIn, ownTypesIn, putMakerLimitsIn, putOwnTypesIn } from './marks';

/** The catalogue plus the user's own types. */
export async function readingTypes({ db }: StoreContext): Promise<ReadingType[]> {
  const tx = db.transaction(['ownTypes'], 'readonly');
  const own = await ownTypesIn(tx);
  await tx.done;
  return allTypes(own);
}

type TypeMethods =
  | 'listReadingTypes' | 'saveOwnReadingType' | 'deleteOwnReadingType' | 'listMakerLimits' | 'saveMakerLimit' | 'deleteMakerLimit'
  | 'trend' | 'trendSeries';

export function readingTypeMethods(ctx: StoreContext): Pick<Store, TypeMethods> {
  const { db } = ctx;
  return {
    listReadingTypes: () => guard('read the reading types', () => readingTypes(ctx)),

    saveOwnReadingType: (draft) =>
      guard('save the reading type', async () => {
        const tx = db.transaction(['ownTypes'], 'readwrite');
        const own = await ownTypesIn(tx);
        const r = ownTypeFromDraft(draft, new Set(own.map((t) => t.id)));
        if (r.ok) await putOwnTypesIn(tx, [...own, r.type]);
        await tx.done;
        return r;
      }),

    deleteOwnReadingType: (id) =>
      guard('delete the reading type', async () => {
        const tx = db.transaction(['ownTypes', 'readings'], 'readwrite');
        const own = await ownTypesIn(tx);
        let used = 0;
        for (let c = await tx.objectStore('readings').openCursor(); c; c = await c.continue()) if (c.value.typeId === id) used++;
        if (used) throw new StoreError(`Could not delete the reading type: ${used} reading${used === 1 ? '' : 's'} use it. Delete those first.`);
        await putOwnTypesIn(tx, own.filter((t) => t.id !== id));
        await tx.done;
      }),

    listMakerLimits: (instrumentId) =>
      guard('read the instrument’s limits', async () => {
        const tx = db.transaction(['makerLimits'], 'readonly');
        const limits = await makerLimitsIn(tx, instrumentId);
        await tx.done;
        return limits;
      }),

    saveMakerLimit: (instrumentId, draft) =>
      guard('save the instrument’s limit', async () => {
        const r = checkMakerLimit((await readingTypes(ctx)).find((t) => t.id === draft.typeId), draft);
        if (!r.ok) return r;
        const tx = db.transaction(['makerLimits', 'instruments'], 'readwrite');
        if (!(await tx.objectStore('instruments').get(instrumentId))) throw new StoreError('Could not save the limit: the instrument profile no longer exists.');
        const others = (await makerLimitsIn(tx, instrumentId)).filter((l) => !sameLimitSlot(l, r.limit));
        await putMakerLimitsIn(tx, instrumentId, [...others, r.limit]);
        await tx.done;
        return r;
      }),

    deleteMakerLimit: (instrumentId, typeId, match) =>
      guard('delete the instrument’s limit', async () => {
        const tx = db.transaction(['makerLimits'], 'readwrite');
        await putMakerLimitsIn(tx, instrumentId, (await makerLimitsIn(tx, instrumentId)).filter((l) => !sameLimitSlot(l, { typeId, match })));
        await tx.done;
      }),

    trend: (instrumentId, typeId, opts = {}) =>
      guard('compute the trend', async () => {
        const tx = db.transaction(['visits', 'readings', 'instruments', 'ownTypes'], 'readonly');
        const [visits, readings, instrument, own] = await Promise.all([
          tx.objectStore('visits').index('byInstrument').getAll(instrumentId),
          tx.objectStore('readings').index('byInstrumentType').getAll([instrumentId, typeId]),
          tx.objectStore('instruments').get(instrumentId),
          ownTypesIn(tx),
        ]);
        await tx.done;
        const type = allTypes(own).find((t) => t.id === typeId);
        if (!type) throw new StoreError(`Could not compute the trend: the reading type ${typeId} is not known here.`);
        return buildTrend(type, visits, readings, { limit: instrument?.multiplierVoltageLimit ?? DEFAULT_MULTIPLIER_LIMIT, ...opts });
      }),

    trendSeries: (instrumentId, typeId) =>
      guard('read the readings', async () => {
        const type = (await readingTypes(ctx)).find((t) => t.id === typeId);
        if (!type) return [];
        return seriesOf(type, await db.getAllFromIndex('readings', 'byInstrumentType', [instrumentId, typeId]));
      }),
  };
}
