// Loading and removing the invented demo scenario (the data itself is in demoData.ts).
import { assess, catalogue, checkEntry, nextTask, pickBaselineVisit, type Reading, type Visit } from '../records';
import type { Store, StoreContext } from './api';
import { demoInstruments, demoReadings, demoVisits } from './demoData';
import { guard, StoreError } from './errors';
import { deleteVisitIn } from './visits';

export * from './demoData';

/** The demo readings of one visit, judged by the same rules as real ones against the baseline known by then. */
function demoReadingsOf(v: Visit, baseline: { visit: Visit; readings: Reading[] } | undefined, engine: StoreContext['engine']): Reading[] {
  const instrument = demoInstruments.find((i) => i.id === v.instrumentId);
  return demoReadings.filter((r) => r.visitId === v.id).map((seed) => {
    const type = catalogue.find((t) => t.id === seed.typeId)!;
    const entry = checkEntry(type, seed.text, seed.unitId, seed.context ?? {});
    if (!entry.ok) throw new StoreError(`Demo data is inconsistent (${Object.values(entry.errors).join(' ')}).`);
    const unit = type.units.find((u) => u.id === seed.unitId)!;
    const verdict = assess(type, instrument, v.id, entry.value, entry.context, baseline, engine);
    return {
      id: `demo-rdg-${v.id.replace(/^demo-visit-/, '')}-${seed.phase}-${seed.typeId}${seed.context?.mz ? `-${seed.context.mz}` : ''}`,
      visitId: v.id, instrumentId: v.instrumentId, typeId: type.id, phase: seed.phase, value: entry.value,
      entered: { text: seed.text, unit: unit.label }, context: entry.context, ...verdict,
      note: seed.note ?? '', takenAt: seed.takenAt ?? new Date(Date.parse(v.startedAt) + (seed.phase === 'as-left' ? 5 : 1) * 3600_000).toISOString(),
      origin: 'entered', demo: true,
    };
  });
}

/** Every demo visit in date order with its readings, each judged against the baseline known by then. */
async function judgedDemo(engine: StoreContext['engine']): Promise<{ visits: Visit[]; readings: Reading[] }> {
  const visits = [...demoVisits].sort((a, b) => (a.startedAt < b.startedAt ? -1 : 1));
  const done = new Map<string, Reading[]>();
  const readings: Reading[] = [];
  for (const v of visits) {
    const baselineVisit = pickBaselineVisit(visits.filter((x) => x.instrumentId === v.instrumentId && x.startedAt <= v.startedAt));
    const list = demoReadingsOf(v, baselineVisit ? { visit: baselineVisit, readings: done.get(baselineVisit.id) ?? [] } : undefined, engine);
    done.set(v.id, list);
    readings.push(...list);
    await nextTask();
  }
  return { visits, readings };
}

export function demoMethods({ db, engine }: StoreContext): Pick<Store, 'loadDemo' | 'removeDemo'> {
  return {
    loadDemo: (force = false) =>
      guard('load the demo instruments', async () => {
        if (!force && (await db.get('settings', 'demoLoaded'))) return false;
        // Judged before the write, one visit per task: on a phone's first start this runs while the first
        // screen draws, and one long burst would hold the page still.
        const { visits, readings } = await judgedDemo(engine);
        const tx = db.transaction(['instruments', 'settings', 'visits', 'readings'], 'readwrite');
        if ((await tx.objectStore('settings').get('demoLoaded')) && !force) {
          await tx.done; // another tab loaded it meanwhile
          return false;
        }
        // What is there already stays as it is (a demo record the user edited is not put back): one key list per
        // store, then only the missing records are written, none of them awaited one by one.
        const [haveInstruments, haveVisits, haveReadings] = await Promise.all(
          (['instruments', 'visits', 'readings'] as const).map(async (n) => new Set(await tx.objectStore(n).getAllKeys())),
        );
        const writes: Promise<unknown>[] = [];
        for (const p of demoInstruments) if (!haveInstruments.has(p.id)) writes.push(tx.objectStore('instruments').put({ ...p }));
        for (const v of visits) if (!haveVisits.has(v.id)) writes.push(tx.objectStore('visits').put({ ...v }));
        for (const r of readings) if (!haveReadings.has(r.id)) writes.push(tx.objectStore('readings').put(r));
        writes.push(tx.objectStore('settings').put({ key: 'demoLoaded', value: true }));
        await Promise.all(writes);
        await tx.done;
        return true;
      }),

    removeDemo: () =>
      guard('remove the demo data', async () => {
        // Demo visits, readings and walks go too; a demo instrument's own visits are removed with it.
        const tx = db.transaction(['instruments', 'visits', 'readings', 'walks'], 'readwrite');
        const demoIds = new Set<string>();
        for (let c = await tx.objectStore('instruments').openCursor(); c; c = await c.continue()) {
          if (!c.value.demo) continue;
          demoIds.add(c.value.id);
          await c.delete();
        }
        for (let c = await tx.objectStore('visits').openCursor(); c; c = await c.continue()) {
          if (c.value.demo || demoIds.has(c.value.instrumentId)) await deleteVisitIn(tx, c.value);
        }
        for (let c = await tx.objectStore('readings').openCursor(); c; c = await c.continue()) if (c.value.demo) await c.delete();
        for (let c = await tx.objectStore('walks').openCursor(); c; c = await c.continue()) if (c.value.demo) await c.delete();
        await tx.done;
        return demoIds.size;
      }),
  };
}
