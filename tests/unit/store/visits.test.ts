import 'fake-indexeddb/auto';
import { afterEach, describe, expect, it, vi } from 'vitest';
import {
  backupReminder, checkEntry, catalogueType, csvCell, demoInstruments, demoVisits, EARLIER_DESIGN_TYPES, emptyOwnTypeDraft, emptyVisitDraft, openStore,
  validateDraft, emptyDraft, validateVisitDraft, type Store, type VisitFields,
} from '../../../src/store';
import { readingProblems } from '../../../src/records';
import { freshName, registerCleanup, testEngine } from './helpers';

registerCleanup();
afterEach(() => {
  vi.useRealTimers();
});

async function storeWithInstrument(): Promise<{ store: Store; instrumentId: string }> {
  const store = await openStore(freshName(), {}, { engine: testEngine });
  const v = validateDraft({ ...emptyDraft(), name: 'Bench unit', rodFieldRadius: '4.5', rodLength: '150', rfFrequency: '1.0', maxRfAmplitude: '1500', axialEnergy: '5' });
  if (!v.ok) throw new Error('bad profile');
  const inst = await store.saveInstrument(v.fields);
  return { store, instrumentId: inst.id };
}

function visitFields(instrumentId: string, startedAt = '2026-03-01T09:30:00.000Z', extra: Partial<VisitFields> = {}): VisitFields {
  const d = validateVisitDraft({ ...emptyVisitDraft(instrumentId), startedAt, engineer: 'Field engineer', site: 'Room 1' });
  if (!d.ok) throw new Error(JSON.stringify(d.errors));
  return { ...d.fields, ...extra };
}

async function addTyped(store: Store, visitId: string, typeId: string, phase: 'as-found' | 'as-left', text: string, unitId: string, ctx: Record<string, string> = {}) {
  const type = catalogueType(typeId)!;
  const e = checkEntry(type, text, unitId, ctx);
  if (!e.ok) throw new Error(JSON.stringify(e.errors));
  return store.addReading({ visitId, typeId, phase, value: e.value, entered: { text, unit: type.units.find((u) => u.id === unitId)!.label }, context: e.context });
}

describe('visit form', () => {
  it('names the field and what is accepted', () => {
    const r = validateVisitDraft({ ...emptyVisitDraft('i1'), startedAt: 'yesterday', engineer: '', notes: 'x'.repeat(20001), reason: 'holiday' });
    expect(r.ok).toBe(false);
    if (r.ok) return;
    expect(r.errors.startedAt).toMatch(/Date and time “yesterday” is not a date/);
    expect(r.errors.engineer).toMatch(/Engineer is empty: enter 1 to 200 characters/);
    expect(r.errors.notes).toMatch(/Notes are|Notes is 20001 characters long: keep it to 20000/);
    expect(r.errors.reason).toMatch(/Reason “holiday” is not one of/);
  });
});

describe('visits and readings', () => {
  it('creates, lists newest first, updates, deletes with undo', async () => {
    const { store, instrumentId } = await storeWithInstrument();
    const a = await store.saveVisit(visitFields(instrumentId, '2025-01-01T09:00:00.000Z'));
    const b = await store.saveVisit(visitFields(instrumentId, '2026-01-01T09:00:00.000Z'));
    expect((await store.listVisits(instrumentId)).map((v) => v.id)).toEqual([b.id, a.id]);
    const a2 = await store.saveVisit({ ...visitFields(instrumentId, '2025-01-01T09:00:00.000Z'), notes: 'changed' }, a.id);
    expect(a2.createdAt).toBe(a.createdAt);
    expect((await store.getVisit(a.id))?.notes).toBe('changed');
    const r = await addTyped(store, a.id, 'multiplier-voltage', 'as-left', '1500', 'V');
    const bundle = await store.deleteVisit(a.id);
    expect(bundle?.readings.map((x) => x.id)).toEqual([r.id]);
    expect(await store.listReadings(a.id)).toEqual([]);
    await store.restoreVisit(bundle!);
    expect((await store.listReadings(a.id)).map((x) => x.id)).toEqual([r.id]);
    await expect(store.saveVisit(visitFields('no-such-instrument'))).rejects.toThrow(/instrument profile no longer exists/);
    store.close();
  });

  it('commits a reading and its visit update in one transaction, and judges it', async () => {
    const { store, instrumentId } = await storeWithInstrument();
    // The update time is the subject: the clock is set, not slept on.
    vi.useFakeTimers({ toFake: ['Date'] });
    const v = await store.saveVisit(visitFields(instrumentId));
    const before = (await store.getVisit(v.id))!.updatedAt;
    vi.setSystemTime(Date.now() + 1000);
    const r = await addTyped(store, v.id, 'rf-amplitude', 'as-found', '201.8', 'Vpp-rod', { mz: '69' });
    expect(r.value).toBeCloseTo(100.9, 10);
    expect(r.context).toMatchObject({ mz: 69, convention: 'V peak-to-peak, one rod to ground' });
    expect(r.expected?.basis).toBe('calculated');
    expect(r.expected?.value).toBeCloseTo(100.91, 1);
    expect(r.verdict).toBe('pass');
    expect(r.instrumentId).toBe(instrumentId);
    expect((await store.getVisit(v.id))!.updatedAt > before).toBe(true);
    // A bad reading is refused and the visit is not touched either.
    const touched = (await store.getVisit(v.id))!.updatedAt;
    await expect(store.addReading({ visitId: v.id, typeId: 'multiplier-voltage', phase: 'as-found', value: Number.NaN, entered: { text: 'x', unit: 'V' } }))
      .rejects.toThrow(/reading.value: expected a finite number/);
    await expect(store.addReading({ visitId: v.id, typeId: 'multiplier-voltage', phase: 'as-found', value: 1e9, entered: { text: '1e9', unit: 'V' } }))
      .rejects.toThrow(/outside the accepted range|outside 0 to 6000/);
    await expect(store.addReading({ visitId: 'gone', typeId: 'multiplier-voltage', phase: 'as-found', value: 1, entered: { text: '1', unit: 'V' } }))
      .rejects.toThrow(/its visit no longer exists/);
    expect((await store.getVisit(v.id))!.updatedAt).toBe(touched);
    expect(await store.listReadings(v.id)).toHaveLength(1);
    store.close();
  });

  it('compares later readings with the baseline’s as-left values, same parked m/z only', async () => {
    const { store, instrumentId } = await storeWithInstrument();
    const first = await store.saveVisit(visitFields(instrumentId, '2025-01-01T09:00:00.000Z'));
    await addTyped(store, first.id, 'multiplier-voltage', 'as-left', '1500', 'V');
    await addTyped(store, first.id, 'rf-amplitude', 'as-left', '99.5', 'V0p-rod', { mz: '69' });
    await store.markBaseline(first.id);
    const later = await store.saveVisit(visitFields(instrumentId, '2026-01-01T09:00:00.000Z'));
    const mv = await addTyped(store, later.id, 'multiplier-voltage', 'as-found', '1700', 'V');
    expect(mv.expected).toMatchObject({ basis: 'baseline', value: 1500 });
    expect(mv.verdict).toBe('borderline'); // +13 %: between the 10 % and 20 % baseline tolerances
    const rf69 = await addTyped(store, later.id, 'rf-amplitude', 'as-found', '99.6', 'V0p-rod', { mz: '69' });
    expect(rf69.expected).toMatchObject({ basis: 'baseline', value: 99.5 });
    const rf502 = await addTyped(store, later.id, 'rf-amplitude', 'as-found', '733', 'V0p-rod', { mz: '502' });
    expect(rf502.expected?.basis).toBe('calculated');
    const preview = await store.previewReading(later.id, 'multiplier-voltage', 2000, {});
    expect(preview.judgement?.verdict).toBe('fail');
    // Only one baseline per instrument.
    await store.markBaseline(later.id);
    expect((await store.listVisits(instrumentId)).filter((v) => v.baseline).map((v) => v.id)).toEqual([later.id]);
    const base = await store.getBaseline(instrumentId);
    expect(base?.visit.id).toBe(later.id);
    expect(base?.readings).toEqual([]);
    // Updating a reading judges it again.
    await store.markBaseline(first.id);
    const fixed = await store.updateReading(mv.id, { value: 1510, entered: { text: '1510', unit: 'V' } });
    expect(fixed.verdict).toBe('pass');
    store.close();
  });

  it('keeps diagnosis walks by visit and finds the latest one in progress', async () => {
    const { store, instrumentId } = await storeWithInstrument();
    const v = await store.saveVisit(visitFields(instrumentId));
    vi.useFakeTimers({ toFake: ['Date'] });
    const w1 = await store.saveWalk({ visitId: v.id, instrumentId, treeId: 'no-signal', state: { at: 'T0' }, status: 'in-progress' });
    vi.setSystemTime(Date.now() + 1000);
    const w2 = await store.saveWalk({ visitId: v.id, instrumentId, treeId: 'vacuum', state: { at: 'VF-1', answers: [1, 2] }, status: 'in-progress' });
    expect((await store.listWalks(v.id)).map((w) => w.id)).toEqual([w1.id, w2.id]);
    expect((await store.latestInProgressWalk({ visitId: v.id }))?.id).toBe(w2.id);
    await store.saveWalk({ ...w2, status: 'finished' });
    expect((await store.latestInProgressWalk({ instrumentId }))?.id).toBe(w1.id);
    expect((await store.getWalk(w2.id))?.startedAt).toBe(w2.startedAt);
    await expect(store.saveWalk({ treeId: 'x', state: { f: Number.NaN }, status: 'in-progress' })).rejects.toThrow(/walk.state.f: expected a finite number/);
    // Optional fields left undefined are fine (JSON drops them).
    await store.saveWalk({ treeId: 'x', state: { note: undefined, list: [1, undefined] }, status: 'abandoned' });
    // A walk saved without a visit joins the instrument's open visit.
    await store.setCurrentVisit(instrumentId, v.id);
    const w3 = await store.saveWalk({ instrumentId, treeId: 'noise', state: { at: 'N-1' }, status: 'in-progress' });
    expect(w3.visitId).toBe(v.id);
    expect((await store.saveWalk({ ...w3, state: { at: 'N-2' } })).visitId).toBe(v.id);
    const bundle = await store.deleteVisit(v.id);
    expect(bundle?.walks).toHaveLength(3);
    store.close();
  });

  it('deleting an instrument takes its visits along, and undo brings them back', async () => {
    const { store, instrumentId } = await storeWithInstrument();
    const v = await store.saveVisit(visitFields(instrumentId));
    await addTyped(store, v.id, 'multiplier-voltage', 'as-left', '1500', 'V');
    const removed = await store.deleteInstrument(instrumentId);
    expect(await store.listVisits()).toEqual([]);
    expect(await store.db.count('readings')).toBe(0);
    await store.restoreInstrument(removed!);
    expect(await store.listReadings(v.id)).toHaveLength(1);
    store.close();
  });

  it('accepts reading types of the user’s own and judges them against their range', async () => {
    const { store, instrumentId } = await storeWithInstrument();
    const r = await store.saveOwnReadingType({ ...emptyOwnTypeDraft(), label: 'Chiller water flow', unit: 'L/min', min: '0', max: '50', expectedLow: '4', expectedHigh: '6', pass: '5', borderline: '20' });
    expect(r.ok).toBe(true);
    if (!r.ok) return;
    expect(r.type.id).toBe('own-chiller-water-flow');
    const bad = await store.saveOwnReadingType({ ...emptyOwnTypeDraft(), label: 'x', unit: 'u', min: '5', max: '1' });
    expect(!bad.ok && bad.errors.max).toMatch(/must be above the lowest/);
    expect((await store.listReadingTypes()).some((t) => t.id === r.type.id)).toBe(true);
    const v = await store.saveVisit(visitFields(instrumentId));
    const rd = await store.addReading({ visitId: v.id, typeId: r.type.id, phase: 'as-found', value: 6.5, entered: { text: '6.5', unit: 'L/min' } });
    expect(rd.verdict).toBe('borderline');
    await expect(store.deleteOwnReadingType(r.type.id)).rejects.toThrow(/1 reading use/);
    store.close();
  });
});

describe('demo scenario', () => {
  it('loads invented visits and judged readings over about two years, and removes them again', async () => {
    const store = await openStore(freshName(), {}, { engine: testEngine });
    const own = (await (async () => {
      const v = validateDraft({ ...emptyDraft(), name: 'Real unit', rodFieldRadius: '4', rodLength: '150', rfFrequency: '1', maxRfAmplitude: '1500', axialEnergy: '5' });
      if (!v.ok) throw new Error('bad');
      return store.saveInstrument(v.fields);
    })());
    const realVisit = await store.saveVisit(visitFields(own.id));
    expect(await store.loadDemo()).toBe(true);
    expect(await store.db.count('visits')).toBe(demoVisits.length + 1);
    const readings = await store.db.getAll('readings');
    expect(readings.length).toBeGreaterThan(80);
    expect(new Set(readings.map((r) => r.id)).size).toBe(readings.length);
    expect(readings.every((r) => r.demo)).toBe(true);
    expect(readings.filter((r) => r.verdict).length).toBeGreaterThan(60);
    // Kestrel's multiplier voltage creeps up: the trend projects a date for the supply limit.
    const t = await store.trend('demo-gcms-kestrel', 'multiplier-voltage');
    expect(t.x.length).toBe(8);
    expect(t.projection?.limit).toBe(demoInstruments[0].multiplierVoltageLimit);
    expect(t.projection!.ratePerMonth).toBeGreaterThan(10);
    expect(t.projection!.reachesAt! > '2026-11-01').toBe(true);
    // The leak visit's as-found background shows the air signature (28:32 in the air band, argon agreeing).
    const leak = readings.find((r) => r.visitId === 'demo-visit-k6' && r.typeId === 'air-ratio-28-32' && r.phase === 'as-found');
    expect(leak?.verdict).toBe('fail');
    expect(leak?.expected?.basis).toBe('air signature');
    // After the vent, water against Kestrel's own baseline (8 % of m/z 69): 35 % fails, 14 % the next morning is borderline.
    const water = readings.filter((r) => r.visitId === 'demo-visit-k4' && r.typeId === 'water-18');
    expect(water.map((r) => [r.phase, r.verdict, r.expected?.basis])).toEqual(expect.arrayContaining([
      ['as-found', 'fail', 'baseline'], ['as-left', 'borderline', 'baseline'],
    ]));
    // No demo reading uses an earlier-design type, and no visit note carries markup.
    expect(readings.filter((r) => EARLIER_DESIGN_TYPES.includes(r.typeId))).toEqual([]);
    expect(demoVisits.filter((v) => /[<>]/.test(v.notes))).toEqual([]);
    expect(await store.removeDemo()).toBe(demoInstruments.length);
    expect((await store.listVisits()).map((v) => v.id)).toEqual([realVisit.id]);
    expect(await store.db.count('readings')).toBe(0);
    store.close();
  });
});

describe('drafts survive a reopen (reload mid-entry)', () => {
  it('keeps the reading form draft across closing and reopening the database', async () => {
    const name = freshName();
    const s1 = await openStore(name);
    await s1.putDraft('reading:visit-1', { typeId: 'vacuum-high', text: '1.2e-', unitId: 'Torr' });
    s1.close();
    const s2 = await openStore(name);
    expect(await s2.getDraft('reading:visit-1')).toEqual({ typeId: 'vacuum-high', text: '1.2e-', unitId: 'Torr' });
    s2.close();
  });
});

describe('CSV export', () => {
  it('quotes per RFC 4180 and defuses formulas (OWASP CSV injection)', () => {
    expect(csvCell('plain')).toBe('plain');
    expect(csvCell('a,b')).toBe('"a,b"');
    expect(csvCell('say "hi"')).toBe('"say ""hi"""');
    expect(csvCell('two\nlines')).toBe('"two\nlines"');
    expect(csvCell('=HYPERLINK("x")')).toBe(`"'=HYPERLINK(""x"")"`);
    expect(csvCell('+1')).toBe("'+1");
    expect(csvCell('-2')).toBe("'-2");
    expect(csvCell('@SUM(A1)')).toBe("'@SUM(A1)");
    expect(csvCell(-2.5)).toBe('-2.5');
    expect(csvCell(null)).toBe('');
  });
  it('exports readings with a BOM, CRLF rows and one row per reading', async () => {
    const { store, instrumentId } = await storeWithInstrument();
    const v = await store.saveVisit(visitFields(instrumentId, undefined, { notes: 'n' }));
    const r = await addTyped(store, v.id, 'vacuum-high', 'as-found', '1.2e-5', 'Torr');
    await store.updateReading(r.id, { note: '=cmd|"/c calc"!A1, µ °' });
    const csv = await store.readingsCsv({ visitId: v.id });
    expect(csv.startsWith('\uFEFFInstrument,')).toBe(true);
    const rows = csv.slice(1).split('\r\n');
    expect(rows).toHaveLength(3);
    expect(rows[2]).toBe('');
    expect(rows[1]).toContain(`"'=cmd|""/c calc""!A1, µ °"`);
    expect(rows[1]).toContain('High vacuum (analyser),as-found,');
    store.close();
  });
});

describe('a corrected reading keeps its history', () => {
  it('an edit keeps the earlier value, unit, verdict and time; the history goes into the backup and the report', async () => {
    const { store, instrumentId } = await storeWithInstrument();
    const v = await store.saveVisit(visitFields(instrumentId));
    const r = await addTyped(store, v.id, 'vacuum-high', 'as-found', '2e-5', 'mbar');
    expect(r.history).toBeUndefined();
    // A context-only change is re-judged but adds no version.
    const same = await store.updateReading(r.id, { note: r.note });
    expect(same.history).toBeUndefined();
    const fixed = await store.updateReading(r.id, { value: 3e-3, entered: { text: '3e-5', unit: 'mbar' }, note: 'typed 2 for 3' });
    expect(fixed.history).toHaveLength(1);
    expect(fixed.history![0]).toMatchObject({ value: 2e-3, entered: { text: '2e-5', unit: 'mbar' }, recordedAt: r.takenAt, replacedAt: fixed.updatedAt });
    const again = await store.updateReading(r.id, { value: 3.1e-3, entered: { text: '3.1e-5', unit: 'mbar' } });
    expect(again.history!.map((h) => h.entered.text)).toEqual(['2e-5', '3e-5']);
    expect(again.history![1].recordedAt).toBe(fixed.updatedAt);
    // Backup: the history travels with the reading and comes back after an erase.
    const backup = await store.exportBackup();
    expect(JSON.parse(backup).data.readings.find((x: { id: string }) => x.id === r.id).history).toHaveLength(2);
    await store.eraseAll();
    const result = await store.importBackup(backup);
    expect(result).toMatchObject({ added: 3 });
    const back = (await store.listReadings(v.id)).find((x) => x.id === r.id)!;
    expect(back.history!.map((h) => h.entered.text)).toEqual(['2e-5', '3e-5']);
    // The printable record lists the earlier versions.
    const html = await store.visitReport(v.id);
    expect(html).toMatch(/Earlier: 2e-5 mbar[^<]*recorded [0-9-]+ [0-9:]+, replaced [0-9-]+ [0-9:]+; 3e-5 mbar[^<]*note “typed 2 for 3”/);
    store.close();
  });
  it('an old backup reading without history is still valid; a malformed history is refused by name', () => {
    const base = {
      id: 'r1', visitId: 'v1', instrumentId: 'i1', typeId: 'vacuum-high', phase: 'as-found', value: 2e-3,
      entered: { text: '2e-5', unit: 'mbar' }, note: '', takenAt: '2026-01-01T00:00:00.000Z', origin: 'entered',
    };
    expect(readingProblems('readings[0]', base)).toEqual([]);
    expect(readingProblems('readings[0]', { ...base, history: [{ value: 'x' }] }).join('\n')).toMatch(/readings\[0\]\.history\[0\]\.value/);
  });
});

describe('printable report', () => {
  it('shows notes with HTML as text, verdict words and symbols', async () => {
    const { store, instrumentId } = await storeWithInstrument();
    const v = await store.saveVisit(visitFields(instrumentId, undefined, { notes: '<script>alert(1)</script> & <b>bold</b>' }));
    await addTyped(store, v.id, 'multiplier-voltage', 'as-found', '5000', 'V');
    const html = await store.visitReport(v.id, new Date('2026-03-02T00:00:00Z'));
    expect(html).not.toContain('<script>');
    expect(html).toContain('&lt;script&gt;alert(1)&lt;/script&gt; &amp; &lt;b&gt;bold&lt;/b&gt;');
    expect(html).toContain('✗ fail');
    expect(html).toContain('@media print');
    store.close();
  });
});

describe('backup reminder', () => {
  const now = new Date('2026-06-01T00:00:00Z');
  it('is due after 30 days, or when there was never a backup, and says browsers may evict data', () => {
    expect(backupReminder('2026-05-10T00:00:00Z', now, true).due).toBe(false);
    const late = backupReminder('2026-04-01T00:00:00Z', now, true);
    expect(late.due).toBe(true);
    expect(late.daysSince).toBe(61);
    expect(late.message).toMatch(/61 days ago.*Browsers may delete/);
    expect(backupReminder(undefined, now, true).due).toBe(true);
    expect(backupReminder(undefined, now, false).due).toBe(false);
  });
  it('is recorded through the store', async () => {
    const { store } = await storeWithInstrument();
    expect((await store.backupStatus(now)).due).toBe(true);
    await store.noteBackupSaved(new Date('2026-05-31T00:00:00Z'));
    expect((await store.backupStatus(now)).due).toBe(false);
    store.close();
  });
});

describe('note this', () => {
  it('puts a value into the current visit, opening one when needed, converting catalogue units', async () => {
    const { store, instrumentId } = await storeWithInstrument();
    const instrument = (await store.getInstrument(instrumentId))!;
    const a = await store.noteReading(instrument, { typeId: 'rf-amplitude', label: 'Expected RF at m/z 502', value: 1468.3, unit: 'V peak-to-peak, one rod to ground', context: { mz: 502 }, origin: 'calculator' });
    expect(a.reading.value).toBeCloseTo(734.15, 6);
    expect(a.reading.origin).toBe('calculator');
    expect(a.reading.verdict).toBe('pass');
    expect(a.visit.reason).toBe('other');
    const b = await store.noteReading(instrument, { label: 'Stroke frequency', value: 2.5, unit: 'Hz', origin: 'calculator' });
    expect(b.visit.id).toBe(a.visit.id);
    expect(b.reading).toMatchObject({ typeId: 'noted-value', value: 2.5, context: { label: 'Stroke frequency', unit: 'Hz' } });
    expect(b.reading.verdict).toBeUndefined();
    await expect(store.noteReading(instrument, { label: 'x', value: Number.NaN, unit: 'V', origin: 'entered' })).rejects.toThrow(/not a finite number/);
    store.close();
  });

  it('understands the short unit forms and gas names other screens use', async () => {
    const { store, instrumentId } = await storeWithInstrument();
    const instrument = (await store.getInstrument(instrumentId))!;
    const pairs = await store.noteReading(instrument, { typeId: 'rf-amplitude', label: 'Expected RF at m/z 69 (peak-to-peak, between the pairs)', value: 403.6, unit: 'V p-p', context: { mz: 69, scanLine: 'apex' }, origin: 'calculator' });
    expect(pairs.reading.value).toBeCloseTo(100.9, 6);
    expect(pairs.reading.context).toMatchObject({ mz: 69, convention: 'V peak-to-peak, between the rod pairs', scanLine: 'apex' });
    const measured = await store.noteReading(instrument, { typeId: 'rf-amplitude', label: 'Measured RF as zero-to-peak per rod', value: 100.5, unit: 'V', context: { convention: 'zero-to-peak, one rod to ground', mz: 69 }, origin: 'entered' });
    expect(measured.reading.value).toBe(100.5);
    const he = await store.noteReading(instrument, { typeId: 'analyser-pressure', label: 'True He pressure from ion-gauge reading', value: 8.3e-5, unit: 'mbar', context: { gaugeGas: 'He', reading: '1.5e-5 mbar' }, origin: 'calculator' });
    expect(he.reading).toMatchObject({ typeId: 'vacuum-high', context: { gaugeGas: 'He' } });
    expect(he.reading.value).toBeCloseTo(8.3e-3, 12);
    // The generic range assumes an N2-equivalent reading, so a helium-corrected pressure is not judged by it.
    expect(he.reading.verdict).toBeUndefined();
    const n2 = await store.noteReading(instrument, { typeId: 'analyser-pressure', label: 'N2 reading', value: 1.5e-5, unit: 'Torr', context: { gaugeGas: 'N2' }, origin: 'entered' });
    expect(n2.reading).toMatchObject({ context: { gaugeGas: 'N2-equivalent' }, verdict: 'pass', expected: { basis: 'generic' } });
    store.close();
  });
});

describe('maker’s limits for an instrument', () => {
  it('replace the generic range, and beat a baseline pass when the reading is outside them', async () => {
    const { store, instrumentId } = await storeWithInstrument();
    const bad = await store.saveMakerLimit(instrumentId, { typeId: 'multiplier-voltage', unitId: 'kV', low: '', high: '9', source: '' });
    expect(bad.ok).toBe(false);
    if (!bad.ok) {
      expect(bad.errors.high).toMatch(/Highest allowed 9 kV is out of range: enter a value between 0 and 6 kV/);
      expect(bad.errors.source).toMatch(/Source is empty/);
    }
    const ok = await store.saveMakerLimit(instrumentId, { typeId: 'multiplier-voltage', unitId: 'kV', low: '', high: '3', source: 'maker’s detector specification (invented for this test)' });
    expect(ok.ok && ok.limit).toEqual({ typeId: 'multiplier-voltage', high: 3000, source: 'maker’s detector specification (invented for this test)' });
    expect(await store.listMakerLimits(instrumentId)).toHaveLength(1);

    const first = await store.saveVisit(visitFields(instrumentId, '2025-01-01T09:00:00.000Z'));
    const r1 = await addTyped(store, first.id, 'multiplier-voltage', 'as-left', '2900', 'V');
    // No baseline yet: the maker's limit replaces the generic 1000–3000 V range.
    expect(r1.expected).toMatchObject({ basis: 'maker limit', high: 3000 });
    expect(r1.verdict).toBe('pass');
    await store.markBaseline(first.id);
    const later = await store.saveVisit(visitFields(instrumentId, '2026-01-01T09:00:00.000Z'));
    // +6.9 % is a pass against the baseline, but above the maker's 3000 V: the worse verdict wins.
    const r2 = await addTyped(store, later.id, 'multiplier-voltage', 'as-found', '3100', 'V');
    expect(r2.expected?.basis).toBe('maker limit');
    expect(r2.verdict).toBe('fail');
    const r3 = await addTyped(store, later.id, 'multiplier-voltage', 'as-found', '2950', 'V');
    expect(r3.expected?.basis).toBe('baseline');
    expect(r3.verdict).toBe('pass');
    await store.deleteMakerLimit(instrumentId, 'multiplier-voltage');
    expect(await store.listMakerLimits(instrumentId)).toEqual([]);
    store.close();
  });
});
