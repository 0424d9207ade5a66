// Loading and removing the invented demo scenario (the data itself is in demoData.ts).
import { assess, catalogue, checkEntry, nextTask, pickBaselineVisit, type Reading, type Visit } from '../records';
import type { Store, StoreContext } from './api';
import { demoInstruments, demoReadings, demoVisits, type DemoReadingSeed } from './demoData';
import { guard, StoreError } from './errors';
import { deleteVisitIn } from './visits';

export * from './demoData';

/** One demo reading, judged by the same rules as real ones against the baseline known by then. */
function judgedSeed(seed: DemoReadingSeed, v: Visit, baseline: { visit: Visit; readings: Reading[] } | undefined, engine: StoreContext['engine']): Reading {
  const instrument = demoInstruments.find((i) => i.id === v.instrumentId);
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
}

/**
 * Every demo visit in date order with its readings, each judged against the baseline known by then. One reading
 * per step: a step yields null, or a visit with all its readings once its last one is judged.
 */
function* judgedDemo(engine: StoreContext['engine']): Generator<{ visit: Visit; readings: Reading[] } | null, void, void> {
  const visits = [...demoVisits].sort((a, b) => (a.startedAt < b.startedAt ? -1 : 1));
  const done = new Map<string, Reading[]>();
  for (const visit of visits) {
    const baselineVisit = pickBaselineVisit(visits.filter((x) => x.instrumentId === visit.instrumentId && x.startedAt <= visit.startedAt));
    const baseline = baselineVisit ? { visit: baselineVisit, readings: done.get(baselineVisit.id) ?? [] } : undefined;
    const readings: Reading[] = [];
    for (const seed of demoReadings.filter((r) => r.visitId === visit.id)) {
      readings.push(judgedSeed(seed, visit, baseline, engine));
      yield null;
    }
    done.set(visit.id, readings);
    yield { visit, readings };
  }
}

export function demoMethods({ db, engine }: StoreContext): Pick<Store, 'loadDemo' | 'removeDemo'> {
  return {
    loadDemo: (force = false, onInstruments?: () => void) =>
      guard('load the demo instruments', async () => {
        if (!force && (await db.get('settings', 'demoLoaded'))) return false;
        // What is there already stays as it is (a demo record the user edited is not put back): one key list per
        // store, then only the missing records are written.
        const keys = db.transaction(['instruments', 'visits', 'readings']);
        const [haveInstruments, haveVisits, haveReadings] = await Promise.all(
          (['instruments', 'visits', 'readings'] as const).map(async (n) => new Set(await keys.objectStore(n).getAllKeys())),
        );
        const first = db.transaction('instruments', 'readwrite');
        await Promise.all([...demoInstruments.filter((p) => !haveInstruments.has(p.id)).map((p) => first.store.put({ ...p })), first.done]);
        onInstruments?.();
        // Then one reading judged per task, and each visit written in a transaction of its own: on a phone's first
        // start this runs while the first screen draws, and one long burst (over a hundred readings judged and
        // written) would hold the page still. A start cut short loads what is still missing next time: the mark
        // that the demo is loaded is written last.
        for (const step of judgedDemo(engine)) {
          await nextTask();
          if (!step) continue;
          const { visit, readings } = step;
          const tx = db.transaction(['visits', 'readings'], 'readwrite');
          const writes: Promise<unknown>[] = [tx.done];
          if (!haveVisits.has(visit.id)) writes.push(tx.objectStore('visits').put({ ...visit }));
          for (const r of readings) if (!haveReadings.has(r.id)) writes.push(tx.objectStore('readings').put(r));
          await Promise.all(writes);
        }
        const mark = db.transaction('settings', 'readwrite');
        const already = !force && (await mark.store.get('demoLoaded'));
        if (!already) await mark.store.put({ key: 'demoLoaded', value: true });
        await mark.done;
        return !already; // another tab may have finished first: then this one only filled in what was missing
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
