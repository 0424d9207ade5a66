import 'fake-indexeddb/auto';
import { afterEach, describe, expect, it } from 'vitest';
import { openDB } from 'idb';
import { eraseStore, openStore, validateDraft, emptyDraft, draftFromProfile, demoInstruments, type ProfileDraft } from '../../../src/store';
import type { InstrumentV1 } from '../../../src/store/schema';

let counter = 0;
const names: string[] = [];
function freshName(): string {
  const n = `rodside-test-${Date.now()}-${counter++}`;
  names.push(n);
  return n;
}
afterEach(async () => {
  while (names.length) await eraseStore(names.pop()!);
});

function goodDraft(): ProfileDraft {
  return { ...emptyDraft(), name: 'Bench unit', rodFieldRadius: '4.5', rodLength: '150', rfFrequency: '1.0', maxRfAmplitude: '1500', axialEnergy: '5' };
}

describe('instrument profiles: create, read, update, delete', () => {
  it('creates, reads back in SI units, updates and deletes with undo', async () => {
    const store = await openStore(freshName());
    const v = validateDraft(goodDraft());
    expect(v.ok).toBe(true);
    if (!v.ok) return;
    const created = await store.saveInstrument(v.fields);
    expect(created.rodFieldRadius).toBeCloseTo(4.5e-3, 15);
    expect(created.rfFrequency).toBe(1e6);
    expect(created.rodLength).toBeCloseTo(0.15, 15);
    expect((await store.getInstrument(created.id))?.name).toBe('Bench unit');

    const updated = await store.saveInstrument({ ...v.fields, name: 'Bench unit B' }, created.id);
    expect(updated.id).toBe(created.id);
    expect(updated.createdAt).toBe(created.createdAt);
    expect((await store.listInstruments()).map((p) => p.name)).toEqual(['Bench unit B']);

    const copy = await store.duplicateInstrument(created.id);
    expect(copy.id).not.toBe(created.id);
    expect(copy.name).toBe('Bench unit B (copy)');
    expect(await store.listInstruments()).toHaveLength(2);

    const removed = await store.deleteInstrument(created.id);
    expect(removed?.id).toBe(created.id);
    expect(await store.getInstrument(created.id)).toBeUndefined();
    await store.restoreInstrument(removed!);
    expect(await store.getInstrument(created.id)).toEqual(removed);
    store.close();
  });

  it('lists profiles alphabetically, ignoring case and accents', async () => {
    const store = await openStore(freshName());
    const v = validateDraft(goodDraft());
    if (!v.ok) throw new Error('draft should be valid');
    for (const name of ['beta line', 'Zeta', 'Élan B', 'alpha', 'Alpha', 'elan A']) await store.saveInstrument({ ...v.fields, name });
    expect((await store.listInstruments()).map((p) => p.name)).toEqual(['Alpha', 'alpha', 'beta line', 'elan A', 'Élan B', 'Zeta']);
    store.close();
  });

  it('round-trips a profile through the form draft without float noise', () => {
    const d = draftFromProfile(demoInstruments[0]);
    expect(d.rodFieldRadius).toBe('4.5');
    expect(d.rfFrequency).toBe('1');
    const v = validateDraft(d);
    expect(v.ok && v.fields.rodFieldRadius).toBeCloseTo(4.5e-3, 15);
  });

  it('refuses to update a profile that no longer exists, and refuses a bad record', async () => {
    const store = await openStore(freshName());
    const v = validateDraft(goodDraft());
    if (!v.ok) throw new Error('draft should be valid');
    await expect(store.saveInstrument(v.fields, 'inst-missing')).rejects.toThrow(/no longer exists/);
    await expect(store.saveInstrument({ ...v.fields, rodFieldRadius: Number.NaN })).rejects.toThrow(/rodFieldRadius/);
    expect(await store.listInstruments()).toHaveLength(0);
    store.close();
  });

  it('loads the demo once, and removes only demo profiles', async () => {
    const store = await openStore(freshName());
    expect(await store.loadDemo()).toBe(true);
    expect(await store.loadDemo()).toBe(false);
    const v = validateDraft(goodDraft());
    if (!v.ok) throw new Error('draft should be valid');
    await store.saveInstrument(v.fields);
    expect(await store.listInstruments()).toHaveLength(demoInstruments.length + 1);
    expect(await store.removeDemo()).toBe(demoInstruments.length);
    expect((await store.listInstruments()).map((p) => p.name)).toEqual(['Bench unit']);
    store.close();
  });

  it('keeps drafts and settings', async () => {
    const store = await openStore(freshName());
    await store.putDraft('profile-form', { name: 'half typed' });
    expect(await store.getDraft('profile-form')).toEqual({ name: 'half typed' });
    await store.clearDraft('profile-form');
    expect(await store.getDraft('profile-form')).toBeUndefined();
    await store.setSetting('theme', 'dark');
    expect(await store.getSetting('theme')).toBe('dark');
    store.close();
  });
});

describe('migration from schema version 1', () => {
  it('upgrades a version-1 database holding profiles and settings, losing nothing', async () => {
    const name = freshName();
    const v1Profiles: InstrumentV1[] = [
      { id: 'old-a', name: 'Old A', kind: 'gc-ms-single', r0Mm: 4.5, rodLengthMm: 150, frequencyMHz: 1, maxRfVolts: 1500, ionEnergyEv: 5, rfIsPeakToPeak: false, notes: 'first', createdAt: '2025-01-01T00:00:00.000Z', updatedAt: '2025-02-01T00:00:00.000Z' },
      { id: 'old-b', name: 'Old B', kind: 'rga', r0Mm: 3, rodLengthMm: 100, frequencyMHz: 2.5, maxRfVolts: 900, ionEnergyEv: 8, rfIsPeakToPeak: true, notes: '<b>kept as text</b>', createdAt: '2025-03-01T00:00:00.000Z', updatedAt: '2025-03-02T00:00:00.000Z' },
    ];
    // Build the database exactly as version 1 of the schema did.
    const v1 = await openDB(name, 1, {
      upgrade(db) {
        const s = db.createObjectStore('instruments', { keyPath: 'id' });
        s.createIndex('byName', 'name');
        db.createObjectStore('settings', { keyPath: 'key' });
      },
    });
    for (const p of v1Profiles) await v1.put('instruments', p);
    await v1.put('settings', { key: 'theme', value: 'dark' });
    v1.close();

    const store = await openStore(name);
    const list = await store.listInstruments();
    expect(list).toHaveLength(2);
    const a = list.find((p) => p.id === 'old-a')!;
    expect(a.rodFieldRadius).toBeCloseTo(4.5e-3, 15);
    expect(a.rodLength).toBeCloseTo(0.15, 15);
    expect(a.rfFrequency).toBe(1e6);
    expect(a.maxRfAmplitude).toBe(1500);
    expect(a.axialEnergy).toBe(5);
    expect(a.readbackConvention).toEqual({ amplitude: 'zero-to-peak', reference: 'per-rod' });
    expect(a.createdAt).toBe('2025-01-01T00:00:00.000Z');
    const b = list.find((p) => p.id === 'old-b')!;
    expect(b.readbackConvention.amplitude).toBe('peak-to-peak');
    expect(b.notes).toBe('<b>kept as text</b>');
    expect(b.rfFrequency).toBe(2.5e6);
    expect(await store.getSetting('theme')).toBe('dark');
    // The new stores exist and work: version 2's, then version 3's typed ones.
    expect(Array.from(store.db.objectStoreNames).sort()).toEqual([
      'currentVisits', 'drafts', 'instruments', 'makerLimits', 'ownTypes', 'readings', 'settings', 'undoCopies', 'visits', 'walks',
    ]);
    expect(store.db.version).toBe(3);
    await store.setCurrentVisit('old-a', 'no-such-visit');
    expect(await store.db.get('currentVisits', 'old-a')).toEqual({ instrumentId: 'old-a', visitId: 'no-such-visit' });
    store.close();
  });
});

describe('profile validation messages name the field and the accepted range', () => {
  const cases: [keyof ProfileDraft, string, RegExp][] = [
    ['rodFieldRadius', 'NaN', /Field radius r0 “NaN” is not a number: enter a value between 0\.5 and 20 mm/],
    ['rodFieldRadius', '', /Field radius r0 is empty: enter a value between 0\.5 and 20 mm/],
    ['rodFieldRadius', '-4', /Field radius r0 -4 mm is out of range: enter a value between 0\.5 and 20 mm/],
    ['rodFieldRadius', '0', /Field radius r0 0 mm is out of range/],
    ['rodFieldRadius', '1e30', /Field radius r0 1e30 mm is out of range/],
    ['rfFrequency', 'abc', /RF frequency “abc” is not a number: enter a value between 0\.1 and 20 MHz/],
    ['rfFrequency', '-1', /RF frequency -1 MHz is out of range/],
    ['rodLength', '0', /Rod length 0 mm is out of range: enter a value between 10 and 1000 mm/],
    ['maxRfAmplitude', '99999999', /Largest RF amplitude 99999999 V .* is out of range: enter a value between 10 and 20000/],
    ['axialEnergy', 'Infinity', /Ion axial energy “Infinity” is not a number: enter a value between 0\.1 and 100 eV/],
    ['axialEnergy', '   ', /Ion axial energy is empty/],
    ['name', '', /Name is empty/],
    ['name', 'x'.repeat(81), /Name is 81 characters long: use 1 to 80/],
    ['kind', 'ion-trap', /Instrument type “ion-trap” is not one of/],
    ['amplitude', 'peak', /Amplitude form “peak” is not one of: zero-to-peak, peak-to-peak, rms/],
  ];
  for (const [field, value, message] of cases) {
    it(`${field} = ${JSON.stringify(value.length > 20 ? value.slice(0, 10) + '…' : value)}`, () => {
      const r = validateDraft({ ...goodDraft(), [field]: value });
      expect(r.ok).toBe(false);
      if (r.ok) return;
      expect(r.errors[field]).toMatch(message);
      expect(Object.keys(r.errors)).toEqual([field]);
    });
  }

  it('accepts a decimal comma', () => {
    const r = validateDraft({ ...goodDraft(), rodFieldRadius: '4,5' });
    expect(r.ok && r.fields.rodFieldRadius).toBeCloseTo(4.5e-3, 15);
  });
});
