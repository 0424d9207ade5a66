// Readings of the earlier background-gas and calibrant design (fixed leak peaks as % of one reference ion, a fixed
// set of abundance and isotope ratios) stay readable: a populated older database and a backup made by it still
// list, show, trend, export, import and edit them, under their own type ids.
import 'fake-indexeddb/auto';
import { describe, expect, it } from 'vitest';
import { EARLIER_DESIGN_TYPES, openStore, type Reading, type Store } from '../../../src/store';
import { freshName, registerCleanup, testEngine } from './helpers';

registerCleanup();

/** Readings as the earlier design stored them on the demo's Kestrel: typed, judged and kept, verdicts and all. */
function earlierReadings(): Reading[] {
  const at = (visit: string, hour: number) => ({ visitId: `demo-visit-${visit}`, takenAt: `2025-0${hour}-01T10:00:00.000Z` });
  const base = { instrumentId: 'demo-gcms-kestrel', phase: 'as-left' as const, note: '', origin: 'entered' as const };
  return [
    { ...base, ...at('k1', 1), id: 'old-water-k1', typeId: 'leak-water-18', value: 8, entered: { text: '8', unit: '%' }, context: { referenceMz: 69 },
      expected: { high: 20, basis: 'generic', source: 'm/z 18 below about 20 % of the reference ion (from memory)', summary: 'inside the generic range' }, verdict: 'pass' },
    { ...base, ...at('k4', 2), id: 'old-water-k4', typeId: 'leak-water-18', value: 35, entered: { text: '35', unit: '%' }, context: { referenceMz: 69 },
      expected: { value: 8, basis: 'baseline', summary: 'off by a factor 4.38 from the baseline value' }, verdict: 'fail' },
    { ...base, ...at('k6', 3), id: 'old-n2-k6', typeId: 'leak-nitrogen-28', value: 24, entered: { text: '24', unit: '%' }, context: { referenceMz: 69 } },
    { ...base, ...at('k6', 3), id: 'old-ratio-k6', typeId: 'leak-ratio-28-32', value: 3.8, entered: { text: '3.8', unit: 'ratio' } },
    { ...base, ...at('k6', 3), id: 'old-argon-k6', typeId: 'leak-argon-40', value: 1.6, entered: { text: '1.6', unit: '%' } },
    { ...base, ...at('k5', 4), id: 'old-abund-k5', typeId: 'relative-abundance', value: 48, entered: { text: '48', unit: '%' }, context: { mz: 219, referenceMz: 69 } },
    { ...base, ...at('k5', 4), id: 'old-iso-k5', typeId: 'isotope-ratio', value: 4.3, entered: { text: '4.3', unit: '%' }, context: { mz: 219 },
      expected: { value: 4.328, basis: 'published', source: 'from IUPAC isotopic abundances; CF3+', summary: 'off by 0.6 % from the published value' }, verdict: 'pass' },
  ];
}

async function olderStore(name: string): Promise<Store> {
  const s = await openStore(name, {}, { engine: testEngine });
  await s.loadDemo();
  for (const r of earlierReadings()) await s.db.put('readings', { ...r, demo: true });
  return s;
}

describe('earlier-design reading types', () => {
  it('resolve by their old ids, marked as the earlier design and not offered for new readings', async () => {
    const s = await olderStore(freshName());
    const types = await s.listReadingTypes();
    for (const id of EARLIER_DESIGN_TYPES) {
      const t = types.find((x) => x.id === id);
      expect(t, id).toBeDefined();
      expect(t!.group).toBe('earlier');
      expect(t!.label).toMatch(/^Earlier design: /);
      expect(t!.generic, id).toBeUndefined();
    }
    s.close();
  });

  it('show in the visit record with what they were judged against at the time, and trend', async () => {
    const s = await olderStore(freshName());
    const html = await s.visitReport('demo-visit-k4');
    expect(html).toContain('Earlier design: water, m/z 18 as % of a reference ion');
    expect(html).toMatch(/fail/);
    const trend = await s.trend('demo-gcms-kestrel', 'leak-water-18');
    expect(trend.x.length).toBe(2);
    const csv = await s.readingsCsv({ instrumentId: 'demo-gcms-kestrel' });
    // Every earlier-design reading appears under its earlier-design name.
    expect(csv.match(/Earlier design: /g)?.length).toBe(earlierReadings().length);
    expect(csv).not.toMatch(/NaN|undefined/);
    s.close();
  });

  it('go through a backup made by the older data unchanged, and can still be edited', async () => {
    const a = await olderStore(freshName());
    const text = await a.exportBackup();
    a.close();
    const b = await openStore(freshName(), {}, { engine: testEngine });
    await b.importBackup(text);
    const back = await b.listInstrumentReadings('demo-gcms-kestrel');
    for (const old of earlierReadings()) {
      const got = back.find((r) => r.id === old.id);
      expect(got, old.id).toMatchObject({ typeId: old.typeId, value: old.value, entered: old.entered });
      if (old.verdict) expect(got!.verdict).toBe(old.verdict);
    }
    // An edit re-judges by the earlier type's own rule: against the baseline only (8 % of m/z 69 at k1).
    const edited = await b.updateReading('old-water-k4', { value: 10 });
    expect(edited.typeId).toBe('leak-water-18');
    expect(edited.verdict).toBe('pass');
    expect(edited.expected?.basis).toBe('baseline');
    b.close();
  });
});

describe('the engineer’s limit for one calibrant ion pair wins over the baseline', () => {
  it('judges a saved reading of that pair by the limit, other pairs by their baseline, and deletes only that limit', async () => {
    const s = await openStore(freshName(), {}, { engine: testEngine });
    await s.loadDemo();
    const saved = await s.saveMakerLimit('demo-gcms-kestrel', {
      typeId: 'calibrant-ratio', unitId: 'percent', low: '1', high: '3', source: 'site method, table 1 (invented for this test)', mz: '502', referenceMz: '69',
    });
    expect(saved.ok).toBe(true);
    // Kestrel's baseline has m/z 502 at 3.6 % of m/z 69: 2.2 % is 39 % off the baseline, yet inside the engineer's 1–3 %.
    const r502 = await s.addReading({ visitId: 'demo-visit-k8', typeId: 'calibrant-ratio', phase: 'as-found', value: 2.2, entered: { text: '2.2', unit: '%' }, context: { mz: 502, referenceMz: 69 } });
    expect(r502).toMatchObject({ verdict: 'pass', expected: { basis: 'maker limit' } });
    expect(r502.expected?.source).toMatch(/m\/z 502 as % of m\/z 69: site method/);
    const r219 = await s.addReading({ visitId: 'demo-visit-k8', typeId: 'calibrant-ratio', phase: 'as-found', value: 30, entered: { text: '30', unit: '%' }, context: { mz: 219, referenceMz: 69 } });
    expect(r219).toMatchObject({ verdict: 'fail', expected: { basis: 'baseline', value: 48 } });
    await s.deleteMakerLimit('demo-gcms-kestrel', 'calibrant-ratio');
    expect(await s.listMakerLimits('demo-gcms-kestrel')).toHaveLength(1);
    await s.deleteMakerLimit('demo-gcms-kestrel', 'calibrant-ratio', { mz: '502', referenceMz: '69' });
    expect(await s.listMakerLimits('demo-gcms-kestrel')).toEqual([]);
    s.close();
  });
});
